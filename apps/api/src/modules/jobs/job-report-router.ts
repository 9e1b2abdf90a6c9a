import { idParamSchema } from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { jobReportPdf, type ReportKind } from './job-report-service.ts';

const pdfRoute = (kind: ReportKind, path: string, summary: string, filename: string) =>
  defineRoute({
    method: 'get',
    path,
    tag: 'Jobs',
    access: 'member',
    tenantData: true,
    summary,
    request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      const pdf = await jobReportPdf(deps, actor, params.id, kind);
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader('Content-Disposition', `attachment; filename="${filename.replace('ID', String(params.id))}"`);
      res.send(pdf);
    },
  });

export const jobReportRoutes: RouteDefinition[] = [
  pdfRoute(
    'firm-record',
    '/jobs/:id/report.pdf',
    "The firm's record of a job as a PDF: everything on the sheet (firm, customer, system, volume, chemicals with lots, radiator table, agitation with vibration points and tools, water tests, kit by asset tag, steps with who and when, reasons, signatures, photos, cautions, next check)",
    'job-record-ID.pdf',
  ),
  pdfRoute(
    'customer-report',
    '/jobs/:id/customer-report.pdf',
    "The customer's report as a PDF, the one e-mailed at completion: the firm's contact details, report number, result box, system, radiator readings, chemicals with pack sizes and lots, water tests, photos, signatures, reasons for anything not done, a safety note; no vibration figures or asset tags",
    'cleaning-report-ID.pdf',
  ),
];
