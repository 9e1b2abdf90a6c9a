import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SegmentedChoice } from '@/components/ui/segmented-choice';
import { formatCalendarDate } from '@/lib/format';
import { vibrationQueries } from '@/features/vibration/api/vibration-queries';
import { HavRegisterView } from '@/features/vibration/components/hav-register-view';

const spans = ['4', '12', '26', '52'] as const;

/** The owner's hand-arm vibration register: who is over the action value, and who needs health surveillance. */
export function VibrationPage() {
  const [weeks, setWeeks] = useState<(typeof spans)[number]>('12');
  const register = useQuery(vibrationQueries.register(Number(weeks)));
  return (
    <>
      <PageHeader title="Hand-arm vibration">
        Each engineer&apos;s daily exposure points from the agitation recorded on their jobs (HSE&apos;s points system:
        100 points is the exposure action value, 400 the limit value, Control of Vibration at Work Regulations 2005).
        Anyone at or over the action value needs health surveillance; count every other vibrating tool in the
        firm&apos;s own assessment too.
      </PageHeader>
      <div className="space-y-5">
        <SegmentedChoice
          legend="Weeks shown"
          columns={4}
          value={weeks}
          onChange={setWeeks}
          options={spans.map((s) => ({ value: s, label: `${s} weeks` }))}
        />
        {register.isPending ? (
          <PageSpinner label="Loading the register…" />
        ) : register.isError ? (
          <QueryErrorNotice error={register.error} onRetry={() => void register.refetch()} />
        ) : (
          <Card
            title="Register"
            description={`${formatCalendarDate(register.data.from)} to ${formatCalendarDate(register.data.to)}, Monday to Sunday weeks.`}
          >
            <HavRegisterView register={register.data} />
          </Card>
        )}
      </div>
    </>
  );
}
