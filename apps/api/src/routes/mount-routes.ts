import { Router, type RequestHandler, type Response } from 'express';
import pLimit from 'p-limit';
import type { Actor, AppDeps } from '../app-deps.ts';
import { authenticate } from '../middleware/authenticate.ts';
import { assertFirmWritable } from '../middleware/firm-read-only.ts';
import { emptyParamsSchema, emptyQuerySchema, type RouteDefinition } from './route-registry.ts';

/**
 * Mounts registry routes: authenticate (member routes, before anything else reads the request,
 * such as an upload), the route's own middleware, then parse every input and run the handler.
 */
export function mountRoutes(routes: RouteDefinition[], deps: AppDeps): Router {
  const router = Router();
  const heavyReads = pLimit(deps.env.HEAVY_READS_AT_ONCE);
  // A read-only firm (an unpaid subscription past its grace period) is refused every write before anything else.
  const signedIn =
    (route: RouteDefinition): RequestHandler =>
    async (req, res, next) => {
      const actor = await authenticate(req, deps);
      res.locals.actor = actor;
      await assertFirmWritable(deps, actor, route);
      next();
    };
  for (const route of routes) {
    if (route.devOnly && deps.env.NODE_ENV === 'production') continue;
    const chain = [...(route.access === 'member' ? [signedIn(route)] : []), ...(route.before?.(deps) ?? [])];
    router[route.method](route.path, ...chain, async (req, res) => {
      const actor = (res.locals.actor as Actor | undefined) ?? null;
      const params = (route.request.params ?? emptyParamsSchema).parse(req.params);
      const query = (route.request.query ?? emptyQuerySchema).parse(req.query);
      const body = route.request.body ? route.request.body.parse(req.body ?? {}) : undefined;
      if (deps.env.NODE_ENV === 'test') checkAnswers(route, res);
      const handle = () => route.handle({ params, query, body, req, res, deps, actor });
      // A queued read whose caller has gone (a phone that gave up, a closed tab) is not worked on when its turn comes.
      await (route.heavy ? heavyReads(() => (req.socket.destroyed ? undefined : handle())) : handle());
    });
  }
  return router;
}

/**
 * In tests, every JSON answer of a 2xx status must match the schema the route declares for it,
 * so an answer that drifts from its domain schema fails a test instead of a user's page.
 */
function checkAnswers(route: RouteDefinition, res: Response): void {
  const json = res.json.bind(res);
  res.json = (payload: unknown) => {
    const declared = route.responses[res.statusCode];
    if (res.statusCode < 300 && declared?.schema) {
      const parsed = declared.schema.safeParse(payload);
      if (!parsed.success) {
        throw new Error(
          `${route.method.toUpperCase()} /api${route.path} answered ${res.statusCode} off its schema: ${parsed.error.message}`,
        );
      }
    }
    return json(payload);
  };
}
