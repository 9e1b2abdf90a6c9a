import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { createTestApp, signIn, type Client, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';
import { tinyPng } from './support/route-probes.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

/** A second engineer with a van of their own in the same firm. */
async function secondEngineer(firm: SeededFirm): Promise<{ client: Client; vanId: number }> {
  const [vanId] = (await t.deps.db('locations').insert({
    firm_id: firm.firmId,
    kind: 'van',
    name: `Second van ${firm.firmId}`,
    registration: `SE${firm.firmId % 100} CND`,
    engineer_member_id: firm.target.memberId,
  })) as number[];
  return { client: await signIn(t.app, firm.target.email), vanId: vanId! };
}

describe('vans', () => {
  it('validates UK-style registrations loosely and keeps them unique in the firm', async () => {
    const firm = await seedFirm(t.deps.db, 'vans');
    const stores = await signIn(t.app, firm.people.stores.email);
    const ok = await stores.post('/api/vans', { name: 'New van', registration: ' hf24 xyz ', motDueOn: '2027-05-01' });
    expect(ok.status).toBe(201);
    expect(ok.body.van.registration).toBe('HF24 XYZ');
    expect(ok.body.van.nextDue).toEqual({ what: 'MOT', on: '2027-05-01' });
    expect((await stores.post('/api/vans', { name: 'Other van', registration: 'HF24 XYZ' })).status).toBe(409);
    const bad = await stores.post('/api/vans', { name: 'Bad van', registration: 'NOT-A-REG!' });
    expect(bad.status).toBe(422);
    expect(bad.body.details[0].path).toBe('registration');
    expect(
      (await stores.post('/api/vans', { name: 'Bad date', registration: 'AB12 CDE', motDueOn: '2027-02-30' })).status,
    ).toBe(422);
  });

  it('an engineer sees their own van as My van, with its kits', async () => {
    const firm = await seedFirm(t.deps.db, 'myvan');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer
      .post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.van.id })
      .then((r) => expect(r.status).toBe(200));
    const mine = await engineer.get('/api/me/van').expect(200);
    expect(mine.body.van.registration).toBe(firm.van.registration);
    expect(mine.body.kits.map((k: { id: number }) => k.id)).toEqual([firm.kit.id]);
    expect(mine.body.items).toHaveLength(2);
    const stores = await signIn(t.app, firm.people.stores.email);
    expect((await stores.get('/api/me/van').expect(200)).body.van).toBeNull();
  });
});

