import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { outboxMessageSchema, type OutboxMessage, type OutboxMessageSummary } from '@heatfleet/domain';
import { notFound } from '../../lib/http-error.ts';

const MAX_LISTED = 200;
const idPattern = /^[A-Za-z0-9-]{1,80}$/;

async function readMessage(dir: string, id: string): Promise<OutboxMessage | undefined> {
  try {
    return outboxMessageSchema.parse(JSON.parse(await readFile(path.join(dir, `${id}.json`), 'utf8')));
  } catch {
    return undefined;
  }
}

/** The e-mails the local SMTP catcher wrote to its folder, newest first. */
export async function listOutbox(dir: string | undefined): Promise<OutboxMessageSummary[]> {
  if (!dir) return [];
  const names = await readdir(dir).catch(() => [] as string[]);
  const ids = names
    .filter((n) => n.endsWith('.json'))
    .map((n) => n.slice(0, -5))
    .sort()
    .reverse()
    .slice(0, MAX_LISTED);
  const messages = await Promise.all(ids.map((id) => readMessage(dir, id)));
  return messages
    .filter((m): m is OutboxMessage => m !== undefined)
    .map(({ id, to, from, subject, receivedAt }) => ({ id, to, from, subject, receivedAt }))
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}

export async function getOutboxMessage(dir: string | undefined, id: string): Promise<OutboxMessage> {
  const message = dir && idPattern.test(id) ? await readMessage(dir, id) : undefined;
  if (!message) throw notFound('That e-mail');
  return message;
}
