import { randomUUID } from 'node:crypto';
import { connect } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import express from 'express';
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { apiErrorBodySchema, dosePlan } from '@heatfleet/domain';
import {
  Client,
  createTestApp,
  linkTokenFromEmail,
  signIn,
  signUpFirm,
  TEST_PASSWORD,
  uniqueEmail,
  type TestApp,
} from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

// Each case here was found by a security probe of the running app (issue 10) and failed before its fix.
// Sources: OWASP Authentication, Forgot Password, CSV Injection and Input Validation cheat sheets;
// NIST SP 800-63B 5.1.1.2 (memorised secrets); RFC 9110 (Host, Content-Encoding); RFC 7231 6.5.13 (415).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

async function emailsTo(address: string): Promise<{ subject: string; text_body: string }[]> {
  return t.deps.db('emails').where({ to_address: address }).orderBy('id', 'asc').select('subject', 'text_body');
}

describe('sign-up is not a password oracle', () => {
  it('answers an address with an account exactly as a new one, signs nobody in, creates no firm, and e-mails the owner instead', async () => {
    const owner = await signUpFirm(t.app, 'oracle', 'Oracle Heating');
    const firmsBefore = (await t.deps.db('firms').count({ n: '*' }).first())!.n;
    const fresh = new Client(t.app);
    const fresher = uniqueEmail('oracle-new');
    const forNew = await fresh.post('/api/auth/sign-up', {
      firmName: 'Brand New Ltd',
      name: 'New',
      email: fresher,
      password: 'granite orchard lantern',
    });
    const attempts = [];
    for (const password of ['a wrong guess 123', TEST_PASSWORD]) {
      const attacker = new Client(t.app);
      const res = await attacker.post('/api/auth/sign-up', {
        firmName: 'Takeover Ltd',
        name: 'Mallory',
        email: owner.email,
        password,
      });
      attempts.push(res);
      // No session for the attacker, whichever password they gave.
      expect((await attacker.get('/api/me')).status).toBe(401);
    }
    for (const res of attempts) {
      expect(res.status).toBe(forNew.status);
      expect(res.status).toBe(202);
      expect(res.body).toEqual(forNew.body);
    }
    // Only the new address's request is waiting; the existing account gained no firm.
    expect((await t.deps.db('firms').count({ n: '*' }).first())!.n).toBe(firmsBefore);
    const me = await owner.client.get('/api/me');
    expect(me.body.me.memberships).toHaveLength(1);
    const mails = await emailsTo(owner.email);
    const warnings = mails.filter((m) => /Someone tried to create a firm/.test(m.subject));
    expect(warnings).toHaveLength(2);
    expect(warnings[0]!.text_body).toMatch(/sign in and create the new firm from your account/);
  });

  it('a confirmation link creates the account and firm once, then is spent', async () => {
    const client = new Client(t.app);
    const email = uniqueEmail('confirm');
    expect(
      (
        await client.post('/api/auth/sign-up', {
          firmName: 'Confirmed Heating',
          name: 'Cass',
          email,
          password: 'granite orchard lantern',
        })
      ).status,
    ).toBe(202);
    expect(await t.deps.db('users').where({ email }).first()).toBeUndefined();
    const token = await linkTokenFromEmail(t.app, email, 'sign-up/confirm');
    const done = await client.post('/api/auth/sign-up/confirm', { token });
    expect(done.status).toBe(201);
    expect(done.body.me.activeFirm.name).toBe('Confirmed Heating');
    expect(done.body.me.role).toBe('owner');
    const again = await new Client(t.app).post('/api/auth/sign-up/confirm', { token });
    expect(again.status).toBe(400);
    expect(again.body.message).toMatch(/expired or was already used/);
  });

  it('limits sign-ups per e-mail address and per client address (429 with Retry-After)', async () => {
    const limited = createTestApp({ limits: { signUpsPerAccount: 2, signUpsPerAddress: 4 } });
    try {
      const email = uniqueEmail('flood');
      const body = { firmName: 'Flood Ltd', name: 'F', email, password: 'granite orchard lantern' };
      expect((await new Client(limited.app).post('/api/auth/sign-up', body)).status).toBe(202);
      expect((await new Client(limited.app).post('/api/auth/sign-up', body)).status).toBe(202);
      const perAccount = await new Client(limited.app).post('/api/auth/sign-up', body);
      expect(perAccount.status).toBe(429);
      expect(perAccount.body.message).toMatch(/for this e-mail address/);
      expect(Number(perAccount.headers['retry-after'])).toBeGreaterThan(0);
      // The address has now made 3 counted requests (the 429 above counted too): one more is let through, then refused.
      expect(
        (await new Client(limited.app).post('/api/auth/sign-up', { ...body, email: uniqueEmail('flood2') })).status,
      ).toBe(202);
      const perAddress = await new Client(limited.app).post('/api/auth/sign-up', {
        ...body,
        email: uniqueEmail('flood3'),
      });
      expect(perAddress.status).toBe(429);
      expect(perAddress.body.message).toMatch(/from this network/);
      // Each 202 wrote one e-mail; nothing was written for a refused request.
      expect(await emailsTo(email)).toHaveLength(2);
    } finally {
      await limited.close();
    }
  });
});

