import { useCallback } from 'react';
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import {
  jobDetailSchema,
  jobSheetResponseSchema,
  jobSignatureResponseSchema,
  type CompleteJobInput,
  type JobDetail,
  type JobSheet,
  type JobSignature,
  type JobStep,
  type SignatureInput,
  type UpdateJobInput,
} from '@heatfleet/domain';
import { paths } from '@/config/paths';
import { sessionQueries } from '@/lib/auth';
import { outboxWrites, type QueuedWrite } from '@/lib/offline/outbox';
import { queueWrite, type WriteRequest } from '@/lib/offline/queue-write';
import { queryRoots } from '@/lib/query-keys';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { overlayQueued } from '@/features/jobs/api/sheet-overlay';
import { sheetWriteLabel } from '@/features/jobs/api/sheet-write-label';

// Every visit write goes through the phone's queue (lib/offline/queue-write.ts): its Idempotency-Key and tap time
// made at the tap, kept in IndexedDB until the server has it. With signal it is sent at once and answers with the
// whole sheet, which the job's cached detail takes as it is; without, the sheet shows it from the queue
// (sheet-overlay.ts) and it goes when the signal returns. Writes overlap (a reading saving while a flush is
// ticked), so per job: an answer older than the one stored is not stored; a read of the job in flight when a
// write starts is cancelled (it may predate the write); and in either case the job is read again once no write
// is in flight, so it settles on the server's last word.
interface SheetWrites {
  started: number;
  lastStored: number;
  inFlight: number;
  readAgain: boolean;
}
const writesByJob = new Map<number, SheetWrites>();

async function writeSheet(
  queryClient: QueryClient,
  jobId: number,
  write: () => Promise<{ sheet: JobSheet; kept: boolean }>,
): Promise<{ sheet: JobSheet; kept: boolean }> {
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
    const out = await write();
    if (out.kept) return out;
    if (seq > writes.lastStored) {
      writes.lastStored = seq;
      queryClient.setQueryData<JobDetail>(key, (old) => (old ? { ...old, sheet: out.sheet } : old));
    } else {
      writes.readAgain = true;
    }
    return out;
  } finally {
    writes.inFlight -= 1;
    if (writes.inFlight === 0 && writes.readAgain && navigator.onLine) {
      writes.readAgain = false;
      void queryClient.invalidateQueries({ queryKey: key });
    }
  }
}

/** The job as the phone shows it now: the cached answer with the waiting writes laid over it. */
export function shownDetail(queryClient: QueryClient, jobId: number): JobDetail | undefined {
  const detail = queryClient.getQueryData<JobDetail>(jobQueries.detail(jobId).queryKey);
  return detail && overlayQueued(detail, outboxWrites());
}

export interface SheetRequest {
  method?: QueuedWrite['method'];
  /** Under the job: `/radiators/2/readings/before`. */
  path: string;
  body: unknown;
  label?: string;
  form?: WriteRequest['form'];
}

/** Queues one write of the job's visit; resolves with the sheet to show and whether it waits on the phone. */
export function useQueueSheetWrite(jobId: number) {
  const queryClient = useQueryClient();
  // Read when the write is made, not at render: at sign-out the session goes while the sheet may still render.
  const me = useQuery(sessionQueries.me()).data;
  return useCallback(
    (request: SheetRequest): Promise<{ sheet: JobSheet; kept: boolean; body: unknown }> => {
      let body: unknown = null;
      return writeSheet(queryClient, jobId, async () => {
        if (!me) throw new Error('Sign in again to save this.');
        const where = queryClient.getQueryData<JobDetail>(jobQueries.detail(jobId).queryKey)?.job.site.address;
        const outcome = await queueWrite(
          {
            method: request.method ?? 'PUT',
            path: `/api/jobs/${jobId}${request.path}`,
            body: request.body,
            label: request.label ?? sheetWriteLabel(request.path, where),
            href: paths.job.getHref(jobId),
            group: `job:${jobId}`,
            invalidate: [jobQueries.detail(jobId).queryKey],
            ...(request.form ? { form: request.form } : {}),
          },
          me,
        );
        if (outcome.status === 'sent') {
          body = outcome.body;
          const parsed = jobSheetResponseSchema.safeParse(outcome.body);
          if (parsed.success) return { sheet: parsed.data.sheet, kept: false };
          void queryClient.invalidateQueries({ queryKey: jobQueries.detail(jobId).queryKey });
        }
        const shown = shownDetail(queryClient, jobId);
        if (!shown) throw new Error('The job is not loaded on this phone.');
        return { sheet: shown.sheet, kept: outcome.status === 'queued' };
      }).then((out) => ({ ...out, body }));
    },
    [jobId, me, queryClient],
  );
}

