/** The long side a photo is brought down to on the phone before it is queued or sent (README, Working offline). */
export const PHOTO_LONG_SIDE_PX = 2000;
const JPEG_QUALITY = 0.85;

/** The size a photo is drawn at: the long side at most `longSide`, never enlarged. */
export function shrunkSize(width: number, height: number, longSide = PHOTO_LONG_SIDE_PX) {
  const scale = Math.min(1, longSide / Math.max(width, height));
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

function jpegName(name: string): string {
  const base = name.replace(/\.[^./\\]*$/, '') || 'photo';
  return `${base}.jpg`;
}

/**
 * A phone photo is often 4,000 px and 5 MB: on one bar of signal, or waiting in the queue, that is too much. It is
 * redrawn as a JPEG with the long side at most 2,000 px, upright as the camera meant it. A photo the browser
 * cannot read is kept as it is, for the server to judge.
 */
export async function shrinkPhoto(photo: Blob): Promise<File> {
  const name = photo instanceof File ? photo.name : 'photo.jpg';
  try {
    const bitmap = await createImageBitmap(photo, { imageOrientation: 'from-image' });
    const size = shrunkSize(bitmap.width, bitmap.height);
    const canvas = document.createElement('canvas');
    canvas.width = size.width;
    canvas.height = size.height;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('No 2D canvas.');
    // JPEG has no transparency: a PNG's clear pixels become white rather than black.
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, size.width, size.height);
    context.drawImage(bitmap, 0, 0, size.width, size.height);
    bitmap.close();
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/jpeg', JPEG_QUALITY));
    if (!blob) throw new Error('The photo could not be encoded.');
    return new File([blob], jpegName(name), { type: 'image/jpeg' });
  } catch {
    return photo instanceof File ? photo : new File([photo], name, { type: photo.type });
  }
}