describe('rate limits on every route that takes a secret or sends mail', () => {
  it('password-reset requests per client address', async () => {
    const limited = createTestApp({ limits: { resetsPerAddress: 3 } });
    try {
      const statuses = [];
      for (let i = 0; i < 4; i += 1)
        statuses.push(
          (await new Client(limited.app).post('/api/auth/password-reset', { email: uniqueEmail('reset-flood') }))
            .status,
        );
      expect(statuses).toEqual([202, 202, 202, 429]);
    } finally {
      await limited.close();
    }
  });

  it('failed link uses (reset confirmation, sign-up confirmation, invitation) per link and per address', async () => {
    const limited = createTestApp({ limits: { linkFailuresPerLink: 2, linkFailuresPerAddress: 5 } });
    try {
      const badToken = 'z'.repeat(43);
      const tries = [];
      for (let i = 0; i < 3; i += 1)
        tries.push(
          (
            await new Client(limited.app).post('/api/auth/password-reset/confirm', {
              token: badToken,
              password: 'granite orchard lantern',
            })
          ).status,
        );
      expect(tries).toEqual([400, 400, 429]);
      // Other links from the same address: the address limit (5 failures) is reached on the way.
      const signUpTries = [];
      for (let i = 0; i < 3; i += 1)
        signUpTries.push(
          (await new Client(limited.app).post('/api/auth/sign-up/confirm', { token: `${'q'.repeat(40)}${i}ab` }))
            .status,
        );
      expect(signUpTries).toEqual([400, 400, 429]);
      const invitation = await new Client(limited.app).post(`/api/invitations/by-token/${'w'.repeat(43)}/accept`, {
        password: 'granite orchard lantern',
      });
      expect(invitation.status).toBe(429);
    } finally {
      await limited.close();
    }
  });

  it('invitation e-mails per signed-in person', async () => {
    const limited = createTestApp({ limits: { invitationsPerAccount: 2 } });
    try {
      const { client } = await signUpFirm(limited.app, 'invite-flood');
      const statuses = [];
      for (let i = 0; i < 3; i += 1)
        statuses.push(
          (await client.post('/api/invitations', { email: uniqueEmail('invitee'), role: 'engineer' })).status,
        );
      expect(statuses).toEqual([201, 201, 429]);
    } finally {
      await limited.close();
    }
  });

  it('wrong current passwords at a password change, per account', async () => {
    const limited = createTestApp({ limits: { passwordChangeFailuresPerAccount: 3 } });
    try {
      const { client } = await signUpFirm(limited.app, 'change-flood');
      const statuses = [];
      for (let i = 0; i < 4; i += 1)
        statuses.push(
          (
            await client.put('/api/me/password', {
              currentPassword: `guess number ${i}`,
              newPassword: 'granite orchard lantern',
            })
          ).status,
        );
      expect(statuses).toEqual([422, 422, 422, 429]);
      // The right password is refused too until the window passes: the limit is on the account.
      expect(
        (
          await client.put('/api/me/password', {
            currentPassword: TEST_PASSWORD,
            newPassword: 'granite orchard lantern',
          })
        ).status,
      ).toBe(429);
    } finally {
      await limited.close();
    }
  });
});

