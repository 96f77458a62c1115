// GET /cases/:id/export: the case as a file (JSON, tidy CSV or an Apache Arrow stream) with its
// checksum in a header and the export's audit event.
import type { Request, Response } from 'express';
import type { z } from 'zod';
import type { caseExportQuery } from '../../shared/api/cases';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { RequestAuth } from '../auth/request-auth';
import type { LoadCaseRow } from '../db/schema';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { caseExportCsv, caseExportJson } from './case-export';

const fileName = (name: string, revision: number, ext: string) =>
  `${name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'case'}-rev${revision}.${ext}`;

export async function sendCaseExport(
  ctx: AppContext, req: Request, res: Response, auth: RequestAuth, row: LoadCaseRow, query: z.output<typeof caseExportQuery>,
): Promise<void> {
  const form = answerForm(req, query.layout);
  const format = form === 'arrow' ? 'arrow' : query.format;
  const json = format !== 'csv' ? caseExportJson(ctx, row) : null;
  const csv = format === 'csv' ? caseExportCsv(ctx, row) : null;
  recordAudit(ctx.db, {
    workspaceId: row.workspaceId, actorUserId: auth.user.id, action: 'case.exported', targetType: 'load_case', targetId: row.id,
    summary: `Exported "${row.name}" revision ${row.revision} (${row.status}) as ${format === 'arrow' ? 'an Apache Arrow stream' : format.toUpperCase()}${auth.kind === 'token' ? ' with an API token' : ''}.`,
  });
  res.set('Content-Disposition', `attachment; filename="${fileName(row.name, row.revision, format === 'arrow' ? 'arrows' : format)}"`);
  res.set('X-Eclipta-Checksum', json?.checksum ?? csv?.checksum ?? '');
  if (json && form === 'arrow') {
    // The export is in columns already; the Arrow stream carries them (API.md "Answer formats").
    await sendPerStep(res, form, { answer: () => json, key: 'results', stepKey: 'tS' });
    return;
  }
  if (csv) {
    res.type('text/csv; charset=utf-8; header=present').send(csv.csv);
    return;
  }
  res.type('application/json; charset=utf-8').send(JSON.stringify(json, null, 2));
}
