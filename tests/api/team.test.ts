import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  Client,
  createTestApp,
  signIn,
  signUpFirm,
  TEST_PASSWORD,
  uniqueEmail,
  type SignedUp,
  type TestApp,
} from './support/test-app.ts';
import { startTestEmailWorker } from './support/email-worker.ts';
import { findEmails, linkIn, tokenFrom, waitForEmail } from './support/outbox.ts';

let t: TestApp;
let worker: ReturnType<typeof startTestEmailWorker>;
beforeAll(() => {
  t = createTestApp();
  worker = startTestEmailWorker(t);
});
afterAll(async () => {
  await worker.close();
  await t.close();
});

async function invite(owner: SignedUp, role: string, email = uniqueEmail(`invitee-${role}`)) {
  const res = await owner.client.post('/api/invitations', { email, role });
  expect(res.status).toBe(201);
  const message = await waitForEmail(email, { subject: /invited/ });
  return { email, token: tokenFrom(linkIn(message, '/invitations/')), invitation: res.body.invitation, message };
}

async function memberId(client: Client, email: string): Promise<number> {
  const res = await client.get('/api/members').expect(200);
  return res.body.members.find((m: { email: string }) => m.email === email).id;
}

describe('invitations', () => {
  it('e-mails a single-use link; the token is stored only as a hash', async () => {
    const owner = await signUpFirm(t.app, 'inv-owner', 'Invite Test Heating');
    const { email, token, message } = await invite(owner, 'engineer');
    expect(message.text).toContain('Invite Test Heating');
    expect(message.text).toContain('Engineer');
    const row = await t.deps.db('invitations').where({ firm_id: owner.firmId, email }).first();
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(token);
    const expiresInDays = (new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()) / 86_400_000;
    expect(expiresInDays).toBeCloseTo(7, 2);

    const preview = await new Client(t.app).get(`/api/invitations/by-token/${token}`).expect(200);
    expect(preview.body.invitation).toEqual({
      firmName: 'Invite Test Heating',
      email,
      role: 'engineer',
      accountExists: false,
    });

    const invitee = new Client(t.app);
    const accepted = await invitee.post(`/api/invitations/by-token/${token}/accept`, {
      name: 'New Engineer',
      password: TEST_PASSWORD,
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.me.role).toBe('engineer');
    expect(accepted.body.me.activeFirm.id).toBe(owner.firmId);

    const again = await new Client(t.app).post(`/api/invitations/by-token/${token}/accept`, {
      name: 'Someone',
      password: TEST_PASSWORD,
    });
    expect(again.status).toBe(404);
    expect(again.body.message).toMatch(/not valid/);
  });

  it('refuses a link after 7 days', async () => {
    const owner = await signUpFirm(t.app, 'inv-expire');
    const { token } = await invite(owner, 'stores');
    t.clock.advance(7 * 24 * 60 * 60 * 1000 + 1000);
    try {
      await new Client(t.app).get(`/api/invitations/by-token/${token}`).expect(404);
      const res = await new Client(t.app).post(`/api/invitations/by-token/${token}/accept`, {
        name: 'Late',
        password: TEST_PASSWORD,
      });
      expect(res.status).toBe(404);
    } finally {
      t.clock.advance(-(7 * 24 * 60 * 60 * 1000 + 1000));
    }
  });

  it('lets someone with an account join with their existing password, not with a wrong one', async () => {
    const owner = await signUpFirm(t.app, 'inv-existing');
    const other = await signUpFirm(t.app, 'inv-existing-person');
    const { token } = await invite(owner, 'engineer', other.email);
    const preview = await new Client(t.app).get(`/api/invitations/by-token/${token}`).expect(200);
    expect(preview.body.invitation.accountExists).toBe(true);
    const wrong = await new Client(t.app).post(`/api/invitations/by-token/${token}/accept`, {
      password: 'wrong password here',
    });
    expect(wrong.status).toBe(422);
    const ok = await new Client(t.app).post(`/api/invitations/by-token/${token}/accept`, { password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
    expect(ok.body.me.memberships.map((m: { firmId: number }) => m.firmId).sort()).toEqual(
      [owner.firmId, other.firmId].sort(),
    );
  });

  it('a newer invitation to the same address withdraws the older link', async () => {
    const owner = await signUpFirm(t.app, 'inv-twice');
    const email = uniqueEmail('twice');
    await owner.client.post('/api/invitations', { email, role: 'engineer' });
    await owner.client.post('/api/invitations', { email, role: 'stores' });
    const pending = await owner.client.get('/api/invitations').expect(200);
    expect(pending.body.invitations.filter((i: { email: string }) => i.email === email)).toHaveLength(1);
    expect(pending.body.invitations[0].role).toBe('stores');
  });

  it('refuses to invite someone who is already an active member', async () => {
    const owner = await signUpFirm(t.app, 'inv-member');
    const res = await owner.client.post('/api/invitations', { email: owner.email, role: 'engineer' });
    expect(res.status).toBe(409);
  });
});

describe('roles', () => {
  it('an Admin cannot invite an Owner, nor change or deactivate an Owner', async () => {
    const owner = await signUpFirm(t.app, 'roles-owner');
    const { token, email } = await invite(owner, 'admin');
    const admin = new Client(t.app);
    await admin.post(`/api/invitations/by-token/${token}/accept`, { name: 'Admin Person', password: TEST_PASSWORD });
    expect((await admin.post('/api/invitations', { email: uniqueEmail('would-be-owner'), role: 'owner' })).status).toBe(
      403,
    );
    const ownerMember = await memberId(admin, owner.email);
    expect((await admin.patch(`/api/members/${ownerMember}`, { role: 'engineer' })).status).toBe(403);
    expect((await admin.patch(`/api/members/${ownerMember}`, { active: false })).status).toBe(403);
    const adminMember = await memberId(admin, email);
    expect((await admin.patch(`/api/members/${adminMember}`, { role: 'owner' })).status).toBe(403);
    // But the Admin may manage everyone else.
    expect((await admin.post('/api/invitations', { email: uniqueEmail('new-stores'), role: 'stores' })).status).toBe(
      201,
    );
  });

  it('the last active Owner can be neither demoted nor deactivated; with a second Owner it can', async () => {
    const owner = await signUpFirm(t.app, 'last-owner');
    const self = await memberId(owner.client, owner.email);
    const demote = await owner.client.patch(`/api/members/${self}`, { role: 'admin' });
    expect(demote.status).toBe(400);
    expect(demote.body.message).toMatch(/last active Owner/);
    expect((await owner.client.patch(`/api/members/${self}`, { active: false })).status).toBe(400);

    const { token, email } = await invite(owner, 'owner');
    await new Client(t.app).post(`/api/invitations/by-token/${token}/accept`, {
      name: 'Second Owner',
      password: TEST_PASSWORD,
    });
    const second = await memberId(owner.client, email);
    expect((await owner.client.patch(`/api/members/${second}`, { role: 'engineer' })).status).toBe(200);
    const again = await owner.client.patch(`/api/members/${second}`, { role: 'owner' });
    expect(again.body.member.role).toBe('owner');
    expect((await owner.client.patch(`/api/members/${self}`, { role: 'admin' })).status).toBe(200);
  });

  it('deactivating a member ends their sessions at once and stops them signing in to that firm', async () => {
    const owner = await signUpFirm(t.app, 'deact-owner');
    const { token, email } = await invite(owner, 'engineer');
    const engineer = new Client(t.app);
    await engineer.post(`/api/invitations/by-token/${token}/accept`, {
      name: 'Leaving Engineer',
      password: TEST_PASSWORD,
    });
    await engineer.get('/api/me').expect(200);
    const id = await memberId(owner.client, email);
    const res = await owner.client.patch(`/api/members/${id}`, { active: false });
    expect(res.status).toBe(200);
    expect(res.body.member.active).toBe(false);
    await engineer.get('/api/me').expect(401);
    const again = await new Client(t.app).post('/api/auth/sign-in', { email, password: TEST_PASSWORD });
    expect(again.status).toBe(403);
    await owner.client.patch(`/api/members/${id}`, { active: true }).then((r) => expect(r.status).toBe(200));
    await signIn(t.app, email);
  });

  it('an engineer may read the team but not change it', async () => {
    const owner = await signUpFirm(t.app, 'eng-read');
    const { token } = await invite(owner, 'engineer');
    const engineer = new Client(t.app);
    await engineer.post(`/api/invitations/by-token/${token}/accept`, {
      name: 'Reading Engineer',
      password: TEST_PASSWORD,
    });
    const list = await engineer.get('/api/members').expect(200);
    expect(list.body.members).toHaveLength(2);
    const ownerId = await memberId(engineer, owner.email);
    expect((await engineer.patch(`/api/members/${ownerId}`, { role: 'engineer' })).status).toBe(403);
    expect((await engineer.post('/api/invitations', { email: uniqueEmail('x'), role: 'engineer' })).status).toBe(403);
    expect((await engineer.get('/api/invitations')).status).toBe(403);
  });
});

describe('password reset', () => {
  it('answers the same whether or not the e-mail is known, and only a known one gets a link', async () => {
    const known = await signUpFirm(t.app, 'reset-known');
    const unknownEmail = uniqueEmail('reset-unknown');
    const a = await new Client(t.app).post('/api/auth/password-reset', { email: known.email });
    const b = await new Client(t.app).post('/api/auth/password-reset', { email: unknownEmail });
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(a.body).toEqual(b.body);
    await waitForEmail(known.email, { subject: /Reset/ });
    expect(await findEmails(unknownEmail)).toHaveLength(0);
  });

  it('the link works once, ends every session, and the new password signs in', async () => {
    const person = await signUpFirm(t.app, 'reset-once');
    await new Client(t.app).post('/api/auth/password-reset', { email: person.email });
    const token = tokenFrom(linkIn(await waitForEmail(person.email, { subject: /Reset/ }), '/reset-password/'));
    const res = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token,
      password: 'the new long passphrase',
    });
    expect(res.status).toBe(200);
    await person.client.get('/api/me').expect(401);
    const reuse = await new Client(t.app).post('/api/auth/password-reset/confirm', {
      token,
      password: 'yet another passphrase',
    });
    expect(reuse.status).toBe(400);
    await signIn(t.app, person.email, 'the new long passphrase');
  });

  it('the link expires after one hour', async () => {
    const person = await signUpFirm(t.app, 'reset-expire');
    await new Client(t.app).post('/api/auth/password-reset', { email: person.email });
    const token = tokenFrom(linkIn(await waitForEmail(person.email, { subject: /Reset/ }), '/reset-password/'));
    t.clock.advance(61 * 60 * 1000);
    try {
      const res = await new Client(t.app).post('/api/auth/password-reset/confirm', {
        token,
        password: 'the new long passphrase',
      });
      expect(res.status).toBe(400);
      await signIn(t.app, person.email);
    } finally {
      t.clock.advance(-61 * 60 * 1000);
    }
  });
});
