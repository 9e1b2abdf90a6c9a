import { deflateSync } from 'node:zlib';
import { expect, type BrowserContext, type Page } from '@playwright/test';
import type { OutboxMessage, OutboxMessageSummary, SessionEnvelope } from '@heatfleet/domain';
import { callApi, openApiSession } from './api-session';
import { signUpFirm, type Firm, type Person } from './firm-fixtures';

// Working offline (README): the service worker, the status line, and what the app keeps in IndexedDB.

/** A phone in portrait: the size and touch of a common handset. */
export const phone = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true } as const;

/** The status line every signed-in screen shows: "Offline", "3 changes waiting to send" or "All saved". */
export function statusLine(page: Page) {
  return page.getByRole('status', { name: 'Saving' });
}

/** Waits until the service worker controls the page, so a reload with no signal is served from its cache. */
export async function waitForServiceWorker(page: Page): Promise<void> {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (navigator.serviceWorker.controller) return;
    await new Promise<void>((resolve) =>
      navigator.serviceWorker.addEventListener('controllerchange', () => resolve(), { once: true }),
    );
  });
}

/** Every key in one of the app's IndexedDB stores (lib/offline/scope.ts names them). */
export async function storedKeys(page: Page, kind: 'drafts' | 'outbox' | 'query-cache'): Promise<string[]> {
  return page.evaluate(async (name) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const request = indexedDB.open(`heatfleet-${name}`);
      request.onupgradeneeded = () => request.result.createObjectStore(name);
      request.onsuccess = () => resolve(request.result);
      request.onerror = () => reject(request.error);
    });
    try {
      if (!db.objectStoreNames.contains(name)) return [];
      const keys = await new Promise<IDBValidKey[]>((resolve, reject) => {
        const request = db.transaction(name, 'readonly').objectStore(name).getAllKeys();
        request.onsuccess = () => resolve(request.result);
        request.onerror = () => reject(request.error);
      });
      return keys.map(String);
    } finally {
      db.close();
    }
  }, kind);
}

/** The labels of the writes kept in the phone's queue, oldest first, with their state. */
export async function queuedWrites(page: Page): Promise<{ label: string; state: string; path: string }[]> {
  return page.evaluate(async () => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const request = indexedDB.open('heatfleet-outbox');
      request.onupgradeneeded = () => request.result.createObjectStore('outbox');
      request.onsuccess = () => resolve(request.result);
      request.onerror = () => reject(request.error);
    });
    try {
      const all = await new Promise<{ label: string; state: string; path: string; seq: string }[]>(
        (resolve, reject) => {
          const request = db.transaction('outbox', 'readonly').objectStore('outbox').getAll();
          request.onsuccess = () => resolve(request.result as never);
          request.onerror = () => reject(request.error);
        },
      );
      return all.sort((a, b) => (a.seq < b.seq ? -1 : 1)).map(({ label, state, path }) => ({ label, state, path }));
    } finally {
      db.close();
    }
  });
}

/** The query keys of the saved query cache (what the app can show with no signal). */
export async function savedQueryKeys(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const request = indexedDB.open('heatfleet-query-cache');
      request.onupgradeneeded = () => request.result.createObjectStore('query-cache');
      request.onsuccess = () => resolve(request.result);
      request.onerror = () => reject(request.error);
    });
    try {
      const clients = await new Promise<{ clientState: { queries: { queryKey: unknown }[] } }[]>((resolve, reject) => {
        const request = db.transaction('query-cache', 'readonly').objectStore('query-cache').getAll();
        request.onsuccess = () => resolve(request.result as never);
        request.onerror = () => reject(request.error);
      });
      return clients.flatMap((client) => client.clientState.queries.map((query) => JSON.stringify(query.queryKey)));
    } finally {
      db.close();
    }
  });
}

/** Waits until the app has saved what the screen shows (it saves at most once a second). */
export async function expectSaved(page: Page, ...queryKeys: unknown[][]): Promise<void> {
  for (const key of queryKeys) {
    await expect
      .poll(() => savedQueryKeys(page), { message: `saved ${JSON.stringify(key)}` })
      .toContain(JSON.stringify(key));
  }
}

/** Records the Idempotency-Key and X-Tapped-At of every write to paths matching `pattern`. */
export function watchWrites(context: BrowserContext, pattern: RegExp) {
  const seen: { method: string; path: string; key: string | undefined; tappedAt: string | undefined }[] = [];
  context.on('request', (request) => {
    const path = new URL(request.url()).pathname;
    if (request.method() === 'GET' || !pattern.test(path)) return;
    const headers = request.headers();
    seen.push({ method: request.method(), path, key: headers['idempotency-key'], tappedAt: headers['x-tapped-at'] });
  });
  return seen;
}

/** A camera-sized PNG (one colour, a few kilobytes compressed), made here rather than kept as a file. */
export function photoPng(width: number, height: number): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k += 1) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (bytes: Buffer) => {
    let c = 0xffffffff;
    for (const byte of bytes) c = crcTable[(c ^ byte) & 0xff]! ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const out = Buffer.alloc(body.length + 8);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc(body), body.length + 4);
    return out;
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB
  const row = Buffer.alloc(1 + width * 3);
  for (let x = 0; x < width; x += 1) row.set([0xe9, 0x87, 0x3a], 1 + x * 3);
  const raw = Buffer.concat(Array.from({ length: height }, () => row));
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([
    signature,
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** A JPEG's width and height, from its start-of-frame marker. */
export function jpegSize(jpeg: Buffer): { width: number; height: number } {
  let at = 2;
  while (at < jpeg.length) {
    const marker = jpeg[at + 1]!;
    const length = jpeg.readUInt16BE(at + 2);
    if (marker >= 0xc0 && marker <= 0xc3)
      return { height: jpeg.readUInt16BE(at + 5), width: jpeg.readUInt16BE(at + 7) };
    at += 2 + length;
  }
  throw new Error('No start-of-frame marker in the JPEG.');
}

/** The engineer joins a second firm with the same account, as a person working for two firms would. */
export async function joinSecondFirm(baseURL: string, person: Person): Promise<Firm> {
  const other = await signUpFirm(baseURL, 'Morwenna Hale');
  await callApi(other.owner.session, 'post', '/api/invitations', { data: { email: person.email, role: 'engineer' } });
  // Their first firm's invitation went to the same address: take the one naming this firm.
  let invitation: OutboxMessageSummary | undefined;
  await expect
    .poll(async () => {
      const { messages } = await callApi<{ messages: OutboxMessageSummary[] }>(
        other.owner.session,
        'get',
        '/api/outbox',
      );
      invitation = messages.find((m) => m.to.includes(person.email) && m.subject.includes(other.name));
      return invitation !== undefined;
    })
    .toBe(true);
  const { message } = await callApi<{ message: OutboxMessage }>(
    other.owner.session,
    'get',
    `/api/outbox/${invitation!.id}`,
  );
  const token = new URL(message.links.find((l) => new URL(l).pathname.startsWith('/invitations/'))!).pathname
    .split('/')
    .pop()!;
  const session = await openApiSession(baseURL);
  await callApi<SessionEnvelope>(session, 'post', `/api/invitations/by-token/${token}/accept`, {
    data: { password: person.password },
    status: 200,
  });
  return other;
}