describe('password-reset links', () => {
  async function askReset(email: string): Promise<string> {
    expect((await new Client(t.app).post('/api/auth/password-reset', { email })).status).toBe(202);
    return linkTokenFromEmail(t.app, email, 'reset-password');
  }

  it('a new request ends earlier links; using a link ends every other', async () => {
    const { email } = await signUpFirm(t.app, 'links');
    const first = await askReset(email);
    const second = await askReset(email);
    const old = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token: first,
      password: 'granite orchard lantern',
    });
    expect(old.status).toBe(400);
    expect(
      (
        await new Client(t.app).post('/api/auth/password-reset/confirm', {
          token: second,
          password: 'granite orchard lantern',
        })
      ).status,
    ).toBe(200);
    expect(
      (
        await new Client(t.app).post('/api/auth/password-reset/confirm', {
          token: second,
          password: 'copper kettle meadow',
        })
      ).status,
    ).toBe(400);
    expect(
      (await new Client(t.app).post('/api/auth/sign-in', { email, password: 'granite orchard lantern' })).status,
    ).toBe(200);
  });

  it('a password change ends every open link', async () => {
    const { email, client } = await signUpFirm(t.app, 'links-change');
    const link = await askReset(email);
    expect(
      (await client.put('/api/me/password', { currentPassword: TEST_PASSWORD, newPassword: 'granite orchard lantern' }))
        .status,
    ).toBe(200);
    const stale = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token: link,
      password: 'copper kettle meadow',
    });
    expect(stale.status).toBe(400);
    expect(
      (await new Client(t.app).post('/api/auth/sign-in', { email, password: 'granite orchard lantern' })).status,
    ).toBe(200);
  });
});

describe('malformed bodies answer 4xx with the one error body, never 500', () => {
  async function post(headers: Record<string, string>, body: string | Buffer) {
    const client = new Client(t.app);
    await client.refreshCsrf();
    let req = client.agent.post('/api/auth/sign-in').set('X-CSRF-Token', client.csrfToken);
    for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
    return req.send(body);
  }

  it('an unknown charset is 415', async () => {
    const res = await post({ 'Content-Type': 'application/json; charset=x' }, '{"email":"a@b.example","password":"x"}');
    expect(res.status).toBe(415);
    expect(apiErrorBodySchema.parse(res.body).message).toBe('The request body must be sent as UTF-8 text.');
  });

  it('an unknown Content-Encoding is 415', async () => {
    const res = await post(
      { 'Content-Type': 'application/json', 'Content-Encoding': 'bogus' },
      '{"email":"a@b.example"}',
    );
    expect(res.status).toBe(415);
    expect(apiErrorBodySchema.parse(res.body).error).toBe('UnsupportedMediaType');
  });

  it('gzip declared on a plain body is 400', async () => {
    const res = await post(
      { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' },
      '{"email":"a@b.example"}',
    );
    expect(res.status).toBe(400);
    expect(apiErrorBodySchema.parse(res.body).message).toBe('The request body could not be read.');
  });

  it('a body cut short of its Content-Length is answered 400 by the app, not 500', async () => {
    // The client goes away mid-body, so the answer cannot reach it; what the app decided is read on the server side.
    const decided: number[] = [];
    const outer = express();
    outer.use((_req, res, next) => {
      const status = res.status.bind(res);
      res.status = (code: number) => {
        decided.push(code);
        return status(code);
      };
      next();
    });
    outer.use(t.app);
    const server = outer.listen(0);
    try {
      const { port } = server.address() as AddressInfo;
      const raw = await new Promise<string>((resolve, reject) => {
        const socket = connect(port, '127.0.0.1');
        let answer = '';
        socket.on('data', (chunk) => (answer += chunk.toString()));
        socket.on('end', () => resolve(answer));
        socket.on('error', reject);
        socket.write(
          `POST /api/auth/sign-in HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nContent-Type: application/json\r\nContent-Length: 200\r\nConnection: close\r\n\r\n{"email":`,
        );
        // Half-close: the client sends no more, so the body stays 191 bytes short.
        socket.end();
      });
      // Node answers the broken request itself; the app's own decision for it is a 400 as well.
      expect(Number(/^HTTP\/1\.1 (\d{3})/.exec(raw)?.[1])).toBe(400);
      for (let waited = 0; decided.length === 0 && waited < 3000; waited += 50)
        await new Promise((r) => setTimeout(r, 50));
      expect(decided).toEqual([400]);
    } finally {
      server.close();
    }
  });
});

describe('an Idempotency-Key is tied to its request', () => {
  it('replays the same request, and refuses the key with another body with 422, changing nothing', async () => {
    const firm = await seedFirm(t.deps.db, 'idem-body');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.refreshCsrf();
    const key = randomUUID();
    const send = (toLocationId: number) =>
      engineer.agent
        .post(`/api/kits/${firm.kit.id}/check-out`)
        .set('X-CSRF-Token', engineer.csrfToken)
        .set('Idempotency-Key', key)
        .send({ toLocationId });
    const first = await send(firm.van.id);
    expect(first.status).toBe(200);
    const replay = await send(firm.van.id);
    expect(replay.status).toBe(200);
    expect(replay.body).toEqual(first.body);
    const events = async () =>
      (await t.deps.db('custody_events').where({ firm_id: firm.firmId }).count({ n: '*' }).first())!.n;
    const before = await events();
    const other = await send(firm.spareVanId);
    expect(other.status).toBe(422);
    expect(apiErrorBodySchema.parse(other.body).message).toMatch(/reused the reference of an earlier, different one/);
    expect(await events()).toBe(before);
  });
});

describe('passwords', () => {
  it('refuses a common or breached password, the e-mail and its first part, at sign-up', async () => {
    const email = uniqueEmail('weakpass');
    const local = email.split('@')[0]!;
    for (const [password, message] of [
      // On the "passwords-common" list of @zxcvbn-ts/language-common (published breach corpora).
      ['1q2w3e4r5t6y', /published list of common or breached passwords/],
      ['QAZWSXEDCRFV', /published list of common or breached passwords/],
      [email, /e-mail address or its first part/],
      [local, /e-mail address or its first part/],
      ['zzzzzzzzzzzzzz', /one character repeated/],
    ] as const) {
      const res = await new Client(t.app).post('/api/auth/sign-up', {
        firmName: 'Weak Ltd',
        name: 'W',
        email,
        password,
      });
      expect(res.status, password).toBe(422);
      expect(res.body.details[0]).toEqual({ path: 'password', message: expect.stringMatching(message) });
    }
    expect(await emailsTo(email)).toHaveLength(0);
  });

  it('refuses a common password at a password change and a reset', async () => {
    const { client, email } = await signUpFirm(t.app, 'weak-change');
    const change = await client.put('/api/me/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'leavemealone',
    });
    expect(change.status).toBe(422);
    expect(change.body.details[0].path).toBe('newPassword');
    await new Client(t.app).post('/api/auth/password-reset', { email });
    const token = await linkTokenFromEmail(t.app, email, 'reset-password');
    const reset = await new Client(t.app).post('/api/auth/password-reset/confirm', { token, password: '123qweasdzxc' });
    expect(reset.status).toBe(422);
    // The refused attempt did not spend the link.
    expect(
      (await new Client(t.app).post('/api/auth/password-reset/confirm', { token, password: 'granite orchard lantern' }))
        .status,
    ).toBe(200);
  });
});

