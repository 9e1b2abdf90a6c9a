import type { Circulation } from './circulation.ts';
import type { VisitKind } from './job-schemas.ts';
import type { CompletionCode } from './visit-schemas.ts';

export interface CompletionIssue {
  code: CompletionCode;
  /** What was found, in the engineer's words: printed on the report beside the reason given. */
  found: string;
}

export interface CompletionFacts {
  visitKind: VisitKind;
  circulation: Circulation;
  radiators: readonly { room: string; after: unknown; flushedAt: string | null }[];
  water: { mainsTdsPpm: number | null; systemTdsPpm: number | null; inhibitorReading: number | null };
  unsavedInput?: boolean | undefined;
}

const rooms = (list: readonly { room: string }[]) =>
  list.length <= 4
    ? list.map((r) => r.room).join(', ')
    : `${list
        .slice(0, 3)
        .map((r) => r.room)
        .join(', ')} and ${list.length - 3} more`;

/**
 * What completing a job needs a reason for (DEVELOPERS.md, Product rules: the guarded completion).
 * A full clean: hot circulation under the cleaner's minimum, no flush test (mains and system TDS) or
 * no inhibitor reading, radiators without after readings or flush ticks. An inhibitor visit: no
 * inhibitor reading. Either: input on the page not saved. The same function runs on the phone before
 * it asks, and in the API, which answers 422 when a reason is missing.
 */
export function completionChecks(f: CompletionFacts): CompletionIssue[] {
  const issues: CompletionIssue[] = [];
  const full = f.visitKind === 'full_clean';
  if (full && f.circulation.met === false) {
    issues.push({
      code: 'circulation_short',
      found:
        f.circulation.elapsedMinutes === null
          ? `Hot circulation was not started (the cleaner\u2019s minimum is ${f.circulation.minimumMinutes} minutes).`
          : `Hot circulation ran ${f.circulation.elapsedMinutes} of the cleaner\u2019s minimum ${f.circulation.minimumMinutes} minutes.`,
    });
  }
  const flushTest = f.water.mainsTdsPpm !== null && f.water.systemTdsPpm !== null;
  const inhibitorTest = f.water.inhibitorReading !== null;
  const missingTests = [
    ...(full && !flushTest ? ['the flush test (mains and system TDS)'] : []),
    ...(!inhibitorTest ? ['the inhibitor reading'] : []),
  ];
  if (missingTests.length) {
    issues.push({ code: 'no_water_test', found: `Not recorded: ${missingTests.join(' and ')}.` });
  }
  if (full) {
    const noAfter = f.radiators.filter((r) => r.after === null || r.after === undefined);
    if (noAfter.length) {
      issues.push({
        code: 'after_readings_missing',
        found: `${noAfter.length} of ${f.radiators.length} radiators have no after reading: ${rooms(noAfter)}.`,
      });
    }
    const notFlushed = f.radiators.filter((r) => r.flushedAt === null);
    if (notFlushed.length) {
      issues.push({
        code: 'flush_ticks_missing',
        found: `${notFlushed.length} of ${f.radiators.length} radiators are not ticked as flushed: ${rooms(notFlushed)}.`,
      });
    }
  }
  if (f.unsavedInput) issues.push({ code: 'unsaved_input', found: 'The page held input that was not saved.' });
  return issues;
}
