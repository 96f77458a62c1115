// A case's life: edits to a draft, submission for review, release by a second engineer (four eyes),
// new revisions, and the subscribers' e-mail when a release supersedes the one they use.
// Every change and its audit event share one transaction; a released revision never changes.
import { and, desc, eq, max, sql } from 'drizzle-orm';
import type { CaseRevisionParsed, CaseUpdateParsed } from '../../shared/api/cases';
import type { CaseInputs } from '../../shared/api/case-content';
import { derivedCaseValues } from './case-derivation';
import { resultSummary, withRationale } from './case-drafts';
import { customCaseValues, customRequestOf } from './custom-case';
import { rederivationBlocked } from './case-currency';
import { ephemerisOf } from '../ephemerides/ephemeris-store';
import { evaluateCase } from '../../shared/physics/design-cases';
import { resolveMargins } from '../../shared/physics/design-environment';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { Tx } from '../db/database';
import { auditEvents, caseComments, caseSubscriptions, loadCases, missions, users, type CaseCommentRow, type LoadCaseRow, type UserRow } from '../db/schema';
import { ApiError, conflict, forbidden, unprocessable } from '../errors';
import { canonicalJson } from './canonical-json';
import { caseChecksum } from './case-export';
import { limitCaseWork, surfaceSnapshot } from './case-snapshot';
import { attitudeText } from '../../shared/physics/case-words';
import { caseReleasedMail } from './case-mail';
import { ephemerisCaseValues, ephemerisRequestOf } from './ephemeris-case';
import { withMargins } from '../../shared/physics/trajectory-case';
import { emailsOf, subscribersOf, surfaceDifferences } from './case-views';


const label = (row: LoadCaseRow) => `"${row.name}" revision ${row.revision}`;

function requireStatus(row: LoadCaseRow, allowed: LoadCaseRow['status'][], doing: string): void {
  if (allowed.includes(row.status)) return;
  const why = row.status === 'released' || row.status === 'superseded'
    ? `it is ${row.status} and cannot change; start a new revision instead`
    : `it is in ${row.status}, and only a case in ${allowed.join(' or ')} can be ${doing}`;
  throw conflict(`The load case ${label(row)} cannot be ${doing}: ${why}.`, `case_${row.status}`);
}

/** Every write to a revision counts one more version (what an edit names to detect a lost update). */
const nextVersion = sql`${loadCases.version} + 1`;

