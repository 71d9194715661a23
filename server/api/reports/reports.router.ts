import { idParamSchema } from '../../../shared/schemas/common.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { renderReportPdf } from './report-pdf.js';
import { buildReport } from './reports.service.js';

const fileName = (title: string) => `${title.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '').toLowerCase() || 'review'}-report.pdf`;

/** The printable review report of a revision, as data and as a PDF (mounted under /api/revisions). */
export function reportRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '/:id/report', access: 'signed-in', params: idParamSchema,
      handler: async ({ params, res }) => { res.json({ report: await buildReport(dataSource, params.id) }); },
    }),
    defineRoute({
      method: 'get', path: '/:id/report.pdf', access: 'signed-in', params: idParamSchema,
      handler: async ({ params, res }) => {
        const report = await buildReport(dataSource, params.id);
        const pdf = await renderReportPdf(report);
        res.status(200).type('application/pdf').set('Content-Disposition', `attachment; filename="${fileName(report.title)}"`).send(pdf);
      },
    }),
  ];
}
