import type { Photo } from '@heatfleet/domain';

export function PhotoGallery({ photos, alt }: { photos: Photo[]; alt: string }) {
  if (photos.length === 0) return <p className="text-ink-muted">No photos yet.</p>;
  return (
    <ul aria-label="Photos" className="grid grid-cols-2 gap-3 sm:grid-cols-4">
      {photos.map((photo) => (
        <li key={photo.id}>
          <a
            href={photo.url}
            target="_blank"
            rel="noreferrer"
            className="block overflow-hidden rounded-md border border-line"
          >
            <img
              src={photo.url}
              alt={photo.caption ?? alt}
              loading="lazy"
              className="aspect-square w-full object-cover"
            />
          </a>
        </li>
      ))}
    </ul>
  );
}
