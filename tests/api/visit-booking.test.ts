import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const survey = {
  systemType: 'open_vented',
  boilerKind: 'regular',
  fuel: 'oil',
  radiators: [
    { room: 'Lounge', panel: 'double' },
    { room: 'Hall', panel: 'single' },
  ],
  pipeRuns: [],
};

describe('a booked job can be edited, rescheduled and cancelled', () => {
  it('edit: survey, date, engineer, visit kind and system details; a field left out stays', async () => {
    const firm = await seedFirm(t.deps.db, 'edit');
    const office = await signIn(t.app, firm.people.admin.email);
    const booked = await office.post('/api/jobs', {
      siteId: firm.siteId,
      scheduledOn: '2026-12-15',
      engineerMemberId: firm.people.engineer.memberId,
      productIds: [firm.product.id],
      survey,
      systemDetails: {
        boilerMake: 'Example Boilers',
        boilerModel: 'FS 26',
        boilerLocation: 'Kitchen',
        magneticFilterFitted: false,
      },
    });
    expect(booked.status).toBe(201);
    const id = booked.body.job.id as number;
    expect(booked.body.job).toMatchObject({
      visitKind: 'full_clean',
      engineerName: expect.stringContaining('engineer'),
      systemDetails: {
        boilerMake: 'Example Boilers',
        boilerModel: 'FS 26',
        boilerLocation: 'Kitchen',
        magneticFilterFitted: false,
        cisternCondition: null,
      },
    });

    const moved = await office.patch(`/api/jobs/${id}`, { scheduledOn: '2026-12-18' });
    expect(moved.status).toBe(200);
    expect(moved.body.job).toMatchObject({
      scheduledOn: '2026-12-18',
      engineerMemberId: firm.people.engineer.memberId,
      vanLocationId: firm.van.id,
    });
    expect(moved.body.survey.radiators).toHaveLength(2);

    const more = await office.patch(`/api/jobs/${id}`, {
      survey: { ...survey, radiators: [...survey.radiators, { room: 'Bedroom', panel: 'double' }] },
      visitKind: 'inhibitor_only',
      systemDetails: { cisternCondition: 'dirty_cleaned', magneticFilterFitted: true },
    });
    expect(more.status).toBe(200);
    expect(more.body.survey.radiators).toHaveLength(3);
    expect(more.body.job.visitKind).toBe('inhibitor_only');
    expect(more.body.job.systemDetails).toEqual({
      boilerMake: 'Example Boilers',
      boilerModel: 'FS 26',
      boilerLocation: 'Kitchen',
      magneticFilterFitted: true,
      cisternCondition: 'dirty_cleaned',
    });
    expect(more.body.job.scheduledOn).toBe('2026-12-18');

    // A sealed system has no cistern: its condition is refused in plain words.
    const sealed = await office.patch(`/api/jobs/${id}`, { survey: { ...survey, systemType: 'sealed' } });
    expect(sealed.status).toBe(400);
    expect(sealed.body.message).toContain('sealed system has no feed-and-expansion cistern');

    // The engineer named must be an active engineer, as at booking.
    const notEngineer = await office.patch(`/api/jobs/${id}`, { engineerMemberId: firm.people.stores.memberId });
    expect(notEngineer.status).toBe(400);
    const unassigned = await office.patch(`/api/jobs/${id}`, { engineerMemberId: null });
    expect(unassigned.body.job).toMatchObject({ engineerMemberId: null, vanLocationId: null, engineerName: null });

    expect((await office.patch(`/api/jobs/${id}`, {})).status).toBe(422);
  });

  it('a survey edit that drops radiators with records on the sheet is refused; an engineer may not give their job to someone else', async () => {
    const firm = await seedFirm(t.deps.db, 'edit-guard');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const id = (await engineer.post('/api/jobs', { siteId: firm.siteId, scheduledOn: '2026-12-15', survey })).body.job
      .id as number;
    await engineer.put(`/api/jobs/${id}/radiators/1/readings/before`, { topC: 60, bottomC: 40 });
    const dropped = await engineer.patch(`/api/jobs/${id}`, {
      survey: { ...survey, radiators: [survey.radiators[0]] },
    });
    expect(dropped.status).toBe(400);
    expect(dropped.body.message).toBe(
      'Radiator 2 already has records on the sheet: keep at least 2 radiators in the survey.',
    );
    const handedOn = await engineer.patch(`/api/jobs/${id}`, { engineerMemberId: firm.target.memberId });
    expect(handedOn.status).toBe(403);
    const other = await signIn(t.app, firm.target.email);
    expect((await other.patch(`/api/jobs/${id}`, { scheduledOn: '2026-12-19' })).status).toBe(403);
  });

  it('cancel with a reason: the job says who, when and why; sent again it changes nothing; its sheet and completion are closed', async () => {
    const firm = await seedFirm(t.deps.db, 'cancel');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    expect((await engineer.post(`/api/jobs/${firm.jobId}/cancel`, { reason: '' })).status).toBe(422);
    const cancelled = await engineer.post(`/api/jobs/${firm.jobId}/cancel`, {
      reason: 'Customer moving house; will rebook',
    });
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.job).toMatchObject({
      status: 'cancelled',
      cancellation: {
        reason: 'Customer moving house; will rebook',
        byName: expect.stringContaining('engineer'),
        at: expect.any(String),
      },
    });
    expect(cancelled.body.sheet.editable).toBe(false);
    const again = await engineer.post(`/api/jobs/${firm.jobId}/cancel`, { reason: 'Another reason' });
    expect(again.status).toBe(200);
    expect(again.body.job.cancellation).toEqual(cancelled.body.job.cancellation);
    const note = await engineer.put(`/api/jobs/${firm.jobId}/notes`, { notes: 'late' });
    expect(note.status).toBe(409);
    expect(note.body.message).toBe('This job was cancelled; its record can no longer change.');
    expect((await engineer.patch(`/api/jobs/${firm.jobId}`, { scheduledOn: '2026-12-20' })).status).toBe(409);
    expect((await engineer.post(`/api/jobs/${firm.jobId}/complete`, {})).status).toBe(409);
    expect(await t.deps.db('stock_movements').where({ firm_id: firm.firmId, job_id: firm.jobId })).toHaveLength(0);
  });

  it('a completed job cannot be cancelled or edited', async () => {
    const firm = await seedFirm(t.deps.db, 'cancel-done');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const reasons = ['no_water_test', 'after_readings_missing', 'flush_ticks_missing'].map((code) => ({
      code,
      reason: 'Seeded job',
    }));
    expect((await engineer.post(`/api/jobs/${firm.jobId}/complete`, { confirmations: reasons })).status).toBe(200);
    expect((await engineer.post(`/api/jobs/${firm.jobId}/cancel`, { reason: 'Too late' })).status).toBe(409);
    expect((await engineer.patch(`/api/jobs/${firm.jobId}`, { scheduledOn: '2026-12-20' })).status).toBe(409);
  });
});

