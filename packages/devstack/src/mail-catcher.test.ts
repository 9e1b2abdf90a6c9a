import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { connect } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type CaughtMessage, type MailCatcher } from './mail-catcher.ts';

// A bare SMTP conversation, so the test needs no mail library of its own.
function sendRaw(port: number, from: string, to: string[], message: string): Promise<string[]> {
  const commands = [`EHLO test.local`, `MAIL FROM:<${from}>`, ...to.map((address) => `RCPT TO:<${address}>`), 'DATA'];
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    const replies: string[] = [];
    let buffer = '';
    let stage = 0;
    socket.setEncoding('utf8');
    socket.on('error', reject);
    socket.on('data', (chunk: string) => {
      buffer += chunk;
      const lines = buffer.split('\r\n');
      buffer = lines.pop() ?? '';
      for (const line of lines) {
        // Multi-line replies ("250-...") end with a line whose fourth character is a space.
        if (line.charAt(3) !== ' ') continue;
        replies.push(line);
        if (stage < commands.length) socket.write(`${commands[stage]}\r\n`);
        else if (stage === commands.length) socket.write(`${message.replace(/\n/g, '\r\n')}\r\n.\r\n`);
        else if (stage === commands.length + 1) socket.write('QUIT\r\n');
        else socket.end(() => resolve(replies));
        stage += 1;
      }
    });
  });
}

describe('startMailCatcher', () => {
  let outboxDir: string;
  let catcher: MailCatcher;

  beforeAll(async () => {
    outboxDir = mkdtempSync(join(tmpdir(), 'heatfleet-outbox-'));
    catcher = await startMailCatcher({ port: 0, outboxDir });
  });

  afterAll(async () => {
    await catcher.close();
    rmSync(outboxDir, { recursive: true, force: true });
  });

  it('does not offer AUTH or STARTTLS', async () => {
    const replies = await sendRaw(catcher.port, 'a@heatfleet.example', ['b@brackenford.example'], 'Subject: x\n\nx');
    expect(replies.join('\n')).not.toMatch(/STARTTLS|AUTH/);
  });

  it('writes each message as JSON of the Outbox shape, with the raw .eml beside it', async () => {
    const before = new Set(readdirSync(outboxDir));
    const message = [
      'From: Heatfleet <no-reply@heatfleet.example>',
      'To: Dana Quill <dana@brackenford.example>',
      'Subject: You are invited to Brackenford Heating Co.',
      'MIME-Version: 1.0',
      'Content-Type: multipart/alternative; boundary="b1"',
      '',
      '--b1',
      'Content-Type: text/plain; charset=utf-8',
      '',
      'Accept: http://localhost:5173/invitations/tok-1.',
      '--b1',
      'Content-Type: text/html; charset=utf-8',
      '',
      '<p><a href="http://localhost:5173/invitations/tok-1">Accept</a> <a href="https://heatfleet.example/help">Help</a></p>',
      '--b1--',
    ].join('\n');
    const replies = await sendRaw(
      catcher.port,
      'no-reply@heatfleet.example',
      ['dana@brackenford.example', 'bcc@tarnside.example'],
      message,
    );
    expect(replies.some((reply) => reply.startsWith('250 Caught as'))).toBe(true);

    const added = readdirSync(outboxDir).filter((file) => !before.has(file));
    const jsonFile = added.find((file) => file.endsWith('.json'));
    expect(jsonFile).toBeDefined();
    const id = (jsonFile ?? '').replace(/\.json$/, '');
    expect(added.sort()).toEqual([`${id}.eml`, `${id}.json`]);
    expect(id).toMatch(/^\d{13}-[0-9a-f]{8}$/);

    const caught = JSON.parse(readFileSync(join(outboxDir, `${id}.json`), 'utf8')) as CaughtMessage;
    expect(Object.keys(caught).sort()).toEqual(['from', 'html', 'id', 'links', 'receivedAt', 'subject', 'text', 'to']);
    expect(caught).toMatchObject({
      id,
      to: ['dana@brackenford.example', 'bcc@tarnside.example'],
      from: 'Heatfleet <no-reply@heatfleet.example>',
      subject: 'You are invited to Brackenford Heating Co.',
      links: ['http://localhost:5173/invitations/tok-1', 'https://heatfleet.example/help'],
    });
    expect(caught.text).toContain('Accept: http://localhost:5173/invitations/tok-1.');
    expect(caught.html).toContain('<a href="http://localhost:5173/invitations/tok-1">');
    expect(new Date(caught.receivedAt).toISOString()).toBe(caught.receivedAt);
    expect(readFileSync(join(outboxDir, `${id}.eml`), 'utf8')).toContain('Subject: You are invited');
  });

  it('gives html null for a plain-text message', async () => {
    const before = new Set(readdirSync(outboxDir));
    await sendRaw(
      catcher.port,
      'no-reply@heatfleet.example',
      ['e@brackenford.example'],
      'Subject: Plain\n\nNo links here.',
    );
    const jsonFile = readdirSync(outboxDir).find((file) => !before.has(file) && file.endsWith('.json')) ?? '';
    const caught = JSON.parse(readFileSync(join(outboxDir, jsonFile), 'utf8')) as CaughtMessage;
    expect(caught).toMatchObject({ html: null, links: [], subject: 'Plain' });
    expect(caught.text.trim()).toBe('No links here.');
  });
});
