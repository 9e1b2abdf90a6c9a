import type { JobStatus } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';

export function JobStatusBadge({ status }: { status: JobStatus }) {
  if (status === 'completed') return <Badge tone="ok">Completed</Badge>;
  if (status === 'cancelled') return <Badge tone="danger">Cancelled</Badge>;
  return <Badge tone="neutral">Booked</Badge>;
}
