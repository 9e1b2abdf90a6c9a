import { PHOTO_MAX_BYTES, photoContentTypes, photoResponseSchema, type Photo } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const megabytes = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

/** The same limits the server checks, so a phone on one bar of signal does not send 30 MB to be refused. */
export function photoProblem(file: File): string | null {
  if (!(photoContentTypes as readonly string[]).includes(file.type)) {
    return `"${file.name}" is not a JPEG, PNG or WebP photo.`;
  }
  if (file.size > PHOTO_MAX_BYTES) {
    return `"${file.name}" is ${megabytes(file.size)}; a photo may be up to ${megabytes(PHOTO_MAX_BYTES)}.`;
  }
  return null;
}

export async function uploadPhoto(file: File, itemId?: number): Promise<Photo> {
  const form = new FormData();
  form.append('photo', file);
  if (itemId !== undefined) form.append('itemId', String(itemId));
  return (await apiClient.upload('/api/photos', form, photoResponseSchema)).photo;
}
