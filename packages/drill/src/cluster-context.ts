import type { Knex } from 'knex';
import type { ClusterStack } from '@heatfleet/cluster/src/cluster-stack.ts';
import type { ApiClient } from './api-client.ts';
import { checkAcks, checkBalances } from './checks.ts';
import { check, type Check } from './drill-report.ts';
import type { Sample, SteadyLoad } from './steady-load.ts';

export interface ClusterDrillContext {
  stack: ClusterStack;
  load: SteadyLoad;
  db: Knex;
  firmId: number;
  depotId: number;
  owner: ApiClient;
  say: (line: string) => void;
}

export const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;

export function statusCounts(samples: Sample[]): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const s of samples) {
    const key = s.status === 0 ? 'no answer' : String(s.status);
    counts[key] = (counts[key] ?? 0) + 1;
  }
  return counts;
}

export function describeCounts(samples: Sample[]): string {
  return Object.entries(statusCounts(samples))
    .map(([status, n]) => `${n}x ${status}`)
    .join(', ');
}

/** Polls until check() is true; the time it took, or null when it never was within timeoutMs. */
export async function timeUntil(check: () => Promise<boolean>, timeoutMs: number, intervalMs = 200) {
  const began = Date.now();
  while (Date.now() - began < timeoutMs) {
    if (await check().catch(() => false)) return Date.now() - began;
    await new Promise((r) => setTimeout(r, intervalMs));
  }
  return null;
}

/** Acknowledged writes against the ledger (each there, once) and every balance against its ledger. */
export async function ledgerChecks(
  ctx: ClusterDrillContext,
): Promise<{ checks: Check[]; figures: Record<string, unknown> }> {
  const acks = await checkAcks(ctx.db, ctx.firmId, ctx.load.acks, ctx.load.keysTried);
  const balances = await checkBalances(ctx.db);
  return {
    checks: [
      check(
        'acknowledged writes are in the database',
        'all, as answered',
        `${acks.acknowledged - acks.missing.length} of ${acks.acknowledged} (${acks.replayed} answered by an idempotent replay)${acks.missing.length ? `; missing: ${acks.missing.slice(0, 3).join(', ')}` : ''}`,
        acks.missing.length === 0 && acks.acknowledged > 0,
      ),
      check(
        'no write applied twice',
        '0 keys with two groups',
        `${acks.duplicated.length} of ${acks.keysTried} keys`,
        acks.duplicated.length === 0,
      ),
      check(
        'every balance equals its ledger',
        '0 mismatches',
        `${balances.mismatched.length} of ${balances.balances} balances${balances.mismatched.length ? `: ${balances.mismatched.slice(0, 3).join('; ')}` : ''}`,
        balances.mismatched.length === 0,
      ),
    ],
    figures: { acknowledged: acks.acknowledged, replayed: acks.replayed, keysTried: acks.keysTried },
  };
}
