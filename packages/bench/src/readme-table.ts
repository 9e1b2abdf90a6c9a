import { readFileSync } from 'node:fs';

// `node --import tsx packages/bench/src/readme-table.ts bench/results/bench-<date>.json [bench/results/<before>.json]`:
// the README's before/after table for the large firm's reads, against an earlier run's JSON if given, else the first
// run of round one (2026-12-02 03:12 UTC, README.md).
type Before = Record<string, { rps: number; ratio: string; p99: number; alone: number }>;
const roundOne: Before = {
  'van stock': { rps: 85.5, ratio: '6.7%', p99: 822, alone: 30.7 },
  'kits list': { rps: 7.7, ratio: '0.6%', p99: 5063, alone: 184.4 },
  'kit items page': { rps: 4.9, ratio: '0.4%', p99: 8741, alone: 330.2 },
  'ledger first': { rps: 262.2, ratio: '20.5%', p99: 200, alone: 16.4 },
  'ledger deep': { rps: 260.4, ratio: '20.3%', p99: 171, alone: 8.9 },
  'stock grid': { rps: 5.6, ratio: '0.4%', p99: 7750, alone: 209.8 },
  'restock run': { rps: 3.9, ratio: '0.3%', p99: 7909, alone: 287.2 },
  overview: { rps: 3, ratio: '0.2%', p99: 6583, alone: 426.1 },
};

interface Read {
  name: string;
  firm: string;
  status: number;
  requestsPerSecond: number;
  ratioToBaseline: number;
  p99Ms: number;
  serialMedianMs: number;
}
const run = JSON.parse(readFileSync(process.argv[2]!, 'utf8')) as {
  baseline: { requestsPerSecond: number; p99Ms: number };
  reads: Read[];
  targets: { name: string; target: string; measured: string; met: boolean | null }[];
};
const beforeFile = process.argv[3];
const before: Before = beforeFile
  ? Object.fromEntries(
      (JSON.parse(readFileSync(beforeFile, 'utf8')) as { reads: Read[] }).reads
        .filter((r) => r.firm === 'large' && r.status === 200)
        .map((r) => [
          r.name,
          {
            rps: r.requestsPerSecond,
            ratio: `${(r.ratioToBaseline * 100).toFixed(1)}%`,
            p99: r.p99Ms,
            alone: r.serialMedianMs,
          },
        ]),
    )
  : roundOne;
const rows = [
  '| read (1M movements) | req/s before -> after | of baseline before -> after | p99 ms before -> after | alone ms before -> after |',
  '| --- | --- | --- | --- | --- |',
];
for (const [name, b] of Object.entries(before)) {
  const a = run.reads.find((r) => r.name === name && r.firm === 'large');
  if (!a || a.status !== 200) {
    rows.push(`| ${name} | ${b.rps} -> missing | ${b.ratio} -> - | ${b.p99} -> - | ${b.alone} -> - |`);
    continue;
  }
  rows.push(
    `| ${name} | ${b.rps} -> ${a.requestsPerSecond} | ${b.ratio} -> ${(a.ratioToBaseline * 100).toFixed(1)}% | ${b.p99} -> ${a.p99Ms} | ${b.alone} -> ${a.serialMedianMs} |`,
  );
}
process.stdout.write(
  `Baseline ${run.baseline.requestsPerSecond} req/s (p99 ${run.baseline.p99Ms} ms)\n\n${rows.join('\n')}\n\n`,
);
process.stdout.write(
  ['| target | measured | met |', '| --- | --- | --- |']
    .concat(
      run.targets.map((t) => `| ${t.target} | ${t.measured} | ${t.met === null ? 'n/a' : t.met ? 'yes' : 'no'} |`),
    )
    .join('\n') + '\n',
);
