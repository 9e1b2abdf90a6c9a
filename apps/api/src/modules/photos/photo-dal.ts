import type { Knex } from 'knex';
import type { Photo } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface PhotoRow {
  id: number;
  object_key: string;
  content_type: Photo['contentType'];
  byte_size: number;
  caption: string | null;
  created_at: Date;
  tapped_at?: Date | null;
}

/** createdAt is the engineer's time (the tap) where the phone said it, else when it arrived. */
export const toPhoto = (
  r: Pick<PhotoRow, 'id' | 'content_type' | 'byte_size' | 'caption' | 'created_at' | 'tapped_at'>,
): Photo => ({
  id: r.id,
  url: `/api/photos/${r.id}/content`,
  contentType: r.content_type,
  byteSize: r.byte_size,
  caption: r.caption,
  createdAt: (r.tapped_at ?? r.created_at).toISOString(),
});

export async function findPhoto(db: Db, firmId: number, id: number): Promise<PhotoRow | undefined> {
  return (await db('photos').where({ firm_id: firmId, id }).first()) as PhotoRow | undefined;
}

export async function photoExists(db: Db, firmId: number, id: number): Promise<boolean> {
  return Boolean(await db('photos').where({ firm_id: firmId, id }).first('id'));
}

/** An item's photos, newest first. */
export async function listItemPhotos(db: Db, firmId: number, itemId: number): Promise<Photo[]> {
  const rows = (await db('photos')
    .where({ firm_id: firmId, item_id: itemId })
    .orderBy('id', 'desc')
    .select('id', 'content_type', 'byte_size', 'caption', 'created_at', 'tapped_at')) as Pick<
    PhotoRow,
    'id' | 'content_type' | 'byte_size' | 'caption' | 'created_at' | 'tapped_at'
  >[];
  return rows.map(toPhoto);
}

/** Files a photo under an item, unless it already belongs to one. */
export async function attachPhotoToItem(
  trx: Knex.Transaction,
  firmId: number,
  photoId: number,
  itemId: number,
): Promise<void> {
  await trx('photos').where({ firm_id: firmId, id: photoId }).whereNull('item_id').update({ item_id: itemId });
}

export interface NewPhotoRow {
  item_id: number | null;
  job_id: number | null;
  tag: string | null;
  object_key: string;
  content_type: Photo['contentType'];
  byte_size: number;
  caption: string | null;
  uploaded_by_user_id: number;
  tapped_at?: Date | null;
}

export async function insertPhoto(trx: Knex.Transaction, firmId: number, row: NewPhotoRow): Promise<number> {
  const [id] = await trx('photos').insert({ firm_id: firmId, ...row });
  return id as number;
}
