import { useCallback } from 'react';
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import {
  jobPhotoResponseSchema,
  jobSheetResponseSchema,
  jobSignatureResponseSchema,
  type SignatureInput,
  type JobDetail,
  type JobSheet,
  type JobStep,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { jobQueries } from '@/features/jobs/api/job-queries';

// Every sheet write answers with the whole sheet, so the job's cached detail takes it as it is. Writes
// overlap (a reading saving while a flush is ticked), so per job: an answer older than the one stored
// is not stored; a read of the job in flight when a write starts is cancelled (it may predate the
// write); and in either case the job is read again once no write is in flight, so it settles on the
// server's last word.
interface SheetWrites {
  started: number;
  lastStored: number;
  inFlight: number;
  readAgain: boolean;
}
const writesByJob = new Map<number, SheetWrites>();

async function writeSheet(queryClient: QueryClient, jobId: number, write: () => Promise<{ sheet: JobSheet }>) {
  const writes = writesByJob.get(jobId) ?? { started: 0, lastStored: 0, inFlight: 0, readAgain: false };
  writesByJob.set(jobId, writes);
  const key = jobQueries.detail(jobId).queryKey;
  const seq = ++writes.started;
  writes.inFlight += 1;
  if (queryClient.isFetching({ queryKey: key }) > 0) {
    void queryClient.cancelQueries({ queryKey: key });
    writes.readAgain = true;
  }
  try {
    const { sheet } = await write();
    if (seq > writes.lastStored) {
      writes.lastStored = seq;
      queryClient.setQueryData<JobDetail>(key, (old) => (old ? { ...old, sheet } : old));
    } else {
      writes.readAgain = true;
    }
    return sheet;
  } finally {
    writes.inFlight -= 1;
    if (writes.inFlight === 0 && writes.readAgain) {
      writes.readAgain = false;
      void queryClient.invalidateQueries({ queryKey: key });
    }
  }
}

function useSheetWrite<V>(jobId: number, write: (variables: V) => Promise<{ sheet: JobSheet }>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (variables: V) => writeSheet(queryClient, jobId, () => write(variables)),
  });
}

/** One PUT under the job (a path like `/radiators/2/readings/before`), its answer stored: for the fields that save themselves. */
export function useSheetPut(jobId: number) {
  const queryClient = useQueryClient();
  return useCallback(
    async (path: string, body: unknown): Promise<void> => {
      await writeSheet(queryClient, jobId, () =>
        apiClient.put(`/api/jobs/${jobId}${path}`, body, jobSheetResponseSchema),
      );
    },
    [jobId, queryClient],
  );
}

export function useTickStep(jobId: number) {
  return useSheetWrite(jobId, ({ step, done }: { step: JobStep; done: boolean }) =>
    apiClient.put(`/api/jobs/${jobId}/steps/${step}`, { done }, jobSheetResponseSchema),
  );
}

export function useTickFlushed(jobId: number) {
  return useSheetWrite(jobId, ({ index, done }: { index: number; done: boolean }) =>
    apiClient.put(`/api/jobs/${jobId}/radiators/${index}/flushed`, { done }, jobSheetResponseSchema),
  );
}

export function useUploadJobPhoto(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, tag, caption }: { file: File; tag: string; caption: string }) => {
      const form = new FormData();
      form.append('tag', tag);
      if (caption.trim()) form.append('caption', caption.trim());
      // The file goes last: the server may stream it before it has read the fields after it.
      form.append('photo', file);
      return (await apiClient.upload(`/api/jobs/${jobId}/photos`, form, jobPhotoResponseSchema)).photo;
    },
    onSuccess: (photo) => {
      queryClient.setQueryData<JobDetail>(jobQueries.detail(jobId).queryKey, (old) =>
        old
          ? { ...old, sheet: { ...old.sheet, photos: [...old.sheet.photos.filter((p) => p.id !== photo.id), photo] } }
          : old,
      );
    },
  });
}

/** The flush order, set once: kept on the site, so the next visit starts with it. */
export function useSetFlushOrder(jobId: number) {
  return useSheetWrite(jobId, (radiatorIndexes: number[]) =>
    apiClient.put(`/api/jobs/${jobId}/flush-order`, { radiatorIndexes }, jobSheetResponseSchema),
  );
}

/** The customer's drawn signature; signing again replaces it. The sheet lists it at once. */
export function useAddSignature(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: SignatureInput) =>
      (await apiClient.post(`/api/jobs/${jobId}/signatures`, input, jobSignatureResponseSchema)).signature,
    onSuccess: (signature) => {
      queryClient.setQueryData<JobDetail>(jobQueries.detail(jobId).queryKey, (old) =>
        old
          ? {
              ...old,
              sheet: {
                ...old.sheet,
                signatures: [...old.sheet.signatures.filter((s) => s.kind !== signature.kind), signature],
              },
            }
          : old,
      );
    },
  });
}