describe('names are one line of plain text', () => {
  it('refuses line breaks, control characters and web addresses in names that reach e-mails', async () => {
    for (const firmName of [
      'Evil Ltd\r\nBcc: all@victims.example',
      'Tab\tLtd',
      'Visit https://phish.example now',
      'Reverse \u202Etxt.exe',
    ]) {
      const res = await new Client(t.app).post('/api/auth/sign-up', {
        firmName,
        name: 'N',
        email: uniqueEmail('names'),
        password: 'granite orchard lantern',
      });
      expect(res.status, firmName).toBe(422);
      expect(res.body.details[0].path).toBe('firmName');
    }
    const { client } = await signUpFirm(t.app, 'names-settings');
    const renamed = await client.put('/api/firm', { name: 'Line one\nLine two' });
    expect(renamed.status).toBe(422);
    const person = await new Client(t.app).post('/api/auth/sign-up', {
      firmName: 'Fine Ltd',
      name: 'Eve\nIT support',
      email: uniqueEmail('names2'),
      password: 'granite orchard lantern',
    });
    expect(person.status).toBe(422);
    expect(person.body.details[0].path).toBe('name');
  });
});

describe('quantities never round to zero, and no figure is ever Infinity', () => {
  it('refuses a pack size that would be stored as 0 ml', async () => {
    const firm = await seedFirm(t.deps.db, 'tiny-pack');
    const owner = await signIn(t.app, firm.people.owner.email);
    for (const [packSize, packUnit] of [
      [0.0000001, 'ml'],
      [0.0000001, 'l'],
      [0.4, 'ml'],
    ] as const) {
      const res = await owner.post('/api/products', {
        name: `Tiny ${packUnit} ${packSize}`,
        kind: 'cleaner',
        packSize,
        packUnit,
        doseLitresPer100L: 1,
      });
      expect(res.status, `${packSize} ${packUnit}`).toBe(422);
      expect(res.body.details[0]).toEqual({
        path: 'packSize',
        message: 'Pack size must be at least 1 ml (0.001 litres).',
      });
    }
    expect(
      (
        await owner.post('/api/products', {
          name: 'Smallest pack',
          kind: 'cleaner',
          packSize: 0.001,
          packUnit: 'l',
          doseLitresPer100L: 1,
        })
      ).status,
    ).toBe(201);
  });

  it('the dose plan gives no pack count rather than Infinity for a zero pack size already stored', () => {
    const plan = dosePlan(100, 10, { packSizeMl: 0, doseLitresPer100L: 1, radiatorsPerPack: 0 });
    expect(plan.packsByVolume).toBeNull();
    expect(plan.packsByRadiators).toBeNull();
    expect(Number.isFinite(plan.packs)).toBe(true);
  });
});

