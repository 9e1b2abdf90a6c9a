import type { Knex } from 'knex';
import { DEFAULT_TIME_ZONE, type Role } from '@heatfleet/domain';
import { hashPassword } from '../modules/auth/password.ts';
import { setUpNewFirm } from '../modules/firms/firm-dal.ts';
import { seedDemoFleet } from './seed-demo-fleet.ts';
import { seedDemoJobs } from './seed-demo-jobs.ts';
import { seedDemoStock } from './seed-demo-stock.ts';

// Invented firms and people for the demo; no real person, place or firm.
export const DEMO_PASSWORD = 'heatfleet-demo-2026';

interface DemoPerson {
  email: string;
  name: string;
  roles: { firm: 'brackenford' | 'tarnside'; role: Role }[];
}

const demoFirms = {
  brackenford: { name: 'Brackenford Heating Co.', address: 'Unit 4, Millrace Yard, Brackenford BF3 7QT' },
  tarnside: { name: 'Tarnside Plumbing', address: '12 Fellgate Row, Tarnside TS9 2LW' },
} as const;

const demoPeople: DemoPerson[] = [
  { email: 'owner@brackenford.example', name: 'Maren Oakley', roles: [{ firm: 'brackenford', role: 'owner' }] },
  { email: 'admin@brackenford.example', name: 'Priya Halloran', roles: [{ firm: 'brackenford', role: 'admin' }] },
  { email: 'stores@brackenford.example', name: 'Wes Tillbury', roles: [{ firm: 'brackenford', role: 'stores' }] },
  { email: 'engineer@brackenford.example', name: 'Jory Pennock', roles: [{ firm: 'brackenford', role: 'engineer' }] },
  {
    email: 'aled.fenwright@brackenford.example',
    name: 'Aled Fenwright',
    roles: [{ firm: 'brackenford', role: 'engineer' }],
  },
  {
    email: 'kit.marrable@brackenford.example',
    name: 'Kit Marrable',
    roles: [{ firm: 'brackenford', role: 'engineer' }],
  },
  {
    email: 'sol.haverick@brackenford.example',
    name: 'Sol Haverick',
    roles: [{ firm: 'brackenford', role: 'engineer' }],
  },
  { email: 'owner@tarnside.example', name: 'Bryony Castell', roles: [{ firm: 'tarnside', role: 'owner' }] },
  { email: 'ned.quarrie@tarnside.example', name: 'Ned Quarrie', roles: [{ firm: 'tarnside', role: 'engineer' }] },
  {
    email: 'multi@heatfleet.example',
    name: 'Ilse Moorcroft',
    roles: [
      { firm: 'brackenford', role: 'engineer' },
      { firm: 'tarnside', role: 'engineer' },
    ],
  },
];

/** Seeds the two demo firms once; a second run finds them and changes nothing. */
export async function seedDemoFirms(db: Knex, now = new Date()): Promise<'seeded' | 'already-seeded'> {
  const existing = await db('firms').where({ name: demoFirms.brackenford.name }).first('id');
  if (existing) return 'already-seeded';
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (trx) => {
    const firmIds: Record<keyof typeof demoFirms, number> = { brackenford: 0, tarnside: 0 };
    for (const key of Object.keys(demoFirms) as (keyof typeof demoFirms)[]) {
      const [id] = await trx('firms').insert({
        name: demoFirms[key].name,
        address: demoFirms[key].address,
        time_zone: DEFAULT_TIME_ZONE,
      });
      firmIds[key] = id as number;
      await setUpNewFirm(trx, id as number);
    }
    for (const person of demoPeople) {
      const [userId] = await trx('users').insert({
        email: person.email,
        name: person.name,
        password_hash: passwordHash,
      });
      for (const { firm, role } of person.roles) {
        await trx('memberships').insert({ firm_id: firmIds[firm], user_id: userId, role, active: true });
      }
    }
    await seedDemoFleet(trx, firmIds, now);
    await seedDemoStock(trx, firmIds, now);
    await seedDemoJobs(trx, firmIds, now);
  });
  return 'seeded';
}
