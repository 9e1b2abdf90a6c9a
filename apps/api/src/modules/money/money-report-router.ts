import { exportQuerySchema, moneyOverviewSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { moneyExportCsv, moneyOverview } from './money-report-service.ts';

export const moneyReportRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/money/overview',
    tag: 'Money',
    access: 'member',
    tenantData: true,
    summary:
      "The owner's money: owed, aged 0-30, 31-60 and over 60 days, overdue invoices, and revenue per month for 12 months (Owner, Admin)",
    request: {},
    responses: { 200: { description: 'Money', schema: moneyOverviewSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json(await moneyOverview(deps, actor));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/money/export.csv',
    tag: 'Money',
    access: 'member',
    tenantData: true,
    summary:
      "Invoices, credit notes and payments in a date range (the firm's calendar) as CSV for the bookkeeper (Owner, Admin)",
    request: { query: exportQuerySchema },
    responses: { 200: { description: 'CSV' } },
    handle: async ({ query, res, deps, actor }) => {
      const csv = await moneyExportCsv(deps, actor, query.from, query.to);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="money-${query.from}-to-${query.to}.csv"`);
      res.send(csv);
    },
  }),
];
