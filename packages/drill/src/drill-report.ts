export interface Check {
  what: string;
  expected: string;
  seen: string;
  pass: boolean;
}

export interface DrillResult {
  drill: string;
  /** What was taken away, for how long, in words. */
  outage: string;
  startedAt: string;
  seconds: number;
  checks: Check[];
  figures: Record<string, unknown>;
}

export function check(what: string, expected: string, seen: string, pass: boolean): Check {
  return { what, expected, seen, pass };
}

export function percent(part: number, whole: number): string {
  return whole === 0 ? 'n/a' : `${((100 * part) / whole).toFixed(2)}%`;
}

export function quantile(values: number[], q: number): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? 0;
}

function pad(text: string, width: number): string {
  return text.length >= width ? text : text + ' '.repeat(width - text.length);
}

/** One line per check, grouped by drill; long "seen" texts wrap under their column. */
export function renderTable(results: DrillResult[]): string {
  const widths = { drill: 16, what: 46, expected: 34 };
  const lines = [
    `${pad('drill', widths.drill)} ${pad('check', widths.what)} ${pad('expected', widths.expected)} result  seen`,
    '-'.repeat(140),
  ];
  for (const result of results) {
    result.checks.forEach((c, i) => {
      lines.push(
        `${pad(i === 0 ? result.drill : '', widths.drill)} ${pad(c.what, widths.what)} ${pad(c.expected, widths.expected)} ${c.pass ? 'pass  ' : 'FAIL  '}  ${c.seen}`,
      );
    });
    lines.push('');
  }
  return lines.join('\n');
}
