import { Router } from 'express';
import type { AppDeps } from '../app-deps.ts';
import { authenticate } from '../middleware/authenticate.ts';
import { emptyParamsSchema, emptyQuerySchema, type RouteDefinition } from './route-registry.ts';

/** Mounts registry routes: authenticate (for member routes), parse every input, then the handler. */
export function mountRoutes(routes: RouteDefinition[], deps: AppDeps): Router {
  const router = Router();
  for (const route of routes) {
    if (route.devOnly && deps.env.NODE_ENV === 'production') continue;
    router[route.method](route.path, ...(route.before?.(deps) ?? []), async (req, res) => {
      const actor = route.access === 'member' ? await authenticate(req, deps) : null;
      const params = (route.request.params ?? emptyParamsSchema).parse(req.params);
      const query = (route.request.query ?? emptyQuerySchema).parse(req.query);
      const body = route.request.body ? route.request.body.parse(req.body ?? {}) : undefined;
      await route.handle({ params, query, body, req, res, deps, actor });
    });
  }
  return router;
}