/** One PUT under the job (a path like `/radiators/2/readings/before`): for the fields that save themselves. */
export function useSheetPut(jobId: number) {
  const queue = useQueueSheetWrite(jobId);
  return useCallback(
    async (path: string, body: unknown, label?: string): Promise<void | 'kept'> => {
      const out = await queue({ path, body, ...(label ? { label } : {}) });
      return out.kept ? 'kept' : undefined;
    },
    [queue],
  );
}

function useSheetWrite<V>(jobId: number, request: (variables: V) => SheetRequest) {
  const queue = useQueueSheetWrite(jobId);
  return useMutation({ mutationFn: async (variables: V) => (await queue(request(variables))).sheet });
}

export function useTickStep(jobId: number) {
  return useSheetWrite(jobId, ({ step, done }: { step: JobStep; done: boolean }) => ({
    path: `/steps/${step}`,
    body: { done },
  }));
}

export function useTickFlushed(jobId: number) {
  return useSheetWrite(jobId, ({ index, done }: { index: number; done: boolean }) => ({
    path: `/radiators/${index}/flushed`,
    body: { done },
  }));
}

/** A photo of the job: shrunk on the phone (long side 2,000 px, JPEG), then sent or kept in the queue. */
export function useUploadJobPhoto(jobId: number) {
  return useSheetWrite(jobId, ({ file, tag, caption }: { file: File; tag: string; caption: string }) => ({
    method: 'POST',
    path: '/photos',
    body: null,
    form: { field: 'photo', file, fields: { tag, ...(caption.trim() ? { caption: caption.trim() } : {}) } },
  }));
}

/** The flush order, set once: kept on the site, so the next visit starts with it. */
export function useSetFlushOrder(jobId: number) {
  return useSheetWrite(jobId, (radiatorIndexes: number[]) => ({ path: '/flush-order', body: { radiatorIndexes } }));
}

/** The customer's drawn signature; signing again replaces it. The sheet lists it at once (from the queue if need be). */
export function useAddSignature(jobId: number) {
  const queryClient = useQueryClient();
  const queue = useQueueSheetWrite(jobId);
  return useMutation({
    mutationFn: async (input: SignatureInput): Promise<JobSignature | null> => {
      const out = await queue({ method: 'POST', path: '/signatures', body: input });
      if (out.kept) return null;
      const parsed = jobSignatureResponseSchema.safeParse(out.body);
      return parsed.success ? parsed.data.signature : null;
    },
    onSuccess: (signature) => {
      if (!signature) return;
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

/**
 * Completing, through the queue like every visit write: with signal the answer is the job as completed; without,
 * null (kept on the phone; a refusal when it is sent later, such as a van short of cleaner, goes to "needs your
 * attention" with the server's message).
 */
export function useCompleteJob(jobId: number) {
  const queryClient = useQueryClient();
  const queue = useQueueSheetWrite(jobId);
  return useMutation({
    mutationFn: async ({ input }: { input: CompleteJobInput }): Promise<JobDetail | null> => {
      const out = await queue({ method: 'POST', path: '/complete', body: input });
      if (out.kept) return null;
      return jobDetailSchema.parse(out.body);
    },
    onSuccess: (detail) => {
      if (!detail) return;
      queryClient.setQueryData(jobQueries.detail(jobId).queryKey, detail);
      // The van's stock and the site's next check changed too.
      void queryClient.invalidateQueries({ queryKey: jobQueries.lists() });
      void queryClient.invalidateQueries({ queryKey: queryRoots.stock });
      void queryClient.invalidateQueries({ queryKey: queryRoots.vans });
    },
  });
}

/**
 * Edit or reschedule a booked job through the queue: the survey carries the version it was edited from, so another
 * person's change since is refused (409) rather than overwritten. Null when kept on the phone for lack of signal.
 */
export function useUpdateJob(jobId: number) {
  const queryClient = useQueryClient();
  const queue = useQueueSheetWrite(jobId);
  return useMutation({
    mutationFn: async (input: UpdateJobInput): Promise<JobDetail | null> => {
      const out = await queue({ method: 'PATCH', path: '', body: input });
      if (out.kept) return null;
      return jobDetailSchema.parse(out.body);
    },
    onSuccess: (detail) => {
      if (!detail) return;
      queryClient.setQueryData(jobQueries.detail(jobId).queryKey, detail);
      void queryClient.invalidateQueries({ queryKey: jobQueries.lists() });
    },
  });
}
