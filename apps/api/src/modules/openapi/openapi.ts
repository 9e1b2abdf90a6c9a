import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { apiErrorBodySchema } from '@heatfleet/domain';
import type { ZodType } from 'zod';
import type { RouteDefinition } from '../../routes/route-registry.ts';

const json = (schema: ZodType) => ({ content: { 'application/json': { schema } } });

/** The OpenAPI 3.1 document, generated from the same registry and zod schemas the API runs on. */
export function buildOpenApiDocument(routes: RouteDefinition[]) {
  const registry = new OpenAPIRegistry();
  for (const route of routes) {
    const responses: Record<string, { description: string; content?: ReturnType<typeof json>['content'] }> = {};
    for (const [status, r] of Object.entries(route.responses)) {
      responses[status] = r.schema ? { description: r.description, ...json(r.schema) } : { description: r.description };
    }
    responses.default = { description: 'Error', ...json(apiErrorBodySchema) };
    registry.registerPath({
      method: route.method,
      path: `/api${route.path.replace(/:([A-Za-z]+)/g, '{$1}')}`,
      summary: route.summary,
      tags: [route.tag],
      security: route.access === 'member' ? [{ session: [] }] : [],
      request: {
        params: route.request.params as never,
        query: route.request.query as never,
        body: route.request.body ? { required: true, ...json(route.request.body) } : undefined,
      },
      responses,
    });
  }
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'heatfleet.sid' });
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Heatfleet API',
      version: '0.1.0',
      description: 'State-changing requests need the X-CSRF-Token header from GET /api/auth/csrf.',
    },
  });
}
