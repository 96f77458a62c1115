// cases: load cases of a mission (shared/api/cases.ts), and the documents that describe the API:
// the JSON Schema of a case export and the OpenAPI description of every route.
import { Router } from 'express';
import { caseCommentCreate, caseCompareQuery, caseCreate, caseRevisionCreate, caseDerive, caseExportQuery, caseListQuery, caseUpdate } from '../../shared/api/cases';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { requireUser, signedIn, workspaceAccess } from '../auth/middleware';
import { caseFor, missionForCases } from '../cases/case-access';
import { deriveCases } from '../cases/case-derivation';
import { createCustomCase } from '../cases/custom-case';
import { caseExportCsv, caseExportJson } from '../cases/case-export';
import { workspaceOverview } from '../cases/case-overview';
import { commentOnCase, newRevision, releaseCase, requireReviewer, returnCase, setSubscription, submitCase, updateCase } from '../cases/case-lifecycle';
import { commentsOf, compareCases, listCases, toDetail } from '../cases/case-views';
import { badRequest, parse } from '../errors';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { apiDocsRoutes } from '../openapi/api-docs-routes';
import { pathParam } from '../path-param';

const fileName = (name: string, revision: number, ext: string) =>
  `${name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'case'}-rev${revision}.${ext}`;

export function caseRoutes(ctx: AppContext): Router {
  const router = Router();
  const me = (req: Parameters<typeof signedIn>[0]) => signedIn(req).user;

  router.post('/missions/:id/cases/derive', requireUser, (req, res) => {
    const { mission } = missionForCases(ctx, me(req).id, pathParam(req, 'id'));
    const input = parse(caseDerive, req.body);
    const rows = deriveCases(ctx, me(req), mission, input);
    res.status(201).json({ items: rows.map((r) => toDetail(ctx.db, r, me(req).id)) });
  });

  router.post('/missions/:id/cases', requireUser, (req, res) => {
    const { mission } = missionForCases(ctx, me(req).id, pathParam(req, 'id'));
    const row = createCustomCase(ctx, me(req), mission, parse(caseCreate, req.body));
    res.status(201).json(toDetail(ctx.db, row, me(req).id));
  });

  router.get('/cases', requireUser, (req, res) => {
    const filter = parse(caseListQuery, req.query);
    res.json({ items: listCases(ctx, me(req).id, filter) });
  });

  router.get('/workspaces/:workspaceId/overview', workspaceAccess(ctx, ['owner', 'analyst', 'thermal', 'viewer']), (req, res) => {
    const membership = req.membership;
    if (!membership) throw new Error('workspaceAccess sets the membership');
    res.json(workspaceOverview(ctx, me(req).id, membership.workspaceId, membership.role));
  });

  router.get('/cases/:id', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'));
    res.json(toDetail(ctx.db, row, me(req).id));
  });

  router.patch('/cases/:id', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'), true);
    const change = parse(caseUpdate, req.body);
    res.json(toDetail(ctx.db, updateCase(ctx, me(req), row, change), me(req).id));
  });

  router.post('/cases/:id/submit', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'), true);
    res.json(toDetail(ctx.db, submitCase(ctx, me(req), row), me(req).id));
  });

  router.post('/cases/:id/release', requireUser, async (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'), true);
    const released = await releaseCase(ctx, me(req), row);
    res.json(toDetail(ctx.db, released, me(req).id));
  });

  router.post('/cases/:id/return', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'), true);
    requireReviewer(row, me(req));
    const { text } = parse(caseCommentCreate, req.body);
    res.json(toDetail(ctx.db, returnCase(ctx, me(req), row, text), me(req).id));
  });

  router.post('/cases/:id/comments', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'), true);
    const { text } = parse(caseCommentCreate, req.body);
    const made = commentOnCase(ctx, me(req), row, text);
    res.status(201).json(commentsOf(ctx.db, row.seriesId).find((c) => c.id === made.id));
  });

  router.post('/cases/:id/revisions', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'), true);
    const request = parse(caseRevisionCreate, req.body ?? {});
    res.status(201).json(toDetail(ctx.db, newRevision(ctx, me(req), row, request), me(req).id));
  });

  router.get('/cases/:id/compare', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'));
    const query = parse(caseCompareQuery, req.query);
    const other = caseFor(ctx, me(req).id, query.with).row;
    if (other.missionId !== row.missionId) {
      throw badRequest('Compare revisions of cases of the same mission.', [{ path: 'with', message: `case ${query.with} belongs to another mission` }]);
    }
    res.json(compareCases(ctx.db, row, other));
  });

  // Any member who may see a case may follow it, viewers included: they are the importing teams.
  router.post('/cases/:id/subscription', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'));
    setSubscription(ctx, me(req), row, true);
    res.json({ subscribed: true });
  });

  router.delete('/cases/:id/subscription', requireUser, (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'));
    setSubscription(ctx, me(req), row, false);
    res.json({ subscribed: false });
  });

  router.get('/cases/:id/export', requireUser, async (req, res) => {
    const { row } = caseFor(ctx, me(req).id, pathParam(req, 'id'));
    const query = parse(caseExportQuery, req.query);
    const form = answerForm(req, query.layout);
    const format = form === 'arrow' ? 'arrow' : query.format;
    const json = format !== 'csv' ? caseExportJson(ctx, row) : null;
    const csv = format === 'csv' ? caseExportCsv(ctx, row) : null;
    recordAudit(ctx.db, {
      workspaceId: row.workspaceId, actorUserId: me(req).id, action: 'case.exported', targetType: 'load_case', targetId: row.id,
      summary: `Exported "${row.name}" revision ${row.revision} (${row.status}) as ${format === 'arrow' ? 'an Apache Arrow stream' : format.toUpperCase()}${signedIn(req).kind === 'token' ? ' with an API token' : ''}.`,
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
  });

  router.use(apiDocsRoutes(ctx));
  return router;
}
