import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { labelQueries, type LabelSelection } from '@/features/labels/api/label-queries';
import { LabelSheet } from '@/features/labels/components/label-sheet';

function readSelection(params: URLSearchParams): LabelSelection | null {
  const kitId = Number(params.get('kitId'));
  if (Number.isInteger(kitId) && kitId > 0) return { kitId };
  const ids = (params.get('ids') ?? '')
    .split(',')
    .map(Number)
    .filter((id) => Number.isInteger(id) && id > 0);
  return ids.length > 0 ? { ids } : null;
}

/** A4 sheet of QR labels; the header, nav and buttons are hidden when printing (see index.css). */
export function LabelsPage() {
  const [params] = useSearchParams();
  const selection = readSelection(params);
  const labels = useQuery({ ...labelQueries.sheet(selection ?? { ids: [] }), enabled: selection !== null });

  if (!selection) {
    return (
      <>
        <PageHeader title="Labels" />
        <Alert tone="info">Open labels from a kit or an item, with its “Print labels” button.</Alert>
      </>
    );
  }
  if (labels.isPending) return <PageSpinner label="Making labels…" />;
  if (labels.isError) return <QueryErrorNotice error={labels.error} onRetry={() => void labels.refetch()} />;

  return (
    <>
      <div className="print:hidden">
        <PageHeader title="Labels">
          {labels.data.length} label{labels.data.length === 1 ? '' : 's'}. Scanning one opens its item in Heatfleet.
        </PageHeader>
        <Button onClick={() => window.print()} className="mb-5">
          Print
        </Button>
      </div>
      <LabelSheet labels={labels.data} />
    </>
  );
}
