import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { calendarDateIn, weekStartOf } from '@heatfleet/domain';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { setUpJobSheet } from './support/job-sheet-setup.ts';
import { seedFirm } from './support/seed-firm.ts';

// HSE's points system (L140 and INDG175, from memory): points = 2 x a² x hours, so a 10 m/s² tool for 30 minutes
// is 100 points, the exposure action value (2.5 m/s² A(8)); 400 points is the exposure limit value (5 m/s² A(8)),
// Control of Vibration at Work Regulations 2005. Health surveillance for those likely to be exposed at or above the
// action value (regulation 7).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

type Row = { memberId: number; name: string; surveillance: string; daysOverAction: number; highestDayPoints: number };

describe('hand-arm vibration register', () => {
  it('an agitation recorded on a job sheet reaches the owner’s register, and 100 points flags surveillance', async () => {
    const s = await setUpJobSheet(t, 'havreg');
    // 10 m/s² for 30 minutes = 100 points, recorded through the job sheet as the engineer does it.
    const put = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, {
      minutes: 30,
      kitItemId: s.toolId,
    });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const today = calendarDateIn(t.clock.now(), 'Europe/London');
    // A second engineer with 500 points a day last week (10 m/s² for 2.5 hours), written straight to the table.
    const lastWeek = new Date(Date.parse(`${weekStartOf(today)}T12:00:00Z`) - 4 * 86_400_000)
      .toISOString()
      .slice(0, 10);
    await t.deps.db('job_agitations').insert({
      firm_id: s.firm.firmId,
      job_id: s.jobId,
      radiator_index: 1,
      minutes: 150,
      magnitude_ms2: 10,
      engineer_member_id: s.firm.target.memberId,
      recorded_on: lastWeek,
      recorded_by_user_id: s.firm.people.engineer.userId,
      recorded_at: new Date(),
    });
    const owner = await signIn(t.app, s.firm.people.owner.email);
    const res = await owner.get('/api/vibration/register?weeks=2');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.weekStarts).toHaveLength(2);
    expect(res.body.to >= today).toBe(true);
    const rows = res.body.engineers as Row[];
    expect(rows.map((r) => [r.memberId, r.surveillance, r.daysOverAction, r.highestDayPoints])).toEqual([
      [s.firm.target.memberId, 'over_limit', 1, 500],
      [s.firm.people.engineer.memberId, 'needed', 1, 100],
    ]);
    const engineerRow = res.body.engineers[1];
    expect(engineerRow.weeks[1].days).toEqual([{ day: today, points: 100 }]);
    // One week back from today's week leaves last week's 500 points out.
    const thisWeek = await owner.get(`/api/vibration/register?weeks=1&to=${today}`).expect(200);
    expect(thisWeek.body.engineers.find((r: Row) => r.memberId === s.firm.target.memberId)).toMatchObject({
      surveillance: 'not_indicated',
      highestDayPoints: 0,
    });
  });

  it('is for the Owner and Admin only; another firm sees none of it; bad weeks are refused in words', async () => {
    const s = await setUpJobSheet(t, 'havroles');
    await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 30, kitItemId: s.toolId });
    for (const role of ['admin', 'stores', 'engineer'] as const) {
      const client = await signIn(t.app, s.firm.people[role].email);
      expect((await client.get('/api/vibration/register')).status, role).toBe(role === 'admin' ? 200 : 403);
    }
    const other = await seedFirm(t.deps.db, 'havother');
    const otherOwner = await signIn(t.app, other.people.owner.email);
    const theirs = await otherOwner.get('/api/vibration/register').expect(200);
    expect(theirs.body.engineers.map((r: Row) => r.memberId)).not.toContain(s.firm.people.engineer.memberId);
    expect(theirs.body.engineers.every((r: Row) => r.highestDayPoints === 0)).toBe(true);
    const owner = await signIn(t.app, s.firm.people.owner.email);
    const bad = await owner.get('/api/vibration/register?weeks=0');
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toContain('Show at least 1 week.');
  });
});
