import type { ItemKindInput } from './kit-schemas.ts';

/**
 * The kinds every new firm starts with, editable afterwards. The intervals are common practice
 * (no source): the firm sets its own, and manufacturers' instructions come first.
 */
export const defaultItemKinds: ItemKindInput[] = [
  {
    name: 'Filtration rig',
    intervalDays: 90,
    intervalUses: null,
    dueSoonDays: 14,
    overduePolicy: 'allow_with_reason',
    electrical: true,
  },
  {
    name: 'Magnet set',
    intervalDays: null,
    intervalUses: 1,
    dueSoonDays: 0,
    overduePolicy: 'allow_with_reason',
    electrical: false,
  },
  {
    name: 'Hose set',
    intervalDays: 180,
    intervalUses: 25,
    dueSoonDays: 14,
    overduePolicy: 'allow_with_reason',
    electrical: false,
  },
  {
    name: 'Manifold and connectors',
    intervalDays: 180,
    intervalUses: null,
    dueSoonDays: 14,
    overduePolicy: 'allow_with_reason',
    electrical: false,
  },
  {
    name: 'Agitator head',
    intervalDays: 90,
    intervalUses: null,
    dueSoonDays: 14,
    overduePolicy: 'block',
    electrical: true,
  },
  {
    name: 'Thermal camera',
    intervalDays: 365,
    intervalUses: null,
    dueSoonDays: 30,
    overduePolicy: 'allow_with_reason',
    electrical: false,
  },
  {
    name: 'Drain hose',
    intervalDays: 180,
    intervalUses: 30,
    dueSoonDays: 14,
    overduePolicy: 'allow_with_reason',
    electrical: false,
  },
  {
    name: 'Flushing pump',
    intervalDays: 90,
    intervalUses: null,
    dueSoonDays: 14,
    overduePolicy: 'block',
    electrical: true,
  },
];
