import { Router, type RequestHandler, type Response } from 'express';
import { idSchema, resultsCsvQuerySchema, revisionLetterSchema } from '@biasproof/shared';
import type { Services } from '../services.ts';
import { requireUser, signedInUser } from '../auth/require-user.ts';
import { authorize, orgContextOf, orgScope } from '../orgs/org-scope.ts';
import { noSuchRevision } from './record-data.ts';
import { downloadPackage, downloadReport, downloadResultsCsv, type Download } from './downloads.ts';
import { worksheetExportQuerySchema, worksheetsCsv } from './csv/worksheets-csv.ts';

/** A malformed worksheet id or revision letter names nothing: 404, like another organization's. */
function revisionOf(params: Record<string, unknown>): { id: string; letter: string } {
  const id = idSchema.safeParse(params.id);
  const letter = revisionLetterSchema.safeParse(params.letter);
  if (!id.success || !letter.success || letter.data !== params.letter) throw noSuchRevision();
  return { id: id.data, letter: letter.data };
}

function send(res: Response, download: Download, type: string): void {
  // Records are private to the organization: never kept by a shared cache.
  res
    .set('Cache-Control', 'private, no-store')
    .attachment(download.filename)
    .type(type)
    .send(download.body);
}

/**
 * `/api/orgs/:orgId/worksheets/…` downloads: the report, the record package and CSV files.
 * Mounted ahead of the worksheet routes (so `export.csv` is not read as a worksheet id), each
 * route passes the same gate as every org-scoped route (sign-in, then membership) itself,
 * which leaves requests for other paths untouched.
 */
export function recordRoutes(svc: Services): Router {
  const router = Router({ mergeParams: true });
  const gate: RequestHandler[] = [requireUser(svc.sequelize), orgScope(svc.sequelize)];
  const requester = (res: Response) => ({ name: signedInUser(res).name });

  router.get('/export.csv', ...gate, authorize('read', 'Worksheet'), async (req, res) => {
    const query = worksheetExportQuerySchema.parse(req.query);
    const body = await worksheetsCsv(orgContextOf(res), query);
    send(res, { filename: 'worksheets.csv', body }, 'text/csv; charset=utf-8; header=present');
  });
  // The three downloads of one revision differ only in what they produce and its type.
  const revisionDownloads: {
    file: string;
    type: string;
    produce: (res: Response, id: string, letter: string, query: unknown) => Promise<Download>;
  }[] = [
    {
      file: 'report.pdf',
      type: 'application/pdf',
      produce: (res, id, letter) => downloadReport(orgContextOf(res), requester(res), id, letter),
    },
    {
      file: 'record.zip',
      type: 'application/zip',
      produce: (res, id, letter) => downloadPackage(orgContextOf(res), requester(res), id, letter),
    },
    {
      file: 'results.csv',
      type: 'text/csv; charset=utf-8; header=present',
      produce: (res, id, letter, query) =>
        downloadResultsCsv(orgContextOf(res), id, letter, resultsCsvQuerySchema.parse(query).table),
    },
  ];
  for (const { file, type, produce } of revisionDownloads) {
    router.get(
      `/:id/revisions/:letter/${file}`,
      ...gate,
      authorize('read', 'Revision'),
      async (req, res) => {
        const { id, letter } = revisionOf(req.params);
        send(res, await produce(res, id, letter, req.query), type);
      },
    );
  }
  return router;
}
