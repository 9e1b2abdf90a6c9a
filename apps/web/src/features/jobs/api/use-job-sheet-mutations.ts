import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import {
  jobPhotoResponseSchema,
  jobSheetResponseSchema,
  type AgitationInput,
  type JobDetail,
  type JobSheet,
  type JobStep,
  type RadiatorReadingInput,
  type ReadingPhase,
  type WaterTestsInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { jobQueries } from '@/features/jobs/api/job-queries';

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
    apiClient.put(`/api/jobs/${jobId}/steps/${step}`, { done }, jobSheetResponseSchema),
  );
}

export function useSaveReading(jobId: number) {
  return useSheetWrite(
    jobId,
    ({ index, phase, reading }: { index: number; phase: ReadingPhase; reading: RadiatorReadingInput }) =>
      apiClient.put(`/api/jobs/${jobId}/radiators/${index}/readings/${phase}`, reading, jobSheetResponseSchema),
  );
}

export function useTickFlushed(jobId: number) {
  return useSheetWrite(jobId, ({ index, done }: { index: number; done: boolean }) =>
    apiClient.put(`/api/jobs/${jobId}/radiators/${index}/flushed`, { done }, jobSheetResponseSchema),
  );
}

export function useSaveAgitation(jobId: number) {
  return useSheetWrite(jobId, ({ index, agitation }: { index: number; agitation: AgitationInput }) =>
    apiClient.put(`/api/jobs/${jobId}/radiators/${index}/agitation`, agitation, jobSheetResponseSchema),
  );
}

export function useSaveWaterTests(jobId: number) {
  return useSheetWrite(jobId, (tests: WaterTestsInput) =>
    apiClient.put(`/api/jobs/${jobId}/water-tests`, tests, jobSheetResponseSchema),
  );
}

export function useSaveKitUsed(jobId: number) {
  return useSheetWrite(jobId, (kitItemIds: number[]) =>
    apiClient.put(`/api/jobs/${jobId}/kit`, { kitItemIds }, jobSheetResponseSchema),
  );
}

export function useSaveNotes(jobId: number) {
  return useSheetWrite(jobId, (notes: string) =>
    apiClient.put(`/api/jobs/${jobId}/notes`, { notes }, jobSheetResponseSchema),
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