describe('calendar dates are bounded to a sane range for what each one is', () => {
  it('refuses years 0000-0999 and 9999 where they were stored before', async () => {
    const firm = await seedFirm(t.deps.db, 'dates');
    const owner = await signIn(t.app, firm.people.owner.email);
    const cases: [string, () => Promise<request.Response>, string][] = [
      [
        'scheduledOn',
        () => owner.post('/api/jobs', { siteId: firm.siteId, scheduledOn: '0999-03-01', survey: {} }),
        'scheduledOn',
      ],
      ['motDueOn', () => owner.patch(`/api/vans/${firm.van.id}`, { motDueOn: '0000-01-01' }), 'motDueOn'],
      [
        'expiresOn',
        () =>
          owner.post('/api/stock/receipts', {
            locationId: firm.depotId,
            lines: [{ productId: firm.product.id, lotNumber: 'L-OLD', expiresOn: '0500-06-30', quantity: 1 }],
          }),
        'lines.0.expiresOn',
      ],
      [
        'inspectedOn',
        () =>
          owner.post(`/api/kit-items/${firm.looseItemId}/inspections`, { result: 'passed', inspectedOn: '0999-01-01' }),
        'inspectedOn',
      ],
      [
        'inServiceSince',
        () =>
          owner.post('/api/kit-items', {
            kindId: firm.kindId,
            assetTag: `DT-${Date.now()}`,
            locationId: firm.depotId,
            inServiceSince: '9999-12-31',
          }),
        'inServiceSince',
      ],
    ];
    for (const [what, call, path] of cases) {
      const res = await call();
      expect(res.status, what).toBe(422);
      expect(
        res.body.details.map((d: { path: string }) => d.path),
        what,
      ).toContain(path);
    }
  });
});

describe('Host and Origin', () => {
  it('refuses a state-changing request whose Origin matches only its own Host, not APP_ORIGIN', async () => {
    const client = new Client(t.app);
    await client.refreshCsrf();
    const res = await client.agent
      .post('/api/auth/sign-in')
      .set('Host', 'localhost:9')
      .set('Origin', 'http://localhost:9')
      .set('X-CSRF-Token', client.csrfToken)
      .send({ email: 'a@b.example', password: 'whatever it is' });
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('ForeignOrigin');
  });

  it('answers an unknown Host header with 400 (DNS rebinding), and the app\u2019s own with 200', async () => {
    const rebound = await request(t.app).get('/api/health').set('Host', 'rebind.attacker.example');
    expect(rebound.status).toBe(400);
    expect(apiErrorBodySchema.parse(rebound.body).error).toBe('UnknownHost');
    const own = new URL(t.deps.env.APP_ORIGIN).host;
    expect((await request(t.app).get('/api/health').set('Host', own)).status).toBe(200);
  });
});

describe('photos are not kept in a shared browser', () => {
  it('serves a photo with Cache-Control: no-store', async () => {
    const firm = await seedFirm(t.deps.db, 'photo-cache');
    const owner = await signIn(t.app, firm.people.owner.email);
    const png = Buffer.from(
      'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==',
      'base64',
    );
    const upload = await owner.upload(
      '/api/photos',
      { itemId: String(firm.looseItemId) },
      { field: 'photo', content: png, filename: 'dot.png', contentType: 'image/png' },
    );
    expect(upload.status).toBe(201);
    const res = await owner.get(`/api/photos/${upload.body.photo.id}/content`);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('CSV cells cannot smuggle a formula past a separator', () => {
  it('quotes every text cell and neutralises a trigger after a semicolon', async () => {
    const firm = await seedFirm(t.deps.db, 'csv-semicolon');
    const stores = await signIn(t.app, firm.people.stores.email);
    await stores.post('/api/stock/usages', {
      locationId: firm.van.id,
      productId: firm.product.id,
      quantity: 1,
      reason: 'Cleaner;=1+1',
    });
    const csv = await stores.get(`/api/stock/movements.csv?productId=${firm.product.id}`).expect(200);
    const used = (parse(csv.text, { columns: true }) as Record<string, string>[]).find((r) => r.kind === 'used')!;
    expect(used.reason).toBe("'Cleaner;=1+1");
    // Quoted, so a spreadsheet that splits on semicolons still reads one cell, and it starts with the apostrophe.
    const line = csv.text.split('\n').find((l) => l.includes('Cleaner'))!;
    expect(line).toContain('"\'Cleaner;=1+1"');
    expect(Number(used.quantity)).toBe(-1);
  });
});
