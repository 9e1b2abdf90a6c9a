import { randomUUID } from 'node:crypto';
import { ForbiddenError } from '@casl/ability';
import {
  flushOrderRooms,
  isWholeFlushOrder,
  SIGNATURE_MAX_BYTES,
  type JobSheet,
  type JobSignature,
  type SignatureInput,
  type SignatureKind,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Readable } from 'node:stream';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { HttpError, notFound } from '../../lib/http-error.ts';
import { runIdempotent } from '../../lib/idempotency.ts';
import { checkTapAfter } from '../../middleware/tapped-at.ts';
import { setSiteFlushOrder } from '../sites/site-dal.ts';
import { lockOpenJob, parseSurvey, requireJob, throwUnlessMayUpdateJob } from './job-access.ts';
import type { JobRow } from './job-dal.ts';
import { writeSheet, type SheetWriteMeta } from './job-sheet-service.ts';
import { findSignature, upsertSignature } from './visit-dal.ts';

const invalid = (path: string, message: string) => new HttpError(422, message, 'ValidationFailed', [{ path, message }]);

/** Sets the order the job's radiators are flushed in; it is kept on the site for the next visit. */
export function setFlushOrder(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  radiatorIndexes: number[],
  meta?: SheetWriteMeta,
): Promise<JobSheet> {
  const work = async (trx: Knex.Transaction, row: JobRow) => {
    const rooms = parseSurvey(row).radiators.map((r) => r.room);
    if (!isWholeFlushOrder(radiatorIndexes, rooms.length)) {
      throw invalid(
        'radiatorIndexes',
        `Put every radiator of the survey in the order once: ${rooms.length} radiators, numbered 0 to ${rooms.length - 1}.`,
      );
    }
    await setSiteFlushOrder(trx, actor.firmId, row.site_id, flushOrderRooms(radiatorIndexes, rooms));
  };
  return writeSheet(deps, actor, jobId, work, meta);
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const MAX_SIDE_PX = 4000;

/**
 * The PNG inside a data URL, checked from its bytes: the 8-byte PNG signature, then an IHDR chunk
 * with a sane width and height (PNG specification, sections 5.2 and 11.2.2). The schema already
 * bounded the text; the decoded size is bounded again here.
 */
export function decodeSignaturePng(dataUrl: string): Buffer {
  const png = Buffer.from(dataUrl.slice(dataUrl.indexOf(',') + 1), 'base64');
  const refuse = (message: string) => invalid('imagePngDataUrl', message);
  if (png.length > SIGNATURE_MAX_BYTES) throw refuse('The signature image must be at most 64 kB.');
  if (png.length < 33 || !png.subarray(0, 8).equals(PNG_SIGNATURE) || png.toString('latin1', 12, 16) !== 'IHDR') {
    throw refuse('The signature is not a PNG image: draw it again.');
  }
  const width = png.readUInt32BE(16);
  const height = png.readUInt32BE(20);
  if (width < 1 || height < 1 || width > MAX_SIDE_PX || height > MAX_SIDE_PX) {
    throw refuse(`The signature image must be between 1 and ${MAX_SIDE_PX} pixels each way.`);
  }
  return png;
}

const signatureUrl = (jobId: number, kind: SignatureKind) => `/api/jobs/${jobId}/signatures/${kind}`;

/**
 * Stores a customer's drawn signature on an open job, at most once per Idempotency-Key (a replay answers the
 * first and uploads nothing): the PNG goes to the object store inside the key's transaction and is removed
 * again if its row cannot be written (as photos are); signing the same kind again replaces the earlier one,
 * whose object is removed after the commit. The time shown is the engineer's (X-Tapped-At) where sent.
 */
export async function addSignature(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  input: SignatureInput,
  meta: SheetWriteMeta = {},
): Promise<JobSignature> {
  const png = decodeSignaturePng(input.imagePngDataUrl);
  const row = await requireJob(deps.db, actor.firmId, jobId);
  throwUnlessMayUpdateJob(actor, row);
  const tappedAt = meta.tappedAt ?? null;
  checkTapAfter(tappedAt, row.created_at);
  const key = `firms/${actor.firmId}/signatures/${randomUUID()}.png`;
  const signedAt = deps.clock.now();
  let uploaded = false;
  let replaced: string | undefined;
  try {
    const out = await runIdempotent(deps, actor, meta.idempotencyKey, `signature ${jobId}`, async (trx) => {
      await lockOpenJob(trx, actor, jobId);
      if (!uploaded) {
        await deps.objectStore.put(key, png, 'image/png');
        uploaded = true;
      }
      replaced = (await findSignature(trx, actor.firmId, jobId, input.kind))?.object_key;
      await upsertSignature(trx, {
        firm_id: actor.firmId,
        job_id: jobId,
        kind: input.kind,
        signer_name: input.name,
        object_key: key,
        byte_size: png.length,
        signed_at: signedAt,
        tapped_at: tappedAt,
        recorded_by_user_id: actor.userId,
      });
      const signature: JobSignature = {
        kind: input.kind,
        name: input.name,
        signedAt: (tappedAt ?? signedAt).toISOString(),
        url: signatureUrl(jobId, input.kind),
      };
      return { status: 201, body: signature };
    });
    if (replaced && !out.replayed) await removeObject(deps, replaced);
    return out.body;
  } catch (err) {
    if (uploaded) await removeObject(deps, key);
    throw err;
  }
}

async function removeObject(deps: AppDeps, key: string): Promise<void> {
  await deps.objectStore
    .delete(key)
    .catch((e: unknown) => deps.logger.error({ err: e, key }, 'could not remove a signature object'));
}

export async function openSignature(
  deps: AppDeps,
  actor: Actor,
  jobId: number,
  kind: SignatureKind,
): Promise<{ body: Readable; byteSize: number }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  await requireJob(deps.db, actor.firmId, jobId);
  const row = await findSignature(deps.db, actor.firmId, jobId, kind);
  if (!row) throw notFound('That signature');
  return { body: await deps.objectStore.get(row.object_key), byteSize: row.byte_size };
}
