/** Weights and Measures Act 1985, Schedule 1: 1 gallon = 4.54609 cubic decimetres, exactly. */
export const LITRES_PER_IMPERIAL_GALLON = 4.54609;

export function litresToImperialGallons(litres: number): number {
  return litres / LITRES_PER_IMPERIAL_GALLON;
}

export function imperialGallonsToLitres(gallons: number): number {
  return gallons * LITRES_PER_IMPERIAL_GALLON;
}

export type PackUnit = 'ml' | 'l';

/** Pack sizes are kept in whole millilitres so 500 ml and 0.5 L are the same pack. */
export function packSizeMl(size: number, unit: PackUnit): number {
  return Math.round(unit === 'l' ? size * 1000 : size);
}

/** How a pack is written: 1000 ml or more in whole tenths of a litre in litres, anything else in millilitres. */
export function packSizeInUnit(ml: number): { size: number; unit: PackUnit } {
  return ml >= 1000 && ml % 100 === 0 ? { size: ml / 1000, unit: 'l' } : { size: ml, unit: 'ml' };
}

export function formatPackSize(ml: number): string {
  const { size, unit } = packSizeInUnit(ml);
  return unit === 'l' ? `${size} L` : `${size} ml`;
}

/** A count of packs with the pack's size: "3 packs of 1 L", "1 pack of 500 ml". */
export function formatPacks(n: number, packSizeMl: number): string {
  return `${n} pack${n === 1 || n === -1 ? '' : 's'} of ${formatPackSize(packSizeMl)}`;
}

/** Whole pence as pounds with two decimals, for a CSV cell ("12.50"); the sign kept. */
export function penceToPounds(pence: number): string {
  const sign = pence < 0 ? '-' : '';
  const abs = Math.abs(Math.round(pence));
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}
