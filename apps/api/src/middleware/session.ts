import session, { type SessionOptions } from 'express-session';
import type { RequestHandler } from 'express';
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Role } from '@heatfleet/domain';
import type { Env } from '../config/env.ts';
import { readSessionWithMembership } from './session-dal.ts';

declare module 'express-session' {
  interface SessionData {
    userId: number;
    firmId: number;
    /** Epoch milliseconds: the absolute lifetime counts from here. */
    signedInAt: number;
    /** Epoch milliseconds: the idle timeout counts from here. */
    lastSeenAt: number;
    /**
     * The active membership in the session's firm, read with the session in one query on each request
     * (null: none). Never stored: the store drops it before writing, so a role change shows at once.
     */
    loadedMembership?: { id: number; role: Role } | null;
  }
}

export const SESSION_COOKIE = 'heatfleet.sid';
const SESSION_CLEANUP_MS = 15 * 60 * 1000;

/**
 * connect-session-knex, hardened for a database that comes and goes: the table comes from a
 * migration (its own "create table" check would reject forever if the database was down at
 * boot), and its methods report errors to express-session without leaving rejections unhandled.
 */
class SessionStore extends ConnectSessionKnexStore {
  constructor(knex: Knex, logger: Logger) {
    super({
      knex,
      tableName: 'sessions',
      createTable: false,
      cleanupInterval: 0,
      onDbCleanupError: (err) => logger.warn({ err }, 'session cleanup failed'),
    });
    this.ready.catch(() => undefined);
    this.ready = Promise.resolve();
    this.options.cleanupInterval = SESSION_CLEANUP_MS;
    // dbCleanup is private in the typings but is the store's own timer loop; it catches its errors.
    void (this as unknown as { dbCleanup(): Promise<void> }).dbCleanup();
  }

  // The base class both calls back with an error and rethrows it; express-session ignores the
  // returned promise, so each rejection would go unhandled (and crash Node) during an outage.
  // The session and its membership in one indexed query (session-dal.ts) instead of two round trips.
  override async get(
    sid: string,
    callback: (err: unknown, session?: session.SessionData | null) => void,
  ): Promise<session.SessionData | null> {
    let found: session.SessionData | null;
    try {
      const stored = await readSessionWithMembership(this.options.knex, sid, new Date());
      found = stored ? { ...(stored.sess as session.SessionData), loadedMembership: stored.membership } : null;
    } catch (err) {
      callback(err);
      return null;
    }
    callback(null, found);
    return found;
  }

  override set(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void) {
    // eslint-disable-next-line @typescript-eslint/no-unused-vars -- dropped on purpose: read afresh each request
    const { loadedMembership, ...kept } = sess;
    return super.set(sid, kept as session.SessionData, callback).catch(() => undefined);
  }

  override destroy(sid: string, callback?: (err?: unknown) => void) {
    return super.destroy(sid, callback).catch(() => 0);
  }

  /**
   * express-session touches the session after every request it did not save. Nothing needs writing then: each
   * save (at sign-in, and when lastSeenAt moves, at most once a minute) sets the row's expiry to now + the
   * absolute lifetime, beyond anything authenticate lets the session live; the idle timeout is checked from
   * lastSeenAt (middleware/authenticate.ts). So a read never writes the session.
   */
  override touch(_sid: string, _sess: session.SessionData, callback?: () => void): Promise<void> {
    callback?.();
    return Promise.resolve();
  }
}

export function createSessionMiddleware(env: Env, knex: Knex, logger: Logger): RequestHandler {
  const options: SessionOptions = {
    name: SESSION_COOKIE,
    secret: env.SESSION_SECRET,
    store: new SessionStore(knex, logger),
    resave: false,
    saveUninitialized: false,
    rolling: false,
    proxy: env.TRUST_PROXY > 0,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Secure whenever the request arrived over HTTPS (directly or through a trusted proxy).
      secure: 'auto',
      maxAge: env.SESSION_ABSOLUTE_HOURS * 60 * 60 * 1000,
    },
  };
  return session(options);
}
