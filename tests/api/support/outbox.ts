import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { OutboxMessage } from '@heatfleet/domain';

/** Waits for the local SMTP catcher to have written an e-mail to this address. */
export async function waitForEmail(
  to: string,
  opts: { subject?: RegExp; timeoutMs?: number } = {},
): Promise<OutboxMessage> {
  const dir = process.env.OUTBOX_DIR;
  if (!dir) throw new Error('OUTBOX_DIR is not set: run the tests with npm test');
  const deadline = Date.now() + (opts.timeoutMs ?? 15_000);
  while (Date.now() < deadline) {
    const found = await findEmails(to);
    const match = found.find((m) => !opts.subject || opts.subject.test(m.subject));
    if (match) return match;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`No e-mail to ${to} arrived within the time allowed`);
}

export async function findEmails(to: string): Promise<OutboxMessage[]> {
  const dir = process.env.OUTBOX_DIR!;
  const names = (await readdir(dir).catch(() => [] as string[])).filter((n) => n.endsWith('.json'));
  const messages: OutboxMessage[] = [];
  for (const name of names) {
    try {
      const m = JSON.parse(await readFile(path.join(dir, name), 'utf8')) as OutboxMessage;
      if (m.to.some((t) => t.toLowerCase().includes(to.toLowerCase()))) messages.push(m);
    } catch {
      // a file being written right now; read it on the next pass
    }
  }
  return messages;
}

export function linkIn(message: OutboxMessage, pathPrefix: string): string {
  const link = message.links.find((l) => new URL(l).pathname.startsWith(pathPrefix));
  if (!link) throw new Error(`No ${pathPrefix} link in "${message.subject}"`);
  return link;
}

export function tokenFrom(link: string): string {
  return new URL(link).pathname.split('/').pop()!;
}
