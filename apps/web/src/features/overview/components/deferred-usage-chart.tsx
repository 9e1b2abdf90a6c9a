import { lazy, Suspense, useEffect, useRef, useState } from 'react';
import { productKindLabels, type Overview } from '@heatfleet/domain';
import { formatMonth } from '@/lib/format';

// The chart's library is the heaviest part of the overview: it is fetched and drawn only once its card comes near
// the screen, after the figures above it, and its box keeps the chart's height meanwhile (no layout shift).
const UsageChart = lazy(() =>
  import('@/features/overview/components/usage-chart').then((m) => ({ default: m.UsageChart })),
);

function ChartSpace() {
  return <div className="h-64 w-full sm:h-80" aria-hidden="true" />;
}

export function DeferredUsageChart({ months }: { months: Overview['usageByMonth'] }) {
  const box = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const element = box.current;
    if (!element || near) return;
    const observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((e) => e.isIntersecting)) setNear(true);
      },
      { rootMargin: '300px 0px' },
    );
    observer.observe(element);
    return () => observer.disconnect();
  }, [near]);
  return (
    <div ref={box}>
      {near ? (
        <Suspense fallback={<ChartSpace />}>
          <UsageChart months={months} kindLabels={productKindLabels} monthLabel={(m) => formatMonth(m, 'axis')} />
        </Suspense>
      ) : (
        <ChartSpace />
      )}
    </div>
  );
}
