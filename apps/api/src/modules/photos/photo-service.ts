import { randomUUID } from 'node:crypto';
import { ForbiddenError } from '@casl/ability';
import { fileTypeFromBuffer } from 'file-type';
import { photoContentTypes, type Photo } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Readable } from 'node:stream';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { HttpError, notFound } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { findItemId } from '../kits/kit-item-dal.ts';
import { findPhoto, insertPhoto, toPhoto } from './photo-dal.ts';

const extensionFor: Record<(typeof photoContentTypes)[number], string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
};

export interface SavePhotoOptions {
  itemId?: number;
  /** A job's photo, tagged by what it shows; the caller has checked the job. */
  jobId?: number;
  tag?: string;
  caption?: string;
  /** Runs in the row's transaction before the insert (e.g. locks the job and checks it is still open). */
  guard?: (trx: Knex.Transaction) => Promise<void>;
  /** At most once per key: a retry (a queued upload sent again) answers the first photo and stores nothing. */
  idempotencyKey?: IdempotencyKey | undefined;
  /** When the engineer took it (X-Tapped-At), kept beside when it arrived. */
  tappedAt?: Date | null;
}

/**
 * Stores an uploaded photo. The type comes from the bytes (a renamed executable is refused
 * whatever its name or declared type); the key is ours, under the firm's prefix. The object is
 * written first and removed again if the row cannot be (or the guard refuses), so a failure leaves
 * neither behind.
 */
export async function savePhoto(deps: AppDeps, actor: Actor, file: Buffer, opts: SavePhotoOptions): Promise<Photo> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Photo');
  const detected = await fileTypeFromBuffer(file);
  const type = photoContentTypes.find((t) => t === detected?.mime);
  if (!type) {
    throw new HttpError(
      422,
      `That file is ${detected ? `a ${detected.ext.toUpperCase()} file` : 'not an image'}; upload a JPEG, PNG or WebP photo.`,
      'ValidationFailed',
      [{ path: 'photo', message: 'Upload a JPEG, PNG or WebP photo.' }],
    );
  }
  if (opts.itemId !== undefined && !(await findItemId(deps.db, actor.firmId, opts.itemId))) throw notFound('That item');
  const key = `firms/${actor.firmId}/photos/${randomUUID()}.${extensionFor[type]}`;
  let uploaded = false;
  try {
    // The key row first (a replay stops there, before any upload), then the object, then its row.
    const out = await runIdempotent(deps, actor, opts.idempotencyKey, 'photo', async (trx) => {
      if (!uploaded) {
        await deps.objectStore.put(key, file, type);
        uploaded = true;
      }
      await opts.guard?.(trx);
      const id = await insertPhoto(trx, actor.firmId, {
        item_id: opts.itemId ?? null,
        job_id: opts.jobId ?? null,
        tag: opts.tag ?? null,
        object_key: key,
        content_type: type,
        byte_size: file.length,
        caption: opts.caption ?? null,
        uploaded_by_user_id: actor.userId,
        tapped_at: opts.tappedAt ?? null,
      });
      return { status: 201, body: toPhoto((await findPhoto(trx, actor.firmId, id))!) };
    });
    if (out.replayed && uploaded) await removeOrphan(deps, key);
    return out.body;
  } catch (err) {
    if (uploaded) await removeOrphan(deps, key);
    throw err;
  }
}

async function removeOrphan(deps: AppDeps, key: string): Promise<void> {
  await deps.objectStore
    .delete(key)
    .catch((e: unknown) => deps.logger.error({ err: e, key }, 'could not remove an orphaned photo object'));
}

export async function openPhoto(deps: AppDeps, actor: Actor, id: number): Promise<{ photo: Photo; body: Readable }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Photo');
  const row = await findPhoto(deps.db, actor.firmId, id);
  if (!row) throw notFound('That photo');
  return { photo: toPhoto(row), body: await deps.objectStore.get(row.object_key) };
}
