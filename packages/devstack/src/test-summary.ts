import { existsSync, readFileSync } from 'node:fs';

export interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

export const noCounts: Counts = { passed: 0, failed: 0, skipped: 0 };

function num(value: unknown): number {
  return typeof value === 'number' && Number.isFinite(value) ? value : 0;
}

function record(value: unknown): Record<string, unknown> {
  return typeof value === 'object' && value !== null ? (value as Record<string, unknown>) : {};
}

/** Counts from vitest's json reporter (Jest's shape). A file that failed before any test ran counts as one failure. */
export function countVitest(report: unknown): Counts {
  const data = record(report);
  let brokenFiles = 0;
  for (const file of Array.isArray(data.testResults) ? data.testResults : []) {
    const entry = record(file);
    const assertions = Array.isArray(entry.assertionResults) ? entry.assertionResults : [];
    const anyFailed = assertions.some((assertion) => record(assertion).status === 'failed');
    if (entry.status === 'failed' && !anyFailed) brokenFiles += 1;
  }
  return {
    passed: num(data.numPassedTests),
    failed: num(data.numFailedTests) + brokenFiles,
    skipped: num(data.numPendingTests) + num(data.numTodoTests),
  };
}

/** Counts from Playwright's json reporter; errors outside any test (config, global setup) count as failures. */
export function countPlaywright(report: unknown): Counts {
  const data = record(report);
  const stats = record(data.stats);
  const errors = Array.isArray(data.errors) ? data.errors.length : 0;
  return {
    passed: num(stats.expected) + num(stats.flaky),
    failed: num(stats.unexpected) + errors,
    skipped: num(stats.skipped),
  };
}

export function readReport(file: string, count: (report: unknown) => Counts): Counts | null {
  if (!existsSync(file)) return null;
  try {
    return count(JSON.parse(readFileSync(file, 'utf8')));
  } catch {
    return null;
  }
}

export function addCounts(...all: Counts[]): Counts {
  return all.reduce(
    (sum, next) => ({
      passed: sum.passed + next.passed,
      failed: sum.failed + next.failed,
      skipped: sum.skipped + next.skipped,
    }),
    noCounts,
  );
}

export function summaryLine(counts: Counts): string {
  const skipped = counts.skipped > 0 ? `, ${counts.skipped} skipped` : '';
  return `Summary: ${counts.passed} passed, ${counts.failed} failed${skipped}`;
}
