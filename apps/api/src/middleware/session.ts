import session, { type SessionOptions } from 'express-session';
import type { RequestHandler } from 'express';
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Env } from '../config/env.ts';

declare module 'express-session' {
  interface SessionData {
    userId: number;
    firmId: number;
    /** Epoch milliseconds: the absolute lifetime counts from here. */
    signedInAt: number;
    /** Epoch milliseconds: the idle timeout counts from here. */
    lastSeenAt: number;
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
  override get(sid: string, callback: (err: unknown, session?: session.SessionData | null) => void) {
    return super.get(sid, callback).catch(() => null);
  }

  override set(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void) {
    return super.set(sid, sess, callback).catch(() => undefined);
  }

  override destroy(sid: string, callback?: (err?: unknown) => void) {
    return super.destroy(sid, callback).catch(() => 0);
  }

  override async touch(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void): Promise<void> {
    try {
      await super.touch(sid, sess);
      callback?.();
    } catch (err) {
      callback?.(err);
    }
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