describe('a visit\u2019s time of day', () => {
  it('is optional at booking, kept, changed by a reschedule, shown in the list, and refused when not a time', async () => {
    const firm = await seedFirm(t.deps.db, 'time');
    const office = await signIn(t.app, firm.people.admin.email);
    const untimed = await office.post('/api/jobs', { siteId: firm.siteId, scheduledOn: '2026-12-21', survey });
    expect(untimed.status).toBe(201);
    expect(untimed.body.job.scheduledTime).toBeNull();
    const booked = await office.post('/api/jobs', {
      siteId: firm.siteId,
      scheduledOn: '2026-12-21',
      scheduledTime: '08:30',
      survey,
    });
    expect(booked.status).toBe(201);
    expect(booked.body.job).toMatchObject({ scheduledOn: '2026-12-21', scheduledTime: '08:30' });
    const id = booked.body.job.id as number;
    const moved = await office.patch(`/api/jobs/${id}`, { scheduledTime: '13:15' });
    expect(moved.status).toBe(200);
    expect(moved.body.job).toMatchObject({ scheduledOn: '2026-12-21', scheduledTime: '13:15' });
    // On the same day, the timed visit comes before the one with no time.
    const list = await office.get('/api/jobs?sort=upcoming&from=2026-12-21&to=2026-12-21');
    const sameDay = (list.body.jobs as { id: number; scheduledTime: string | null }[]).map((j) => [
      j.id,
      j.scheduledTime,
    ]);
    expect(sameDay).toContainEqual([id, '13:15']);
    const order = sameDay.map(([jobId]) => jobId);
    expect(order.indexOf(id)).toBeLessThan(order.indexOf(untimed.body.job.id as number));
    for (const bad of ['25:00', '8.30', '12:60']) {
      const refused = await office.patch(`/api/jobs/${id}`, { scheduledTime: bad });
      expect(refused.status, bad).toBe(422);
      expect(refused.body.details[0].path).toBe('scheduledTime');
    }
    expect((await office.get(`/api/jobs/${id}`)).body.job.scheduledTime).toBe('13:15');
  });
});

