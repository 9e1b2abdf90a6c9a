import { randomUUID } from 'node:crypto';
import { ForbiddenError } from '@casl/ability';
import { fileTypeFromBuffer } from 'file-type';
import { photoContentTypes, type Photo } from '@heatfleet/domain';
import type { Readable } from 'node:stream';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { HttpError, notFound } from '../../lib/http-error.ts';

const extensionFor: Record<(typeof photoContentTypes)[number], string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };

interface PhotoRow {
  id: number;
  object_key: string;
  content_type: Photo['contentType'];
  byte_size: number;
  caption: string | null;
  created_at: Date;
}

const toPhoto = (r: PhotoRow): Photo => ({
  id: r.id,
  url: `/api/photos/${r.id}/content`,
  contentType: r.content_type,
  byteSize: r.byte_size,
  caption: r.caption,
  createdAt: r.created_at.toISOString(),
});

/**
 * Stores an uploaded photo. The type comes from the bytes (a renamed executable is refused
 * whatever its name or declared type); the key is ours, under the firm's prefix. The object is
 * written first and removed again if the row cannot be, so a failure leaves neither behind.
 */
export async function savePhoto(deps: AppDeps, actor: Actor, file: Buffer, opts: { itemId?: number; caption?: string }): Promise<Photo> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Photo');
  const detected = await fileTypeFromBuffer(file);
  const type = photoContentTypes.find((t) => t === detected?.mime);
  if (!type) {
    throw new HttpError(422, `That file is ${detected ? `a ${detected.ext.toUpperCase()} file` : 'not an image'}; upload a JPEG, PNG or WebP photo.`, 'ValidationFailed', [
      { path: 'photo', message: 'Upload a JPEG, PNG or WebP photo.' },
    ]);
  }
  if (opts.itemId !== undefined && !(await deps.db('kit_items').where({ firm_id: actor.firmId, id: opts.itemId }).first('id'))) throw notFound('That item');
  const key = `firms/${actor.firmId}/photos/${randomUUID()}.${extensionFor[type]}`;
  await deps.objectStore.put(key, file, type);
  try {
    const [id] = await deps.db('photos').insert({
      firm_id: actor.firmId,
      item_id: opts.itemId ?? null,
      object_key: key,
      content_type: type,
      byte_size: file.length,
      caption: opts.caption ?? null,
      uploaded_by_user_id: actor.userId,
    });
    return toPhoto((await deps.db('photos').where({ firm_id: actor.firmId, id }).first()) as PhotoRow);
  } catch (err) {
    await deps.objectStore.delete(key).catch((e: unknown) => deps.logger.error({ err: e, key }, 'could not remove an orphaned photo object'));
    throw err;
  }
}

export async function openPhoto(deps: AppDeps, actor: Actor, id: number): Promise<{ photo: Photo; body: Readable }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Photo');
  const row = (await deps.db('photos').where({ firm_id: actor.firmId, id }).first()) as PhotoRow | undefined;
  if (!row) throw notFound('That photo');
  return { photo: toPhoto(row), body: await deps.objectStore.get(row.object_key) };
}
