import {
  customerInputSchema,
  customerPageQuerySchema,
  customerPageResponseSchema,
  customerResponseSchema,
  idParamSchema,
  newSiteResponseSchema,
  siteInputSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { createSite } from '../sites/site-service.ts';
import { createCustomer, getCustomer } from './customer-service.ts';
import { listCustomerPage } from './customers-list-service.ts';

export const customerRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/customers',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary:
      'A page of customers with their sites (page, pageSize up to 100, total); with q, those whose name, address or ' +
      'postcode holds the text, names starting with it first (without pageSize: the type-ahead, at most 10)',
    request: { query: customerPageQuerySchema },
    responses: { 200: { description: 'Customers', schema: customerPageResponseSchema } },
    handle: async ({ query, res, deps, actor }) => {
      res.json(await listCustomerPage(deps, actor, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/customers',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Add a customer',
    request: { body: customerInputSchema },
    responses: { 201: { description: 'Added', schema: customerResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ customer: await createCustomer(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/customers/:id',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'A customer and their sites',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Customer', schema: customerResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json({ customer: await getCustomer(deps, actor, params.id) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/customers/:id/sites',
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary: 'Add a site to a customer',
    request: { params: idParamSchema, body: siteInputSchema },
    responses: { 201: { description: 'Added', schema: newSiteResponseSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.status(201).json({ site: await createSite(deps, actor, params.id, body) });
    },
  }),
];
