import { useEffect, useRef, useState, type FormEvent } from 'react';
import { jobPhotoTagLabels, jobPhotoTags, type JobSheet } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useUploadJobPhoto } from '@/features/jobs/api/use-job-sheet-mutations';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';
import { formatClock } from '@/features/jobs/components/sheet-format';

type PhotoTag = (typeof jobPhotoTags)[number];
const MAX_BYTES = 8 * 1024 * 1024;
const acceptedTypes = ['image/jpeg', 'image/png', 'image/webp'];

function tagLabel(tag: string | null): string {
  if (tag === null) return 'Photo';
  return tag in jobPhotoTagLabels ? jobPhotoTagLabels[tag as PhotoTag] : tag;
}

/** A local preview of the chosen file, released again when it changes. */
function usePreview(file: File | null): string | null {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    if (!file) {
      setUrl(null);
      return;
    }
    const next = URL.createObjectURL(file);
    setUrl(next);
    return () => URL.revokeObjectURL(next);
  }, [file]);
  return url;
}

function AddPhotoForm({ jobId }: { jobId: number }) {
  const inputRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [tag, setTag] = useState<PhotoTag>('magnet_before');
  const [caption, setCaption] = useState('');
  const [fileError, setFileError] = useState<string | undefined>();
  const upload = useUploadJobPhoto(jobId);
  const preview = usePreview(file);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) return setFileError('Take or choose a photo first.');
    // The server judges the type by the bytes; this only spares a long upload on a weak signal.
    if (file.type && !acceptedTypes.includes(file.type)) return setFileError('Choose a JPEG, PNG or WebP photo.');
    if (file.size > MAX_BYTES) return setFileError('The photo must be at most 8 MB.');
    setFileError(undefined);
    upload.mutate(
      { file, tag, caption },
      {
        onSuccess: () => {
          setFile(null);
          setCaption('');
          if (inputRef.current) inputRef.current.value = '';
        },
      },
    );
  };

  return (
    <form
      aria-label="Add a photo"
      noValidate
      onSubmit={submit}
      className="space-y-3 rounded-lg border border-line-strong p-3 [&_input:not([type=file])]:min-h-12 [&_select]:min-h-12"
    >
      <div className="flex flex-col gap-1">
        <label htmlFor={`job-${jobId}-photo`} className="font-semibold">
          Photo
        </label>
        <input
          ref={inputRef}
          id={`job-${jobId}-photo`}
          type="file"
          accept="image/*"
          capture="environment"
          aria-invalid={fileError ? true : undefined}
          className="block w-full max-w-full text-base file:mr-3 file:min-h-12 file:rounded-md file:border-0 file:bg-brand-700 file:px-4 file:font-semibold file:text-white"
          onChange={(e) => {
            upload.reset();
            setFileError(undefined);
            setFile(e.target.files?.[0] ?? null);
          }}
        />
        {fileError ? <p className="text-sm font-semibold text-danger-700">{fileError}</p> : null}
      </div>
      {preview ? (
        <img src={preview} alt="The chosen photo" className="max-h-48 rounded-md border border-line object-contain" />
      ) : null}
      <SelectField
        label="What it shows"
        value={tag}
        onChange={(e) => setTag(e.target.value as PhotoTag)}
        options={jobPhotoTags.map((t) => ({ value: t, label: jobPhotoTagLabels[t] }))}
      />
      <TextField
        label="Caption (optional)"
        name="caption"
        maxLength={200}
        value={caption}
        onChange={(e) => setCaption(e.target.value)}
      />
      <SaveFeedback error={upload.error} saved={upload.isSuccess} />
      {upload.isSuccess && navigator.onLine === false ? (
        <p role="status" className="text-sm font-semibold text-ink-muted">
          No signal: the photo is shrunk and saved on this phone, and goes when the signal returns.
        </p>
      ) : null}
      <Button type="submit" variant="secondary" className="min-h-12 w-full sm:w-auto" busy={upload.isPending}>
        Add the photo
      </Button>
    </form>
  );
}

export function JobPhotos({ jobId, sheet, timeZone }: { jobId: number; sheet: JobSheet; timeZone: string }) {
  return (
    <div className="space-y-4">
      {sheet.photos.length === 0 ? (
        <p className="text-ink-muted">No photos yet.</p>
      ) : (
        <ul aria-label="Photos" className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          {sheet.photos.map((photo) => (
            <li key={photo.id}>
              <figure className="space-y-1">
                {photo.url ? (
                  <a href={photo.url} target="_blank" rel="noreferrer" className="block">
                    <img
                      src={photo.url}
                      alt={photo.caption ?? tagLabel(photo.tag)}
                      loading="lazy"
                      className="aspect-square w-full rounded-md border border-line bg-canvas object-cover"
                    />
                  </a>
                ) : (
                  // Kept in the phone's queue (shrunk), not on the server yet.
                  <p className="grid aspect-square w-full place-items-center rounded-md border-2 border-dashed border-line-strong p-2 text-center text-sm font-semibold text-ink-muted">
                    Saved on this phone; goes when there is signal
                  </p>
                )}
                <figcaption className="text-sm">
                  <span className="block font-semibold">{tagLabel(photo.tag)}</span>
                  {photo.caption ? <span className="block break-words">{photo.caption}</span> : null}
                  <span className="block text-ink-muted">{formatClock(photo.createdAt, timeZone)}</span>
                </figcaption>
              </figure>
            </li>
          ))}
        </ul>
      )}
      {sheet.editable ? <AddPhotoForm jobId={jobId} /> : null}
    </div>
  );
}
