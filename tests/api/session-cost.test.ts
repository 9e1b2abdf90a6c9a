import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signUpFirm, type TestApp } from './support/test-app.ts';

// The fixed cost of a signed-in request (issue 16): the session and the membership are read in one query and a
// read never writes the session back, while the idle timeout and a role change still take effect on the server.
// The OWASP Session Management Cheat Sheet asks for idle and absolute timeouts enforced on the server side.

let t: TestApp;
beforeAll(() => {
  t = createTestApp({ env: { SESSION_IDLE_MINUTES: '30' } });
});
afterAll(() => t.close());

async function sessionRows(userId: number) {
  const rows: { sid: string; sess: unknown; expired: Date }[] = await t.deps
    .db('sessions')
    .whereRaw("JSON_VALUE(sess, '$.userId') = ?", [userId])
    .select('sid', 'sess', 'expired');
  return rows.map((r) => ({
    sid: r.sid,
    sess: (typeof r.sess === 'string' ? JSON.parse(r.sess) : r.sess) as Record<string, unknown>,
    expired: new Date(r.expired).toISOString(),
  }));
}

describe('the session on a signed-in read', () => {
  it('is not written back by reads within a minute, and is saved (without the membership) once a minute has passed', async () => {
    const { client } = await signUpFirm(t.app, 'session-cost');
    const me = await client.get('/api/me').expect(200);
    const userId = me.body.me.user.id as number;
    const before = await sessionRows(userId);
    expect(before).toHaveLength(1);

    // Over a second of real time too: express-session's own touch would have moved the row's expiry by then.
    await new Promise((resolve) => setTimeout(resolve, 1_100));
    t.clock.advance(30 * 1000);
    await client.get('/api/me').expect(200);
    await client.get('/api/firm').expect(200);
    await client.get('/api/members').expect(200);
    expect(await sessionRows(userId)).toEqual(before);

    // lastSeenAt moves at most once a minute (middleware/authenticate.ts), and only that save writes the row.
    t.clock.advance(61 * 1000);
    await client.get('/api/me').expect(200);
    const after = await sessionRows(userId);
    expect(after[0]!.sid).toBe(before[0]!.sid);
    expect(after[0]!.sess.lastSeenAt).toBeGreaterThan(before[0]!.sess.lastSeenAt as number);
    // The membership is read with the session on each request, never stored in it.
    expect(after[0]!.sess).not.toHaveProperty('loadedMembership');
    expect(after[0]!.sess.userId).toBe(userId);
  });

  it('still ends after the idle timeout when every read was within a minute of the last save', async () => {
    const { client } = await signUpFirm(t.app, 'session-idle');
    t.clock.advance(29 * 60 * 1000);
    await client.get('/api/me').expect(200);
    t.clock.advance(29 * 60 * 1000);
    await client.get('/api/me').expect(200);
    t.clock.advance(31 * 60 * 1000);
    const res = await client.get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.message).toMatch(/session has ended/);
  });

  it('applies a role change to the very next request (the membership is read with the session)', async () => {
    const owner = await signUpFirm(t.app, 'session-role');
    await owner.client.get('/api/reminders').expect(200);
    await t.deps.db('memberships').where({ firm_id: owner.firmId }).update({ role: 'engineer' });
    // An Engineer may not read the firm's reminders (DEVELOPERS.md, Product rules: roles).
    expect((await owner.client.get('/api/reminders')).status).toBe(403);
    const me = await owner.client.get('/api/me').expect(200);
    expect(me.body.me.role).toBe('engineer');
    await t.deps.db('memberships').where({ firm_id: owner.firmId }).update({ active: false });
    const gone = await owner.client.get('/api/me');
    expect(gone.status).toBe(401);
    expect(gone.body.message).toMatch(/no longer a member/);
  });
});