/** Who changed the revision last and when, from its audit trail, for a conflict message. */
function lastChange(db: AppContext['db'] | Tx, row: LoadCaseRow): string {
  const last = db
    .select({ at: auditEvents.at, name: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(and(eq(auditEvents.targetType, 'load_case'), eq(auditEvents.targetId, row.id)))
    .orderBy(desc(auditEvents.at), desc(sql`"audit_events".rowid`))
    .get();
  return last ? ` (last by ${last.name ?? 'a former member'} at ${last.at.slice(0, 16).replace('T', ' ')} UTC)` : '';
}

/** 409 when the edit was made on another version of the revision than the stored one. */
function editConflict(db: AppContext['db'] | Tx, current: LoadCaseRow, edited: number): ApiError {
  const message =
    `The load case ${label(current)} was changed by someone else while you edited it${lastChange(db, current)}: ` +
    `your edit was made on version ${edited}, it is now at version ${current.version}. Reload it to see the change, then make yours again.`;
  return new ApiError(409, 'case_edit_conflict', message);
}

function audit(tx: Tx, row: LoadCaseRow, user: UserRow, action: string, summary: string): void {
  recordAudit(tx, { workspaceId: row.workspaceId, actorUserId: user.id, action, targetType: 'load_case', targetId: row.id, summary });
}

interface Edited {
  inputs: CaseInputs;
  results: LoadCaseRow['results'];
  /** The inputs that changed, for the audit line. */
  changedKeys: string[];
}

/**
 * Changes a draft: its name, margins and inputs. A case from an orbit is computed again from the
 * new inputs; a case from an ephemeris keeps its loads (only its margin columns follow the margins).
 */
export function updateCase(ctx: AppContext, user: UserRow, row: LoadCaseRow, change: CaseUpdateParsed): LoadCaseRow {
  requireStatus(row, ['draft'], 'changed');
  if (change.version !== undefined && change.version !== row.version) throw editConflict(ctx.db, row, change.version);
  const before = row.inputs;
  const margins = change.margins
    ? resolveMargins({
        heatLoadPercent: change.margins.heatLoadPercent ?? before.margins.heatLoadPercent,
        temperatureMarginC: change.margins.temperatureMarginC ?? before.margins.temperatureMarginC,
      })
    : before.margins;
  const { inputs, results, changedKeys } = before.ephemeris ? ephemerisCaseEdit(row, change, margins) : orbitCaseEdit(row, change, margins);
  return ctx.db.transaction((tx) => {
    const updated = tx
      .update(loadCases)
      .set({ name: change.name ?? row.name, inputs, results, ...resultSummary(results), version: nextVersion, updatedAt: new Date().toISOString() })
      .where(and(eq(loadCases.id, row.id), eq(loadCases.status, 'draft'), eq(loadCases.version, row.version)))
      .returning()
      .get();
    if (!updated) {
      const current = tx.select().from(loadCases).where(eq(loadCases.id, row.id)).get();
      if (current?.status === 'draft') throw editConflict(tx, current, change.version ?? row.version);
      throw conflict(`The load case ${label(row)} changed status meanwhile; reload it.`);
    }
    const what = [change.name ? 'name' : null, change.margins ? 'margins' : null, ...changedKeys].filter(Boolean).join(', ') || 'nothing';
    audit(tx, updated, user, 'case.edited', `Edited ${label(updated)} (${what}).`);
    return updated;
  });
}

function orbitCaseEdit(row: LoadCaseRow, change: CaseUpdateParsed, margins: CaseInputs['margins']): Edited {
  const before = row.inputs;
  const { attitude, ...conditionEdits } = change.inputs ?? {};
  const conditions = { ...before.conditions, ...conditionEdits };
  const changedKeys = Object.keys(conditionEdits).filter(
    (k) => canonicalJson(conditionEdits[k as keyof typeof conditionEdits]) !== canonicalJson(before.conditions[k as keyof typeof before.conditions]),
  );
  const handEdited = [...new Set([...(before.handEdited ?? []), ...changedKeys])];
  limitCaseWork(conditions.steps, conditions.surfaces.length);
  const results = evaluateCase(conditions, margins);
  const inputs = withRationale(row.kind, {
    ...before,
    attitude: attitude ?? (conditionEdits.surfaces ? attitudeText(conditions.surfaces) : before.attitude),
    conditions,
    margins,
    ...(handEdited.length > 0 ? { handEdited } : {}),
  }, results);
  return { inputs, results, changedKeys };
}

/**
 * A case from an ephemeris: its loads come from the trajectory, so only the name and the margins
 * change here; other inputs are a new case from the ephemeris (422 naming them).
 */
function ephemerisCaseEdit(row: LoadCaseRow, change: CaseUpdateParsed, margins: CaseInputs['margins']): Edited {
  const before = row.inputs;
  const edited = Object.entries(change.inputs ?? {});
  if (edited.length > 0) {
    throw unprocessable(
      `The case ${label(row)} was computed along the ephemeris "${before.ephemeris?.name ?? ''}": its ${edited.map(([k]) => k).join(', ')} cannot be changed by hand. Make a new case from the ephemeris with the window and properties you want.`,
      edited.map(([k, v]) => ({ path: `inputs.${k}`, message: `fixed by the ephemeris the case was computed along (got ${JSON.stringify(v)?.slice(0, 80) ?? 'nothing'})` })),
    );
  }
  const results = withMargins(row.results, margins, before.conditions.marginDirection);
  return { inputs: withRationale(row.kind, { ...before, margins }, results), results, changedKeys: [] };
}

export function submitCase(ctx: AppContext, user: UserRow, row: LoadCaseRow): LoadCaseRow {
  requireStatus(row, ['draft'], 'submitted for review');
  return ctx.db.transaction((tx) => {
    const now = new Date().toISOString();
    const updated = tx.update(loadCases).set({ status: 'review', submittedBy: user.id, submittedAt: now, version: nextVersion, updatedAt: now }).where(eq(loadCases.id, row.id)).returning().get();
    if (!updated) throw conflict(`The load case ${label(row)} is gone.`);
    audit(tx, updated, user, 'case.submitted', `Submitted ${label(updated)} for review.`);
    return updated;
  });
}

/**
 * Releases a case in review: needs a thermal engineer or owner other than its author (four eyes);
 * sets the checksum, supersedes the series' previous release and mails the series' subscribers.
 */
export async function releaseCase(ctx: AppContext, user: UserRow, row: LoadCaseRow): Promise<LoadCaseRow> {
  requireStatus(row, ['review'], 'released');
  if (row.authorId === user.id) {
    throw forbidden(`You wrote ${label(row)}, so another thermal engineer or owner must release it (four-eyes rule).`, 'four_eyes');
  }
  const { released, previous } = ctx.db.transaction((tx) => {
    const now = new Date().toISOString();
    const previousRow = tx
      .select()
      .from(loadCases)
      .where(and(eq(loadCases.seriesId, row.seriesId), eq(loadCases.status, 'released')))
      .orderBy(desc(loadCases.revision))
      .get();
    // Revisions are released in order: once revision n is out, an older one in review never replaces it.
    if (previousRow && previousRow.revision > row.revision) {
      throw conflict(
        `The load case ${label(row)} cannot be released: revision ${previousRow.revision} is released already and is newer. ` +
          `A release never goes back to an older revision; start a new revision from revision ${previousRow.revision} and carry this one's changes over.`,
        'case_revision_out_of_order',
      );
    }
    const withRelease: LoadCaseRow = { ...row, status: 'released', releasedBy: user.id, releasedAt: now };
    const checksum = caseChecksum(withRelease);
    const updated = tx
      .update(loadCases)
      .set({ status: 'released', releasedBy: user.id, releasedAt: now, checksum, version: nextVersion, updatedAt: now })
      .where(and(eq(loadCases.id, row.id), eq(loadCases.status, 'review')))
      .returning()
      .get();
    if (!updated) throw conflict(`The load case ${label(row)} changed status meanwhile; reload it.`);
    if (previousRow) {
      tx.update(loadCases).set({ status: 'superseded', version: nextVersion, updatedAt: now }).where(eq(loadCases.id, previousRow.id)).run();
      audit(tx, previousRow, user, 'case.superseded', `${label(previousRow)} superseded by revision ${updated.revision}.`);
    }
    audit(tx, updated, user, 'case.released', `Released ${label(updated)} (sha256 ${checksum.slice(0, 12)}…).`);
    return { released: updated, previous: previousRow ?? null };
  });
  await notifySubscribers(ctx, released, previous);
  return released;
}

async function notifySubscribers(ctx: AppContext, released: LoadCaseRow, previous: LoadCaseRow | null): Promise<void> {
  const recipients = emailsOf(ctx.db, subscribersOf(ctx.db, released.seriesId));
  const link = `${ctx.config.publicUrl}/w/${released.workspaceId}/cases/${released.id}`;
  const differences = previous ? surfaceDifferences(previous.results, released.results) : null;
  for (const r of recipients) {
    // A mail server that fails must not undo a release that is already committed.
    try {
      await ctx.mailer.send(caseReleasedMail({ to: r.email, row: released, previous, differences, link }));
    } catch (error) {
      ctx.logger.error('case release mail failed', { caseId: released.id, error: error instanceof Error ? error : String(error) });
    }
  }
}

/**
 * Starts a new draft revision from a released (or superseded) one: the same inputs, or with
 * `fromCurrentInputs` the case computed again from the mission as it is now (`derivedAgain`);
 * the reason is kept in its inputs (history, compare, exports, mail).
 */
export function newRevision(ctx: AppContext, user: UserRow, row: LoadCaseRow, request: CaseRevisionParsed = { fromCurrentInputs: false }): LoadCaseRow {
  requireStatus(row, ['released', 'superseded'], 'revised');
  const fresh = request.fromCurrentInputs ? derivedAgain(ctx, row) : { inputs: row.inputs, results: row.results };
  const { revisionReason: _previousReason, ...kept } = fresh.inputs;
  const inputs: CaseInputs = request.reason ? { ...kept, revisionReason: request.reason } : kept;
  return ctx.db.transaction((tx) => {
    const top = tx.select({ n: max(loadCases.revision) }).from(loadCases).where(eq(loadCases.seriesId, row.seriesId)).get();
    const created = tx
      .insert(loadCases)
      .values({
        missionId: row.missionId, workspaceId: row.workspaceId, seriesId: row.seriesId, revision: (top?.n ?? row.revision) + 1,
        name: row.name, kind: row.kind, status: 'draft', inputs, results: fresh.results, ...resultSummary(fresh.results), authorId: user.id,
      })
      .returning()
      .get();
    const how = request.fromCurrentInputs ? ', derived again from the current mission inputs' : '';
    audit(tx, created, user, 'case.revised', `Started ${label(created)} from revision ${row.revision}${how}${request.reason ? `: "${excerpt(request.reason)}"` : ''}.`);
    return created;
  });
}

/**
 * The revision computed again from the mission as it is now: a hot or cold case derived again on its
 * orbit with its steps, margins and property set; a custom case on its date with the values its
 * author fixed; a case from an ephemeris along the same window. 409 when its orbit or ephemeris is gone.
 */
function derivedAgain(ctx: AppContext, row: LoadCaseRow): Pick<LoadCaseRow, 'inputs' | 'results'> {
  const i = row.inputs;
  const mission = ctx.db.select().from(missions).where(eq(missions.id, row.missionId)).get();
  const blocked = mission ? rederivationBlocked(ctx.db, row) : `The mission of ${label(row)} is gone.`;
  if (blocked || !mission) throw conflict(blocked ?? '', 'case_source_deleted');
  if (i.ephemeris) {
    const ephemeris = ephemerisOf(ctx, mission.id, i.ephemeris.id);
    return ephemerisCaseValues(ctx, mission, ephemeris, ephemerisRequestOf(row, ephemeris));
  }
  if (row.kind === 'custom') {
    const names = surfaceSnapshot(ctx.db, mission).map((s) => s.name);
    return customCaseValues(ctx.db, mission, customRequestOf(row, names));
  }
  const values = derivedCaseValues(ctx.db, mission, {
    orbitId: i.orbit.id ?? '', steps: i.conditions.steps,
    margins: { heatLoadPercent: i.margins.heatLoadPercent, temperatureMarginC: i.margins.temperatureMarginC },
    properties: { hot: i.conditions.properties, cold: i.conditions.properties },
    // a case chosen among the phases is chosen again among them as they are now; a case derived in the
    // one phase asked for, again in that phase; a survival case with its survival dissipation
    // (one made before `phases` was kept tells by having compared more than one)
    ...(i.phase && !i.phases && (i.decision?.phase?.compared.length ?? 0) <= 1 ? { phaseId: i.phase.id } : {}),
    survival: i.decision?.survival !== undefined,
  });
  const again = values.find((v) => v.kind === row.kind && (v.inputs.decision?.survival !== undefined) === (i.decision?.survival !== undefined))!;
  return { inputs: again.inputs, results: again.results };
}

export function setSubscription(ctx: AppContext, user: UserRow, row: LoadCaseRow, on: boolean): { subscribed: boolean } {
  ctx.db.transaction((tx) => {
    if (on) {
      tx.insert(caseSubscriptions).values({ caseSeriesId: row.seriesId, userId: user.id }).onConflictDoNothing().run();
    } else {
      tx.delete(caseSubscriptions).where(and(eq(caseSubscriptions.caseSeriesId, row.seriesId), eq(caseSubscriptions.userId, user.id))).run();
    }
    audit(tx, row, user, on ? 'case.subscribed' : 'case.unsubscribed', `${on ? 'Subscribed to' : 'Unsubscribed from'} "${row.name}".`);
  });
  return { subscribed: on };
}

/** 403 when the caller wrote the revision: only another engineer reviews it (four eyes). */
export function requireReviewer(row: LoadCaseRow, user: UserRow): void {
  if (row.authorId === user.id) {
    throw forbidden(`You wrote ${label(row)}, so another thermal engineer or owner reviews and returns it (four-eyes rule).`, 'four_eyes');
  }
}

const excerpt = (text: string) => (text.length > 80 ? `${text.slice(0, 79)}…` : text).replace(/\s+/g, ' ');

/**
 * Returns a revision in review to its author as a draft, with the reviewer's comment kept in the
 * case's history; like a release, it is a reviewer's act, so not the author's (four eyes).
 */
export function returnCase(ctx: AppContext, user: UserRow, row: LoadCaseRow, comment: string): LoadCaseRow {
  requireReviewer(row, user);
  requireStatus(row, ['review'], 'returned to its author');
  return ctx.db.transaction((tx) => {
    const now = new Date().toISOString();
    const updated = tx
      .update(loadCases)
      .set({ status: 'draft', submittedBy: null, submittedAt: null, version: nextVersion, updatedAt: now })
      .where(and(eq(loadCases.id, row.id), eq(loadCases.status, 'review')))
      .returning()
      .get();
    if (!updated) throw conflict(`The load case ${label(row)} changed status meanwhile; reload it.`);
    tx.insert(caseComments).values({ caseId: row.id, seriesId: row.seriesId, revision: row.revision, kind: 'returned', text: comment, authorId: user.id }).run();
    audit(tx, updated, user, 'case.returned', `Returned ${label(updated)} to its author: "${excerpt(comment)}".`);
    return updated;
  });
}

/** A comment on a draft or a revision in review; a released one is closed (409). */
export function commentOnCase(ctx: AppContext, user: UserRow, row: LoadCaseRow, text: string): CaseCommentRow {
  requireStatus(row, ['draft', 'review'], 'commented on');
  return ctx.db.transaction((tx) => {
    const made = tx.insert(caseComments).values({ caseId: row.id, seriesId: row.seriesId, revision: row.revision, kind: 'comment', text, authorId: user.id }).returning().get();
    audit(tx, row, user, 'case.commented', `Commented on ${label(row)}: "${excerpt(text)}".`);
    return made;
  });
}
