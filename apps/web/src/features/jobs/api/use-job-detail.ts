import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useOutbox } from '@/lib/offline/outbox';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { overlayQueued } from '@/features/jobs/api/sheet-overlay';

/**
 * A job as the phone shows it: the server's answer (or the saved copy offline) with the visit's writes that wait in
 * the phone's queue laid over it, so nothing typed without signal disappears from the sheet after a reload.
 */
export function useJobDetail(id: number, enabled = true) {
  const query = useQuery({ ...jobQueries.detail(id), enabled });
  const writes = useOutbox();
  const data = useMemo(() => (query.data ? overlayQueued(query.data, writes) : undefined), [query.data, writes]);
  return { ...query, data } as typeof query;
}
