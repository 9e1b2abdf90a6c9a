import type { Knex } from 'knex';
import { addDays, calendarDateIn } from '@heatfleet/domain';

type Trx = Knex.Transaction;

// A few invented customers and booked visits, so the jobs list and a plan have something to show.
export async function seedDemoJobs(trx: Trx, firmIds: { brackenford: number; tarnside: number }, now: Date): Promise<void> {
  const today = calendarDateIn(now, 'Europe/London');
  const firmId = firmIds.brackenford;
  const engineer = (await trx('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.firm_id': firmId, 'u.email': 'engineer@brackenford.example' }).first('m.id')) as { id: number };
  const van = (await trx('locations').where({ firm_id: firmId, engineer_member_id: engineer.id }).first('id')) as { id: number };
  const products = (await trx('products').where({ firm_id: firmId }).whereIn('name', ['HFL System Cleaner', 'HFL Inhibitor']).select('id')) as { id: number }[];
  const visits = [
    { name: 'Odile Farrant', address: '14 Weir Cottages, Brackenford BF2 4LN', in: 2, rads: 9 },
    { name: 'Harlan Strood', address: '3 Sluice Row, Brackenford BF1 8QD', in: 5, rads: 14 },
    { name: 'Tamsin Vell', address: 'Flat 2, 40 Mill Hill, Brackenford BF3 1AX', in: 9, rads: 6 },
  ];
  for (const v of visits) {
    const [customerId] = (await trx('customers').insert({ firm_id: firmId, name: v.name, email: `${v.name.split(' ')[0]!.toLowerCase()}@customer.example` })) as number[];
    const [siteId] = (await trx('sites').insert({ firm_id: firmId, customer_id: customerId, address: v.address, access_notes: 'Ring ahead; parking on the street.' })) as number[];
    const survey = {
      systemType: 'sealed', boilerKind: 'combi', fuel: 'gas',
      radiators: Array.from({ length: v.rads }, (_, i) => ({ room: `Room ${i + 1}`, panel: i % 3 === 0 ? 'double' : 'single' })),
      pipeRuns: [],
    };
    const [jobId] = (await trx('jobs').insert({ firm_id: firmId, site_id: siteId, engineer_member_id: engineer.id, van_location_id: van.id, scheduled_on: addDays(today, v.in), survey: JSON.stringify(survey) })) as number[];
    await trx('job_products').insert(products.map((p) => ({ firm_id: firmId, job_id: jobId, product_id: p.id })));
  }
}
