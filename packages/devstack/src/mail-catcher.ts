import { randomBytes } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer, type SMTPServerAddress } from 'smtp-server';
import { extractLinks } from './mail-links.ts';

/** The file the API's Outbox route reads: `<outboxDir>/<id>.json` (outboxMessageSchema in packages/domain). */
export interface CaughtMessage {
  id: string;
  to: string[];
  from: string;
  subject: string;
  receivedAt: string;
  text: string;
  html: string | null;
  links: string[];
}

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

// Written under a name the Outbox never lists, then renamed: a reader sees the whole file or none of it.
function writeAtomically(file: string, content: string | Buffer): void {
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, content);
  renameSync(temporary, file);
}

function addressTexts(field: AddressObject | AddressObject[] | undefined): string[] {
  if (field === undefined) return [];
  return (Array.isArray(field) ? field : [field]).flatMap((group) =>
    group.value.map((entry) => entry.address ?? '').filter((address) => address !== ''),
  );
}

// mailparser's own .text quotes every display name ("Heatfleet" <...>); the Outbox shows it as written.
function displayFrom(field: AddressObject | undefined): string | null {
  const first = field?.value[0];
  if (first === undefined) return null;
  const address = first.address ?? '';
  return first.name !== '' ? `${first.name} <${address}>` : address;
}

function envelopeAddresses(addresses: SMTPServerAddress[]): string[] {
  return addresses.map((entry) => entry.address).filter((address) => address !== '');
}

export async function toCaughtMessage(raw: Buffer, envelope: { from: string; to: string[] }): Promise<CaughtMessage> {
  const parsed = await simpleParser(raw);
  const text = parsed.text ?? '';
  const html = typeof parsed.html === 'string' ? parsed.html : null;
  const headerTo = [...addressTexts(parsed.to), ...addressTexts(parsed.cc)];
  return {
    id: `${Date.now()}-${randomBytes(4).toString('hex')}`,
    // The envelope is who was actually sent it (Bcc included); the headers are the fallback.
    to: envelope.to.length > 0 ? envelope.to : headerTo,
    from: displayFrom(parsed.from) ?? envelope.from,
    subject: parsed.subject ?? '',
    receivedAt: new Date().toISOString(),
    text,
    html,
    links: extractLinks(text, html),
  };
}

/**
 * A local SMTP server that delivers nothing: each message becomes `<id>.json` (plus the raw `<id>.eml`)
 * in outboxDir. Plain SMTP on 127.0.0.1 only, with AUTH and STARTTLS switched off.
 */
export function startMailCatcher(options: { port: number; outboxDir: string; host?: string }): Promise<MailCatcher> {
  mkdirSync(options.outboxDir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    banner: 'Heatfleet local mail catcher (nothing leaves this machine)',
    size: 25 * 1024 * 1024,
    // Stopping the stack should not wait out the default 30 s for an idle pooled connection.
    closeTimeout: 2_000,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', callback);
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error('Message is larger than 25 MB'), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks);
        const mailFrom = session.envelope.mailFrom;
        const envelope = {
          from: mailFrom === false ? '' : mailFrom.address,
          to: envelopeAddresses(session.envelope.rcptTo),
        };
        toCaughtMessage(raw, envelope)
          .then((message) => {
            writeAtomically(join(options.outboxDir, `${message.id}.eml`), raw);
            writeAtomically(join(options.outboxDir, `${message.id}.json`), `${JSON.stringify(message, null, 2)}\n`);
            callback(null, `Caught as ${message.id}`);
          })
          .catch((error: unknown) => {
            process.stderr.write(`[mail] could not store a message: ${String(error)}\n`);
            callback(error instanceof Error ? error : new Error(String(error)));
          });
      });
    },
  });

  return new Promise((resolve, reject) => {
    const onStartError = (error: NodeJS.ErrnoException) => {
      reject(
        error.code === 'EADDRINUSE' ? new Error(`Port ${options.port} (SMTP mail catcher) is already in use.`) : error,
      );
    };
    server.once('error', onStartError);
    server.listen(options.port, options.host ?? '127.0.0.1', () => {
      server.off('error', onStartError);
      server.on('error', (error) => process.stderr.write(`[mail] ${error.message}\n`));
      const address = server.server.address();
      const port = typeof address === 'object' && address !== null ? address.port : options.port;
      resolve({ port, close: () => new Promise<void>((done) => server.close(() => done())) });
    });
  });
}
