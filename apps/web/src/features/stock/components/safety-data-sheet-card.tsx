import { useRef, useState } from 'react';
import type { Product } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format';
import { useUploadSafetyDataSheet } from '@/features/stock/api/use-save-product';

const MAX_BYTES = 10 * 1024 * 1024;

function sizeText(bytes: number): string {
  return bytes >= 1024 * 1024
    ? `${(bytes / (1024 * 1024)).toFixed(1)} MB`
    : `${Math.max(1, Math.round(bytes / 1024))} KB`;
}

/** The product's safety data sheet: download the current one, or upload a PDF to replace it. */
export function SafetyDataSheetCard({
  product,
  canUpload,
  timeZone,
}: {
  product: Product;
  canUpload: boolean;
  timeZone: string;
}) {
  const upload = useUploadSafetyDataSheet();
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const sds = product.safetyDataSheet;
  return (
    <div className="space-y-3">
      {sds ? (
        <p>
          Uploaded {formatDateTime(sds.uploadedAt, timeZone)}, {sizeText(sds.byteSize)}.{' '}
          <a href={sds.url} download className="font-semibold text-brand-700 underline underline-offset-4">
            Download the safety data sheet
          </a>
        </p>
      ) : (
        <Alert tone="error">
          No safety data sheet yet. Engineers must be able to read it before using the product.
        </Alert>
      )}
      {canUpload ? (
        <form
          aria-label="Upload safety data sheet"
          className="space-y-3"
          onSubmit={(event) => {
            event.preventDefault();
            setDone(false);
            if (!file) return setProblem('Choose a PDF first.');
            if (file.size > MAX_BYTES) return setProblem('That file is over 10 MB.');
            setProblem(null);
            upload.mutate(
              { id: product.id, file },
              {
                onSuccess: () => {
                  setDone(true);
                  setFile(null);
                  if (input.current) input.current.value = '';
                },
                onError: (error) => setProblem(error.message),
              },
            );
          }}
        >
          <label className="flex flex-col gap-1">
            <span className="font-semibold">
              {sds ? 'Replace with a new PDF' : 'Safety data sheet (PDF, up to 10 MB)'}
            </span>
            <input
              ref={input}
              type="file"
              accept="application/pdf,.pdf"
              className="min-h-12 w-full text-base file:mr-3 file:min-h-12 file:rounded-md file:border file:border-line-strong file:bg-card file:px-3 file:font-semibold"
              onChange={(event) => setFile(event.target.files?.[0] ?? null)}
            />
          </label>
          {problem ? <Alert tone="error">{problem}</Alert> : null}
          {done ? <Alert tone="success">Safety data sheet uploaded.</Alert> : null}
          <Button type="submit" variant="secondary" busy={upload.isPending}>
            Upload
          </Button>
        </form>
      ) : null}
    </div>
  );
}