describe('custody', () => {
  it('a kit check-out moves all its items, is logged, and the holder is derived from the log', async () => {
    const firm = await seedFirm(t.deps.db, 'out');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const res = await engineer.post(`/api/kits/${firm.kit.id}/check-out`, {
      toLocationId: firm.van.id,
      note: 'For the job at 4 Quarry Lane',
    });
    expect(res.status).toBe(200);
    expect(res.body.kit.location.id).toBe(firm.van.id);
    expect(res.body.items.every((i: { location: { id: number } }) => i.location.id === firm.van.id)).toBe(true);
    const events = await t.deps.db('custody_events').where({ firm_id: firm.firmId, kit_id: firm.kit.id });
    expect(events).toHaveLength(2);
    expect(
      events.every(
        (e) => e.action === 'check_out' && e.to_location_id === firm.van.id && e.from_location_id === firm.depotId,
      ),
    ).toBe(true);
    // The cached whereabouts equal the latest event of each item.
    for (const itemId of firm.kit.itemIds) {
      const latest = await t.deps
        .db('custody_events')
        .where({ firm_id: firm.firmId, item_id: itemId })
        .orderBy('id', 'desc')
        .first();
      const item = await t.deps.db('kit_items').where({ id: itemId }).first();
      expect(item.location_id).toBe(latest.to_location_id);
    }
  });

  it('of two engineers checking out the same kit at the same moment exactly one wins; the other gets 409 naming the holder', async () => {
    const firm = await seedFirm(t.deps.db, 'race');
    const first = await signIn(t.app, firm.people.engineer.email);
    const second = await secondEngineer(firm);
    await first.refreshCsrf();
    await second.client.refreshCsrf();
    const results = await Promise.all([
      first.post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.van.id }),
      second.client.post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: second.vanId }),
    ]);
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409]);
    const loser = results.find((r) => r.status === 409)!;
    const winner = results.find((r) => r.status === 200)!;
    const holder = winner.body.kit.location;
    expect(loser.body.message).toContain(holder.registration);
    expect(loser.body.message).toContain(holder.engineerName);
    expect(await t.deps.db('custody_events').where({ firm_id: firm.firmId, kit_id: firm.kit.id })).toHaveLength(2);
  });

  it('a retried request with the same Idempotency-Key does not check out twice, and replays the first answer', async () => {
    const firm = await seedFirm(t.deps.db, 'retry');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.refreshCsrf();
    const key = randomUUID();
    const send = () =>
      engineer.agent
        .post(`/api/kits/${firm.kit.id}/check-out`)
        .set('X-CSRF-Token', engineer.csrfToken)
        .set('Idempotency-Key', key)
        .send({ toLocationId: firm.van.id });
    const [a, b] = await Promise.all([send(), send()]);
    const c = await send();
    expect([a.status, b.status, c.status]).toEqual([200, 200, 200]);
    expect(b.body).toEqual(a.body);
    expect(c.body).toEqual(a.body);
    expect(await t.deps.db('custody_events').where({ firm_id: firm.firmId, kit_id: firm.kit.id })).toHaveLength(2);
    // Without the key, the same request is a new one and is refused: the kit is already out.
    expect((await engineer.post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.van.id })).status).toBe(409);
  });

  it('an engineer may take kit onto their own van only; stores may send it to any van', async () => {
    const firm = await seedFirm(t.deps.db, 'ownvan');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const other = await engineer.post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.spareVanId });
    expect(other.status).toBe(403);
    const stores = await signIn(t.app, firm.people.stores.email);
    expect((await stores.post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.spareVanId })).status).toBe(
      200,
    );
    // Now on the spare van: the engineer may move it onto their own van (taking it on).
    expect((await engineer.post(`/api/kits/${firm.kit.id}/move`, { toLocationId: firm.van.id })).status).toBe(200);
  });

  it('checks in with condition, missing parts and a photo, all in the log', async () => {
    const firm = await seedFirm(t.deps.db, 'checkin');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.post(`/api/kit-items/${firm.looseItemId}/check-out`, { toLocationId: firm.van.id });
    const upload = await engineer.upload(
      '/api/photos',
      { itemId: String(firm.looseItemId) },
      { field: 'photo', content: tinyPng, filename: 'hose.png', contentType: 'image/png' },
    );
    expect(upload.status).toBe(201);
    const res = await engineer.post(`/api/kit-items/${firm.looseItemId}/check-in`, {
      condition: 'needs_attention',
      missingParts: 'One 22 mm adaptor',
      note: 'Kinked near the coupling',
      photoId: upload.body.photo.id,
    });
    expect(res.status).toBe(200);
    expect(res.body.item.condition).toBe('needs_attention');
    expect(res.body.item.location.id).toBe(firm.depotId);
    const [latest] = res.body.events;
    expect(latest).toMatchObject({
      action: 'check_in',
      condition: 'needs_attention',
      missingParts: 'One 22 mm adaptor',
      photoId: upload.body.photo.id,
    });
    const image = await engineer.get(upload.body.photo.url).expect(200);
    expect(image.headers['content-type']).toBe('image/png');
    expect(image.headers['content-disposition']).toMatch(/^inline; filename="photo-\d+\.png"$/);
    expect(image.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(image.body as Buffer, tinyPng)).toBe(0);
  });

  it('an item overdue for inspection needs a reason to go out, or stays in when its kind says so', async () => {
    const firm = await seedFirm(t.deps.db, 'overdue');
    // Hose set kind: 180 days. Inspected 200 days ago: overdue.
    await t.deps.db('inspections').where({ firm_id: firm.firmId, item_id: firm.looseItemId }).del();
    await t.deps.db('kit_items').where({ id: firm.looseItemId }).update({ in_service_since: '2020-01-01' });
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const refused = await engineer.post(`/api/kit-items/${firm.looseItemId}/check-out`, { toLocationId: firm.van.id });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toBe('InspectionOverdue');
    const withReason = await engineer.post(`/api/kit-items/${firm.looseItemId}/check-out`, {
      toLocationId: firm.van.id,
      overdueReason: 'Only hose set left; inspect on return',
    });
    expect(withReason.status).toBe(200);
    expect(withReason.body.events[0].overdueReason).toBe('Only hose set left; inspect on return');

    await t.deps.db('item_kinds').where({ id: firm.kindId }).update({ overdue_policy: 'block' });
    await engineer.post(`/api/kit-items/${firm.looseItemId}/check-in`, { condition: 'in_service' });
    const blocked = await engineer.post(`/api/kit-items/${firm.looseItemId}/check-out`, {
      toLocationId: firm.van.id,
      overdueReason: 'Please',
    });
    expect(blocked.status).toBe(409);
    expect(blocked.body.message).toMatch(/must be inspected before it goes out/);
  });
});

describe('inspections', () => {
  it('a pass resets the due date; a failure sets the item to needs attention; check-ins count as uses', async () => {
    const firm = await seedFirm(t.deps.db, 'inspect');
    const stores = await signIn(t.app, firm.people.stores.email);
    // Hose set: every 180 days or 25 uses (default kinds). Inspected today: due in 180 days.
    const passed = await stores.post(`/api/kit-items/${firm.looseItemId}/inspections`, {
      result: 'passed',
      inspectedOn: '2026-11-30',
    });
    expect(passed.status).toBe(201);
    expect(passed.body.item.inspection.lastInspectedOn).toBe('2026-11-30');
    expect(passed.body.item.inspection.dueOn).toBe('2027-05-29');
    expect(passed.body.item.inspection.usesLeft).toBe(25);
    await stores.post(`/api/kit-items/${firm.looseItemId}/check-out`, { toLocationId: firm.van.id });
    const back = await stores.post(`/api/kit-items/${firm.looseItemId}/check-in`, { condition: 'in_service' });
    expect(back.body.item.inspection.usesLeft).toBe(24);
    const failed = await stores.post(`/api/kit-items/${firm.looseItemId}/inspections`, {
      result: 'failed',
      notes: 'Split outer sleeve',
    });
    expect(failed.body.item.condition).toBe('needs_attention');
    expect(failed.body.item.inspection.usesLeft).toBe(25);
    expect(
      (
        await stores.post(`/api/kit-items/${firm.looseItemId}/inspections`, {
          result: 'passed',
          inspectedOn: '2999-01-01',
        })
      ).status,
    ).toBe(400);
  });
});