describe('the jobs list where people need it', () => {
  it('filters by status, engineer and dates; upcoming first; each row has the engineer, the system and the radiators', async () => {
    const firm = await seedFirm(t.deps.db, 'list');
    const office = await signIn(t.app, firm.people.admin.email);
    const book = async (scheduledOn: string, engineerMemberId: number | null) =>
      (await office.post('/api/jobs', { siteId: firm.siteId, scheduledOn, engineerMemberId, survey })).body.job
        .id as number;
    const early = await book('2026-12-11', firm.people.engineer.memberId);
    const late = await book('2026-12-30', null);
    const cancelledId = await book('2026-12-12', firm.people.engineer.memberId);
    await office.post(`/api/jobs/${cancelledId}/cancel`, { reason: 'Rebooked' });
    const ids = async (query: string) =>
      ((await office.get(`/api/jobs${query}`).expect(200)).body.jobs as { id: number }[]).map((j) => j.id);

    // The seeded job is on 10 December, for the engineer.
    expect(await ids('?status=planned&sort=upcoming')).toEqual([firm.jobId, early, late]);
    expect(await ids('?status=cancelled')).toEqual([cancelledId]);
    expect(await ids(`?engineerMemberId=${firm.people.engineer.memberId}&status=planned`)).toEqual([early, firm.jobId]);
    expect(await ids('?from=2026-12-11&to=2026-12-12')).toEqual([cancelledId, early]);
    const upcoming = await ids('?sort=upcoming');
    expect(upcoming.slice(0, 3)).toEqual([firm.jobId, early, late]);
    const row = (await office.get(`/api/jobs?from=2026-12-11&to=2026-12-11`)).body.jobs[0];
    expect(row).toMatchObject({
      id: early,
      engineerMemberId: firm.people.engineer.memberId,
      engineerName: expect.stringContaining('engineer'),
      visitKind: 'full_clean',
      systemType: 'open_vented',
      radiatorCount: 2,
    });
    expect((await office.get('/api/jobs?status=lost')).status).toBe(422);
    expect((await office.get('/api/jobs?from=11-12-2026')).status).toBe(422);
  });
});

describe('the customer type-ahead', () => {
  it('finds by name, address or postcode (with or without its space), at most 10, names starting with the text first, with their sites', async () => {
    const firm = await seedFirm(t.deps.db, 'search');
    const office = await signIn(t.app, firm.people.admin.email);
    for (let i = 0; i < 12; i += 1)
      await office.post('/api/customers', { name: `Ashdown ${String(i).padStart(2, '0')}` });
    const withSite = await office.post('/api/customers', { name: 'Corrie Ashdown-Vale' });
    await office.post(`/api/customers/${withSite.body.customer.id}/sites`, {
      address: '7 Tannery Row, Brackenford',
      postcode: 'BF4 2QT',
    });
    const names = async (q: string) =>
      (
        (await office.get(`/api/customers?q=${encodeURIComponent(q)}`).expect(200)).body.customers as { name: string }[]
      ).map((c) => c.name);

    const ash = await names('Ashd');
    expect(ash).toHaveLength(10);
    expect(ash[0]).toBe('Ashdown 00');
    expect(await names('tannery')).toEqual(['Corrie Ashdown-Vale']);
    expect(await names('bf42q')).toEqual(['Corrie Ashdown-Vale']);
    expect(await names('BF4 2QT')).toEqual(['Corrie Ashdown-Vale']);
    const found = (await office.get('/api/customers?q=tannery')).body.customers[0];
    expect(found.sites).toEqual([
      expect.objectContaining({ address: '7 Tannery Row, Brackenford', postcode: 'BF4 2QT' }),
    ]);
    // Wildcards typed are taken literally.
    expect(await names('%')).toEqual([]);
    // Another firm's customers are never found.
    const other = await seedFirm(t.deps.db, 'search-other');
    const stranger = await signIn(t.app, other.people.admin.email);
    expect((await stranger.get('/api/customers?q=Ashdown')).body.customers).toEqual([]);
    // Without q, the whole list, each with their sites.
    const all = (await office.get('/api/customers').expect(200)).body.customers;
    expect(all.length).toBeGreaterThan(10);
    expect(all.every((c: { sites: unknown[] }) => Array.isArray(c.sites))).toBe(true);
  });
});

describe('another firm', () => {
  it('gets 404 from every new job route with this firm\u2019s job, and nothing changes', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-mine');
    const other = await seedFirm(t.deps.db, 'visit-theirs');
    const stranger = await signIn(t.app, other.people.owner.email);
    const id = firm.jobId;
    const png =
      'data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==';
    const answers = [
      await stranger.patch(`/api/jobs/${id}`, { scheduledOn: '2026-12-20' }),
      await stranger.post(`/api/jobs/${id}/cancel`, { reason: 'Not mine' }),
      await stranger.put(`/api/jobs/${id}/flush-order`, { radiatorIndexes: [0] }),
      await stranger.post(`/api/jobs/${id}/signatures`, {
        kind: 'acknowledgement',
        name: 'Someone',
        imagePngDataUrl: png,
      }),
      await stranger.get(`/api/jobs/${id}/signatures/acknowledgement`),
      await stranger.post(`/api/jobs/${id}/complete`, {
        confirmations: [{ code: 'no_water_test', reason: 'Not mine' }],
      }),
    ];
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404]);
    const job = await t.deps.db('jobs').where({ id }).first('status', 'scheduled_on');
    expect(job).toEqual({ status: 'planned', scheduled_on: '2026-12-10' });
    expect(await t.deps.db('job_signatures').where({ job_id: id })).toHaveLength(0);
  });
});
