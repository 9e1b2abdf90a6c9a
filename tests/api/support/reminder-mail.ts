import { expect } from 'vitest';
import type { OutboxMessage } from '@heatfleet/domain';
import { findEmails, waitForEmail } from './outbox.ts';

/** The digest's lines, each named by what it is about: an asset tag, or a van and which date. */
export function digestKeys(message: OutboxMessage): string[] {
  return message.text
    .split('\n')
    .filter((line) => line.startsWith('- '))
    .map((line) => {
      const name = line.slice(2).split(' ')[0] ?? '';
      if (line.includes(': MOT ')) return `${name} MOT`;
      if (line.includes(': service ')) return `${name} service`;
      return name;
    })
    .sort();
}

/** Each digest line under a section heading, by heading. */
export function sectionsOf(message: OutboxMessage): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  let current = '';
  for (const line of message.text.split('\n')) {
    if (line.endsWith(':') && !line.startsWith('- ')) current = line.slice(0, -1);
    else if (line.startsWith('- ')) (out[current] ??= []).push(line.slice(2));
  }
  return out;
}

export async function onlyEmailTo(to: string, subject: RegExp): Promise<OutboxMessage> {
  await waitForEmail(to, { subject });
  const all = (await findEmails(to)).filter((m) => subject.test(m.subject));
  expect(all, `e-mails to ${to}`).toHaveLength(1);
  return all[0]!;
}

export async function reminderEmailsTo(to: string): Promise<OutboxMessage[]> {
  return (await findEmails(to)).filter((m) => /reminder/.test(m.subject));
}

/** Lets any e-mail that a wrong second send would have produced reach the catcher before counting. */
export async function settle(): Promise<void> {
  await new Promise((r) => setTimeout(r, 1500));
}

export async function waitFor<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const value = await probe();
    if (value !== undefined) return value;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`Timed out waiting for ${what}`);
}
