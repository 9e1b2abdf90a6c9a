import { openApiDocumentSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { buildOpenApiDocument } from './openapi.ts';

export function openApiRoute(allRoutes: () => RouteDefinition[]): RouteDefinition {
  let document: unknown;
  return defineRoute({
    method: 'get',
    path: '/openapi.json',
    tag: 'Meta',
    access: 'public',
    tenantData: false,
    summary: 'This document',
    request: {},
    responses: { 200: { description: 'OpenAPI 3.1 document', schema: openApiDocumentSchema } },
    handle: async ({ res }) => {
      document ??= buildOpenApiDocument(allRoutes());
      res.json(document);
    },
  });
}
