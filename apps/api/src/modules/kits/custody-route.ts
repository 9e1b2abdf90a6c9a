import type { ZodType } from 'zod';
import { checkInInputSchema, checkOutInputSchema, idParamSchema, moveInputSchema } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { idempotencyKeyOf, type IdempotencyKey } from '../../lib/idempotency.ts';
import { readTappedAt, tappedAtOf } from '../../middleware/tapped-at.ts';
import { defineRoute } from '../../routes/route-registry.ts';
import type { CustodyAction, CustodyAnswer, CustodyInput } from './custody-service.ts';

const bodies = { check_out: checkOutInputSchema, check_in: checkInInputSchema, move: moveInputSchema } as const;

/**
 * A check-out, check-in or move route of a kit or of one item. Send an Idempotency-Key header: a
 * retry with the same key replays the first answer. X-Tapped-At (when the engineer tapped, for a write
 * sent later from the phone's queue) is kept beside the time it arrived.
 */
export function custodyRoute(spec: {
  action: CustodyAction;
  path: string;
  summary: string;
  what: 'kit' | 'item';
  response: ZodType;
  run: (
    deps: AppDeps,
    actor: Actor,
    id: number,
    action: CustodyAction,
    input: CustodyInput,
    idempotencyKey: IdempotencyKey | undefined,
    tappedAt: Date | null,
  ) => Promise<CustodyAnswer<unknown>>;
}) {
  return defineRoute({
    method: 'post',
    path: spec.path,
    tag: 'Kits',
    access: 'member',
    tenantData: true,
    summary: `${spec.summary} Send an Idempotency-Key header: a retry with the same key replays the first answer. X-Tapped-At (ISO 8601) records when it was done.`,
    request: { params: idParamSchema, body: bodies[spec.action] as ZodType },
    responses: {
      200: { description: `Done; the ${spec.what} as it now stands`, schema: spec.response },
      409: { description: 'Already out (names who has it), overdue for inspection, or out of service' },
      422: { description: 'The body, or X-Tapped-At in the future or older than 7 days' },
    },
    before: (deps) => [readTappedAt(deps)],
    handle: async ({ params, body, req, res, deps, actor }) => {
      const input = body as CustodyInput;
      const out = await spec.run(deps, actor, params.id, spec.action, input, idempotencyKeyOf(req), tappedAtOf(res));
      res.status(out.status).json(out.body);
    },
  });
}
