import type { Knex } from 'knex';
import type { ZodType } from 'zod';
import { checkInInputSchema, checkOutInputSchema, idParamSchema, moveInputSchema } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { idempotencyKeyOf, runIdempotent } from '../../lib/idempotency.ts';
import { defineRoute } from '../../routes/route-registry.ts';
import { recordCustody, type CustodyTarget } from './custody-service.ts';

type Action = 'check_out' | 'check_in' | 'move';
const bodies = { check_out: checkOutInputSchema, check_in: checkInInputSchema, move: moveInputSchema } as const;

/**
 * A check-out, check-in or move of a kit or of one item: idempotent by header, retried whole on a
 * deadlock, answering with the record as it now stands (read in the same transaction).
 */
export function custodyRoute<T>(spec: {
  action: Action;
  path: string;
  summary: string;
  target: (id: number) => CustodyTarget;
  what: 'kit' | 'item';
  response: ZodType;
  answer: (trx: Knex.Transaction, deps: AppDeps, actor: Actor, id: number) => Promise<T>;
}) {
  return defineRoute({
    method: 'post', path: spec.path, tag: 'Kits', access: 'member', tenantData: true,
    summary: `${spec.summary} Send an Idempotency-Key header: a retry with the same key replays the first answer.`,
    request: { params: idParamSchema, body: bodies[spec.action] as ZodType },
    responses: {
      200: { description: `Done; the ${spec.what} as it now stands`, schema: spec.response },
      409: { description: 'Already out (names who has it), overdue for inspection, or out of service' },
    },
    handle: async ({ params, body, req, res, deps, actor }) => {
      const key = idempotencyKeyOf(req);
      const out = await withTransactionRetry(() =>
        runIdempotent(deps, actor, key, `${spec.action} ${spec.what} ${params.id}`, async (trx) => {
          await recordCustody(trx, deps, actor, spec.target(params.id), spec.action, body as Parameters<typeof recordCustody>[5]);
          return { status: 200, body: await spec.answer(trx, deps, actor, params.id) };
        }),
      );
      res.status(out.status).json(out.body);
    },
  });
}