async function objectsUnder(prefix: string): Promise<string[]> {
  const env = t.deps.env;
  const s3 = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
  });
  const out = await s3.send(new ListObjectsV2Command({ Bucket: env.S3_BUCKET, Prefix: prefix }));
  s3.destroy();
  return (out.Contents ?? []).map((o) => o.Key!);
}

describe('photos', () => {
  it('refuses a renamed executable, leaving no row and no object', async () => {
    const firm = await seedFirm(t.deps.db, 'exe');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    // An ELF header (what a Linux executable starts with), named and typed as a JPEG.
    const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(120)]);
    const before = await t.deps.db('photos').where({ firm_id: firm.firmId }).count({ n: '*' });
    const res = await engineer.upload(
      '/api/photos',
      {},
      { field: 'photo', content: elf, filename: 'magnets.jpg', contentType: 'image/jpeg' },
    );
    expect(res.status).toBe(422);
    expect(res.body.message).toMatch(/JPEG, PNG or WebP/);
    expect(await t.deps.db('photos').where({ firm_id: firm.firmId }).count({ n: '*' })).toEqual(before);
    expect(await objectsUnder(`firms/${firm.firmId}/`)).toEqual([]);
  });

  it('refuses a file over the size limit with 413', async () => {
    const firm = await seedFirm(t.deps.db, 'big');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const big = Buffer.concat([tinyPng, Buffer.alloc(8 * 1024 * 1024)]);
    const res = await engineer.upload(
      '/api/photos',
      {},
      { field: 'photo', content: big, filename: 'big.png', contentType: 'image/png' },
    );
    expect(res.status).toBe(413);
    expect(await t.deps.db('photos').where({ firm_id: firm.firmId, byte_size: big.length }).first()).toBeUndefined();
    expect(await objectsUnder(`firms/${firm.firmId}/`)).toEqual([]);
  });

  it('another firm\u2019s photo URL answers 404', async () => {
    const a = await seedFirm(t.deps.db, 'photo-a');
    const b = await seedFirm(t.deps.db, 'photo-b');
    const owner = await signIn(t.app, a.people.owner.email);
    const up = await owner.upload(
      '/api/photos',
      {},
      { field: 'photo', content: tinyPng, filename: 'a.png', contentType: 'image/png' },
    );
    expect(up.status).toBe(201);
    const key = (await t.deps.db('photos').where({ id: up.body.photo.id }).first()).object_key as string;
    expect(key.startsWith(`firms/${a.firmId}/photos/`)).toBe(true);
    expect(await objectsUnder(`firms/${a.firmId}/`)).toEqual([key]);
    await owner.get(up.body.photo.url).expect(200);
    const other = await signIn(t.app, b.people.owner.email);
    await other.get(up.body.photo.url).expect(404);
  });
});

describe('labels', () => {
  it('gives each item of a kit a QR code that opens its page in the app', async () => {
    const firm = await seedFirm(t.deps.db, 'labels');
    const stores = await signIn(t.app, firm.people.stores.email);
    const res = await stores.get(`/api/kit-items/labels?kitId=${firm.kit.id}`).expect(200);
    expect(res.body.labels).toHaveLength(2);
    const [label] = res.body.labels;
    expect(label.url).toBe(`${t.deps.env.APP_ORIGIN}/kit-items/${label.itemId}`);
    const svg = Buffer.from(label.qrSvgDataUrl.split(',')[1], 'base64').toString('utf8');
    expect(svg).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect((await stores.get('/api/kit-items/labels')).status).toBe(400);
  });
});

describe('the items list', () => {
  it('searches by tag, kit or serial (case-insensitive) and sorts on the server', async () => {
    const firm = await seedFirm(t.deps.db, 'itemsearch');
    const stores = await signIn(t.app, firm.people.stores.email);
    const tag = (await t.deps.db('kit_items').where({ id: firm.looseItemId }).first('asset_tag')).asset_tag as string;
    const found = await stores.get(`/api/kit-items?q=${encodeURIComponent(tag.toLowerCase())}`).expect(200);
    expect(found.body.items.map((i: { id: number }) => i.id)).toEqual([firm.looseItemId]);
    expect((await stores.get('/api/kit-items?q=%25').expect(200)).body.total).toBe(0);
    const desc = await stores.get(`/api/kit-items?kindId=${firm.kindId}&sort=assetTag&dir=desc`).expect(200);
    const tags = desc.body.items.map((i: { assetTag: string }) => i.assetTag);
    expect(tags).toEqual([...tags].sort().reverse());
  });
});
