import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

type Step = { step: string; label: string; cautions: { key: string; text: string }[] };
type Sheet = { steps: Step[]; cautions: { key: string; text: string }[]; visitKind: string };

const survey = (systemType: string, fuel: string, boilerKind = 'regular') => ({
  systemType,
  boilerKind,
  fuel,
  radiators: [
    { room: 'Lounge', panel: 'double' },
    { room: 'Hall', panel: 'single' },
  ],
  pipeRuns: [],
});

async function book(firm: SeededFirm, body: Record<string, unknown>) {
  const engineer = await signIn(t.app, firm.people.engineer.email);
  const res = await engineer.post('/api/jobs', {
    siteId: firm.siteId,
    scheduledOn: '2026-12-15',
    productIds: [firm.product.id],
    ...body,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return {
    engineer,
    job: res.body as {
      job: { id: number; visitKind: string };
      sheet: Sheet;
      volume: Record<string, unknown>;
      doses: { litres: number | null }[];
    },
  };
}

const words = (sheet: Sheet) =>
  [
    ...sheet.steps.flatMap((s) => [s.label, ...s.cautions.map((c) => c.text)]),
    ...sheet.cautions.map((c) => c.text),
  ].join(' ');

describe('the sheet\u2019s steps fit the system, the fuel and the visit', () => {
  it('open-vented on oil: the feed-and-expansion cistern, refill and vent from it, never pressurise, and the competent registered person caution, never the gas one', async () => {
    // Oil: competent person schemes under the Building Regulations 2010 (Schedule 3). Cistern and "never pressurise": common practice (no source).
    const firm = await seedFirm(t.deps.db, 'visit-ov-oil');
    const { job } = await book(firm, { survey: survey('open_vented', 'oil') });
    const sheet = job.sheet;
    expect(sheet.visitKind).toBe('full_clean');
    const keys = sheet.steps.map((s) => s.step);
    expect(keys).toEqual([
      'isolate_connect',
      'check_cistern',
      'latch_zone_valves',
      'dose_cleaner',
      'circulate_hot',
      'agitate',
      'flush',
      'dose_inhibitor',
      'reinstate',
    ]);
    expect(sheet.steps.find((s) => s.step === 'reinstate')!.label).toContain(
      'refill from the feed-and-expansion cistern, vent',
    );
    expect(words(sheet)).not.toMatch(/gas/i);
    expect(words(sheet)).not.toMatch(/filling loop|depressuris/i);
    // The only "pressurise" is the warning never to.
    expect(words(sheet)).toContain('never pressurise it');
    expect(words(sheet).replaceAll('never pressurise it', '')).not.toMatch(/pressuris/i);
    expect(sheet.cautions.map((c) => c.key)).toContain('oil_competent');
    expect(sheet.steps[0]!.cautions.map((c) => c.key)).toEqual(['electrical', 'oil_competent', 'hot_water']);
  });

  it('sealed on gas: depressurise, the expansion vessel, refill through the filling loop to the cold fill pressure; the Gas Safe Register caution', async () => {
    // Gas: Gas Safety (Installation and Use) Regulations 1998, regulation 3. Cold fill about 1 to 1.5 bar from the boiler's instructions: common practice (no source).
    const firm = await seedFirm(t.deps.db, 'visit-sealed-gas');
    const { job } = await book(firm, { survey: survey('sealed', 'gas', 'combi') });
    const keys = job.sheet.steps.map((s) => s.step);
    expect(keys.slice(0, 3)).toEqual(['depressurise', 'check_expansion_vessel', 'isolate_connect']);
    expect(keys).toContain('latch_zone_valves');
    expect(keys).not.toContain('check_cistern');
    expect(job.sheet.steps.find((s) => s.step === 'reinstate')!.label).toMatch(
      /filling loop to the cold fill pressure \(about 1 to 1\.5 bar/,
    );
    expect(job.sheet.steps[0]!.cautions.find((c) => c.key === 'gas_safe')!.text).toContain('Gas Safe Register');
    expect(words(job.sheet)).not.toMatch(/cistern/i);
    expect(job.sheet.cautions.map((c) => c.key)).toEqual([
      'hot_water',
      'electrical',
      'gas_safe',
      'chemicals',
      'drain',
      'sealed_pressure',
      'judgement',
    ]);
  });

  it('another fuel gets the competent registered person caution for that fuel, not the gas one', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-other-fuel');
    const { job } = await book(firm, { survey: survey('sealed', 'other', 'system') });
    expect(job.sheet.cautions.map((c) => c.key)).toContain('other_fuel_competent');
    expect(words(job.sheet)).not.toMatch(/gas/i);
  });

  it('an inhibitor-only visit: dose, circulate, test; no cleaner, agitation or flush; a step of the full clean is refused', async () => {
    // BS 7593 as commonly quoted: the inhibitor dosed, circulated, and its level tested.
    const firm = await seedFirm(t.deps.db, 'visit-inhibitor');
    const { engineer, job } = await book(firm, { survey: survey('open_vented', 'gas'), visitKind: 'inhibitor_only' });
    expect(job.job.visitKind).toBe('inhibitor_only');
    expect(job.sheet.steps.map((s) => s.step)).toEqual(['dose_inhibitor', 'circulate_inhibitor', 'test_water']);
    expect(job.sheet.cautions.map((c) => c.key)).not.toContain('drain');
    const refused = await engineer.put(`/api/jobs/${job.job.id}/steps/flush`, { done: true });
    expect(refused.status).toBe(422);
    expect(refused.body.message).toContain('not part of this visit');
    expect((await engineer.put(`/api/jobs/${job.job.id}/steps/test_water`, { done: true })).status).toBe(200);
  });
});

describe('the survey\u2019s defaults follow the system', () => {
  it('heat exchanger by boiler kind and fuel (from memory), the firm\u2019s own once set; the volume "Estimated" or "Calculated from the survey", never measured; dose litres to two decimals', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-defaults');
    const gas = await book(firm, { survey: survey('sealed', 'gas', 'combi') });
    // About 1 L in a gas combi (from memory).
    expect(gas.job.volume).toMatchObject({ heatExchangerLitres: 1, heatExchangerFrom: 'default', label: 'Estimated' });
    const oil = await book(firm, { survey: survey('open_vented', 'oil', 'regular') });
    // A floor-standing oil boiler often holds 10 to 25 L (from memory): 15 L by default.
    expect(oil.job.volume).toMatchObject({ heatExchangerLitres: 15, heatExchangerFrom: 'default' });
    expect(String(oil.job.volume.howReached)).toMatch(/^Estimated/);

    const owner = await signIn(t.app, firm.people.owner.email);
    const settings = (await owner.get('/api/firm').expect(200)).body.firm;
    expect(settings).toMatchObject({
      heatExchangerDefaultsOwn: false,
      heatExchangerDefaults: { gas: { combi: 1 }, oil: { regular: 15 } },
    });
    const own = { ...settings.heatExchangerDefaults, oil: { combi: 9, system: 11, regular: 22 } };
    const saved = await owner.put('/api/firm', {
      name: settings.name,
      timeZone: 'Europe/London',
      volumeUnit: 'litres',
      coldBottomThresholdK: 10,
      heatExchangerDefaults: own,
    });
    expect(saved.status).toBe(200);
    expect(saved.body.firm).toMatchObject({
      heatExchangerDefaultsOwn: true,
      heatExchangerDefaults: { oil: { regular: 22 } },
    });
    const reread = await owner.get(`/api/jobs/${oil.job.job.id}`).expect(200);
    expect(reread.body.volume.heatExchangerLitres).toBe(22);

    const measured = await book(firm, {
      survey: {
        ...survey('sealed', 'gas', 'combi'),
        heatExchangerLitres: 1.5,
        radiators: [{ room: 'Lounge', panel: 'double', heightMm: 600, lengthMm: 1234 }],
        pipeRuns: [{ tube: '15', lengthM: 13 }],
      },
    });
    expect(measured.job.volume).toMatchObject({ label: 'Calculated from the survey', heatExchangerFrom: 'survey' });
    expect(JSON.stringify(measured.job.volume)).not.toMatch(/measured/i);
    // 6 x 1.234 = 7.404 L of radiator, 13 x 0.14527 = 1.8885 L of pipe (EN 1057), 1.5 L boiler: 10.79 L at 1 L/100 L = 0.1079 L, shown as 0.11.
    expect(measured.job.doses[0]!.litres).toBe(0.11);
  });
});

describe('firm settings carry the report\u2019s contact details', () => {
  it('phone, e-mail and registration numbers are saved and read back; a field left out stays; bad ones are refused in plain words', async () => {
    const firm = await seedFirm(t.deps.db, 'visit-firm-contact');
    const owner = await signIn(t.app, firm.people.owner.email);
    const base = { name: 'Example Heating', timeZone: 'Europe/London', volumeUnit: 'litres', coldBottomThresholdK: 10 };
    const saved = await owner.put('/api/firm', {
      ...base,
      phone: '01632 960 123',
      email: 'Office@Example.test',
      registrationNumbers: 'Trade scheme 123456',
    });
    expect(saved.status).toBe(200);
    expect(saved.body.firm).toMatchObject({
      phone: '01632 960 123',
      email: 'office@example.test',
      registrationNumbers: 'Trade scheme 123456',
    });
    const again = await owner.put('/api/firm', base);
    expect(again.body.firm).toMatchObject({ phone: '01632 960 123', registrationNumbers: 'Trade scheme 123456' });
    const bad = await owner.put('/api/firm', { ...base, phone: 'call us', email: 'not-an-address' });
    expect(bad.status).toBe(422);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'phone']);
    const tooMuch = await owner.put('/api/firm', {
      ...base,
      heatExchangerDefaults: {
        gas: { combi: 101, system: 2, regular: 3 },
        oil: { combi: 1, system: 1, regular: 1 },
        other: { combi: 1, system: 1, regular: 1 },
      },
    });
    expect(tooMuch.status).toBe(422);
    expect(tooMuch.body.details[0].message).toBe('The gas combi default must be between 0 and 100 litres.');
  });
});
