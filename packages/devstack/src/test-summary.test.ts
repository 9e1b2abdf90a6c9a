import { describe, expect, it } from 'vitest';
import { addCounts, countPlaywright, countVitest, summaryLine } from './test-summary.ts';

describe('test summary', () => {
  it('counts vitest results, a file that broke before its tests ran as one failure', () => {
    const report = {
      numPassedTests: 7,
      numFailedTests: 1,
      numPendingTests: 2,
      numTodoTests: 1,
      testResults: [
        { status: 'failed', assertionResults: [{ status: 'failed' }] },
        { status: 'failed', assertionResults: [] },
        { status: 'passed', assertionResults: [{ status: 'passed' }] },
      ],
    };
    expect(countVitest(report)).toEqual({ passed: 7, failed: 2, skipped: 3 });
  });

  it('counts Playwright results, errors outside tests as failures', () => {
    const report = { stats: { expected: 3, unexpected: 1, flaky: 1, skipped: 0 }, errors: [{ message: 'config' }] };
    expect(countPlaywright(report)).toEqual({ passed: 4, failed: 2, skipped: 0 });
  });

  it('prints skipped only when there are some', () => {
    expect(summaryLine(addCounts({ passed: 120, failed: 0, skipped: 0 }, { passed: 3, failed: 0, skipped: 0 }))).toBe(
      'Summary: 123 passed, 0 failed',
    );
    expect(summaryLine({ passed: 1, failed: 2, skipped: 3 })).toBe('Summary: 1 passed, 2 failed, 3 skipped');
  });

  it('tolerates a report of the wrong shape', () => {
    expect(countVitest(null)).toEqual({ passed: 0, failed: 0, skipped: 0 });
    expect(countPlaywright({ stats: 'x' })).toEqual({ passed: 0, failed: 0, skipped: 0 });
  });
});
