import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { AgitationInput, JobStep, RadiatorReadingInput, ReadingPhase, WaterTestsInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { jobPhotoSchema, jobQueries, jobSheetSchema, type JobDetail, type JobSheet } from '@/features/jobs/api/job-queries';

const sheetEnvelopeSchema = z.object({ sheet: jobSheetSchema });
const photoEnvelopeSchema = z.object({ photo: jobPhotoSchema });

// Every sheet write answers with the whole sheet, so the job's cached detail takes it as it is.
function storeSheet(queryClient: QueryClient, jobId: number, sheet: JobSheet) {
  queryClient.setQueryData<JobDetail>(jobQueries.detail(jobId).queryKey, (old) => (old ? { ...old, sheet } : old));
}

function useSheetWrite<V>(jobId: number, write: (variables: V) => Promise<{ sheet: JobSheet }>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (variables: V) => (await write(variables)).sheet,
    onSuccess: (sheet) => storeSheet(queryClient, jobId, sheet),
  });
}

export function useTickStep(jobId: number) {
  return useSheetWrite(jobId, ({ step, done }: { step: JobStep; done: boolean }) =>
    apiClient.put(`/api/jobs/${jobId}/steps/${step}`, { done }, sheetEnvelopeSchema),
  );
}

export function useSaveReading(jobId: number) {
  return useSheetWrite(jobId, ({ index, phase, reading }: { index: number; phase: ReadingPhase; reading: RadiatorReadingInput }) =>
    apiClient.put(`/api/jobs/${jobId}/radiators/${index}/readings/${phase}`, reading, sheetEnvelopeSchema),
  );
}

export function useTickFlushed(jobId: number) {
  return useSheetWrite(jobId, ({ index, done }: { index: number; done: boolean }) =>
    apiClient.put(`/api/jobs/${jobId}/radiators/${index}/flushed`, { done }, sheetEnvelopeSchema),
  );
}

export function useSaveAgitation(jobId: number) {
  return useSheetWrite(jobId, ({ index, agitation }: { index: number; agitation: AgitationInput }) =>
    apiClient.put(`/api/jobs/${jobId}/radiators/${index}/agitation`, agitation, sheetEnvelopeSchema),
  );
}

export function useSaveWaterTests(jobId: number) {
  return useSheetWrite(jobId, (tests: WaterTestsInput) => apiClient.put(`/api/jobs/${jobId}/water-tests`, tests, sheetEnvelopeSchema));
}

export function useSaveKitUsed(jobId: number) {
  return useSheetWrite(jobId, (kitItemIds: number[]) => apiClient.put(`/api/jobs/${jobId}/kit`, { kitItemIds }, sheetEnvelopeSchema));
}

export function useSaveNotes(jobId: number) {
  return useSheetWrite(jobId, (notes: string) => apiClient.put(`/api/jobs/${jobId}/notes`, { notes }, sheetEnvelopeSchema));
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
      return (await apiClient.upload(`/api/jobs/${jobId}/photos`, form, photoEnvelopeSchema)).photo;
    },
    onSuccess: (photo) => {
      queryClient.setQueryData<JobDetail>(jobQueries.detail(jobId).queryKey, (old) =>
        old ? { ...old, sheet: { ...old.sheet, photos: [...old.sheet.photos.filter((p) => p.id !== photo.id), photo] } } : old,
      );
    },
  });
}
