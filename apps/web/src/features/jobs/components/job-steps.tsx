import { useEffect, useState } from 'react';
import { circulationClock, type JobSheet } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { useTickStep } from '@/features/jobs/api/use-job-sheet-mutations';
import { StepCautions } from '@/features/jobs/components/job-cautions';
import { formatClock } from '@/features/jobs/components/sheet-format';

type Step = JobSheet['steps'][number];

/** The time now, moving on every half minute while something on screen counts minutes. */
function useNow(running: boolean): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!running) return;
    setNow(Date.now());
    const timer = window.setInterval(() => setNow(Date.now()), 30_000);
    return () => window.clearInterval(timer);
  }, [running]);
  return now;
}

function minutes(n: number): string {
  return `${n} minute${n === 1 ? '' : 's'}`;
}

/** Circulation counts from the cleaner's dose to the circulate tick, or on to now while it runs. */
function Circulation({ sheet }: { sheet: JobSheet }) {
  const { minimumMinutes, startedAt } = sheet.circulation;
  const endedAt = sheet.steps.find((s) => s.step === 'circulate_hot')?.doneAt ?? null;
  const now = useNow(startedAt !== null && endedAt === null && sheet.editable);
  if (!startedAt) {
    return (
      <p role="status" aria-label="Circulation" className="text-ink-muted">
        The circulation clock starts when the cleaner is dosed
        {minimumMinutes ? `; this cleaner needs at least ${minutes(minimumMinutes)} hot.` : '.'}
      </p>
    );
  }
  // The API's rule, run live: the sheet's own figure is from when it was read.
  const clock = circulationClock(
    minimumMinutes,
    new Date(startedAt),
    endedAt ? new Date(endedAt) : null,
    new Date(now),
  );
  const elapsed = clock.elapsedMinutes ?? 0;
  const met = clock.met;
  return (
    <div
      role="status"
      aria-label="Circulation"
      className={`rounded-md border-2 px-3 py-2 ${met === false ? 'border-ember-500 bg-ember-100' : met ? 'border-ok-700 bg-ok-50' : 'border-line-strong'}`}
    >
      <p className="flex flex-wrap items-center gap-2 text-lg font-bold tabular-nums">
        <span>
          {minimumMinutes === null
            ? `Circulated ${minutes(elapsed)}`
            : `Circulated ${elapsed} of ${minutes(minimumMinutes)}`}
        </span>
        {met === null ? null : met ? <Badge tone="ok">Minimum met</Badge> : <Badge tone="warn">Not yet</Badge>}
      </p>
      <p className="text-sm text-ink-muted">
        {minimumMinutes === null
          ? 'The cleaner has no minimum circulation time set.'
          : met
            ? endedAt
              ? 'Circulated hot for at least the cleaner’s minimum time.'
              : 'The minimum is met: tick the step when you stop circulating.'
            : `${minutes(minimumMinutes - elapsed)} to go${endedAt ? ': the step was ticked before the minimum time.' : '.'}`}
      </p>
    </div>
  );
}

function StepRow({
  step,
  n,
  sheet,
  timeZone,
  tick,
  withCautions,
}: {
  step: Step;
  n: number;
  sheet: JobSheet;
  timeZone: string;
  tick: ReturnType<typeof useTickStep>;
  withCautions: boolean;
}) {
  const busy = tick.isPending && tick.variables.step === step.step;
  const failed = tick.isError && tick.variables.step === step.step;
  const done = step.doneAt !== null;
  const when = step.doneAt
    ? `Done at ${formatClock(step.doneAt, timeZone)}${step.doneByName ? ` by ${step.doneByName}` : ''}`
    : null;
  return (
    <li className="space-y-2 border-t border-line pt-4 first:border-t-0 first:pt-0">
      {withCautions ? <StepCautions cautions={step.cautions} label={`Cautions before step ${n}`} /> : null}
      {sheet.editable && !done ? (
        <button
          type="button"
          disabled={busy}
          onClick={() => tick.mutate({ step: step.step, done: true })}
          className="flex min-h-16 w-full items-center gap-3 rounded-lg border-2 border-brand-700 bg-card px-3 py-2 text-left font-semibold text-ink disabled:opacity-60"
        >
          <span
            aria-hidden="true"
            className="grid size-9 shrink-0 place-items-center rounded-md border-2 border-brand-700 text-lg text-brand-700"
          >
            {busy ? '…' : n}
          </span>
          <span>{step.label}</span>
        </button>
      ) : (
        <div
          className={`flex min-h-16 items-center gap-3 rounded-lg border-2 px-3 py-2 ${done ? 'border-ok-700 bg-ok-50' : 'border-line'}`}
        >
          <span
            aria-hidden="true"
            className={`grid size-9 shrink-0 place-items-center rounded-md text-lg font-bold ${done ? 'bg-ok-700 text-white' : 'border-2 border-line-strong text-ink-muted'}`}
          >
            {done ? '✓' : n}
          </span>
          <span className="min-w-0 flex-1">
            <span className="block font-semibold">{step.label}</span>
            <span className="block text-sm text-ink-muted">{when ?? 'Not ticked.'}</span>
          </span>
        </div>
      )}
      {sheet.editable && done ? (
        <Button
          variant="secondary"
          className="min-h-12"
          busy={busy}
          aria-label={`Untick step ${n}: ${step.label}`}
          onClick={() => tick.mutate({ step: step.step, done: false })}
        >
          Untick
        </Button>
      ) : null}
      {failed ? <Alert tone="error">{tick.error.message}</Alert> : null}
      {step.step === 'circulate_hot' ? <Circulation sheet={sheet} /> : null}
    </li>
  );
}

/** The steps given (a part of the sheet's list), numbered as in the whole list, each ticked with one tap. */
export function JobSteps({
  jobId,
  sheet,
  timeZone,
  steps,
  withCautions = true,
}: {
  jobId: number;
  sheet: JobSheet;
  timeZone: string;
  steps: readonly Step['step'][];
  /** False where the steps' cautions are already shown above them (the radiators' own steps). */
  withCautions?: boolean;
}) {
  const tick = useTickStep(jobId);
  return (
    <ol className="space-y-4">
      {sheet.steps.map((step, i) =>
        steps.includes(step.step) ? (
          <StepRow
            key={step.step}
            step={step}
            n={i + 1}
            sheet={sheet}
            timeZone={timeZone}
            tick={tick}
            withCautions={withCautions}
          />
        ) : null,
      )}
    </ol>
  );
}

/** The sheet's steps in three parts: before the radiators, the radiators' own (agitate, flush), after them. */
export function stepGroups(sheet: JobSheet): {
  before: Step['step'][];
  radiators: Step['step'][];
  after: Step['step'][];
} {
  const keys = sheet.steps.map((s) => s.step);
  const first = keys.findIndex((k) => k === 'agitate' || k === 'flush');
  if (first < 0) return { before: keys, radiators: [], after: [] };
  const radiators = keys.filter((k) => k === 'agitate' || k === 'flush');
  const rest = keys.filter((k) => k !== 'agitate' && k !== 'flush');
  return {
    before: rest.filter((k) => keys.indexOf(k) < first),
    radiators,
    after: rest.filter((k) => keys.indexOf(k) > first),
  };
}

export function stepsSummary(sheet: JobSheet, only?: readonly Step['step'][]): string {
  const steps = only ? sheet.steps.filter((s) => only.includes(s.step)) : sheet.steps;
  const done = steps.filter((s) => s.doneAt !== null).length;
  return `${done} of ${steps.length} ticked`;
}
