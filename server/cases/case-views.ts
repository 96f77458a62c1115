// The answers of the case routes, built from rows: summaries for lists, the full case, and the
// side-by-side comparison of two revisions.
import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { CaseActionName, CaseComment, CaseComparison, CaseDetail, CaseSummary } from '../../shared/api/cases';
import type { Role } from '../../shared/api/workspaces';
import { memberRole } from '../auth/middleware';
import type { CaseInputs, CaseResultsContent } from '../../shared/api/case-content';
import type { AppContext } from '../app-context';
import type { Db } from '../db/database';
import { preparedPer } from '../db/prepared';
import { memoisedRead } from '../db/read-memo';
import { caseComments, caseSubscriptions, loadCases, memberships, missions, users, type LoadCaseRow } from '../db/schema';
import { caseEditors, visibleToViewer } from './case-access';
import { caseInputsOf, inputChanges, missionsNow, rederivationBlocked, type CurrencyInputs } from './case-currency';

export { cautionFor, cautionText, crewedCaution } from '../../shared/api/caution';
import { cautionFor } from '../../shared/api/caution';
import { round } from '../../shared/physics/rounding';

type Person = CaseSummary['author'];

const personById = preparedPer((db: Db) =>
  db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(eq(users.id, sql.placeholder('userId'))).prepare(),
);

export function personOf(db: Db, userId: string | null): Person {
  if (!userId) return null;
  const u = personById(db).get({ userId });
  return u ?? null;
}

function missionName(db: Db, missionId: string): string {
  return db.select({ name: missions.name }).from(missions).where(eq(missions.id, missionId)).get()?.name ?? '';
}

export function toSummary(db: Db, row: LoadCaseRow): CaseSummary {
  return {
    id: row.id, missionId: row.missionId, missionName: missionName(db, row.missionId), workspaceId: row.workspaceId, seriesId: row.seriesId,
    name: row.name, kind: row.kind, status: row.status, revision: row.revision, checksum: row.checksum,
    author: personOf(db, row.authorId), releasedBy: personOf(db, row.releasedBy), releasedAt: row.releasedAt,
    orbitAverageAbsorbedW: row.results.total.orbitAverageAbsorbedW, betaDeg: row.results.betaDeg,
    version: row.version, createdAt: row.createdAt, updatedAt: row.updatedAt,
    ...currency(db, row),
    ...phaseOfCase(row.inputs),
  };
}

/** The phase that drove a case and its variant, as the lists show them. */
export const phaseOfCase = (inputs: Pick<CaseInputs, 'phase' | 'decision'>): Pick<CaseSummary, 'phase' | 'variant'> => ({
  phase: inputs.phase?.name ?? null,
  variant: inputs.decision?.survival ? 'survival' : null,
});

/** What changed since a revision was made, as a list says it: not said of superseded revisions. */
function currency(
  db: Db, row: { missionId: string; status: LoadCaseRow['status']; inputs: CurrencyInputs }, missionNow = missionsNow(db),
): Pick<CaseSummary, 'inputsChanged' | 'inputChanges'> {
  const changes = row.status === 'superseded' ? [] : inputChanges(db, row, missionNow);
  return { inputsChanged: changes.length > 0, inputChanges: changes };
}

export function isSubscribed(db: Db, seriesId: string, userId: string): boolean {
  return !!db
    .select({ id: caseSubscriptions.id })
    .from(caseSubscriptions)
    .where(and(eq(caseSubscriptions.caseSeriesId, seriesId), eq(caseSubscriptions.userId, userId)))
    .get();
}

/**
 * What a member may do with a revision now, by role, status and authorship: the same rules the
 * routes enforce, so a page never offers an action the server refuses (four eyes: the author
 * neither releases nor returns their own revision).
 */
export function caseActionsFor(row: LoadCaseRow, role: Role | null, userId: string): CaseActionName[] {
  if (!role || !caseEditors.includes(role)) return [];
  const reviewer = row.authorId !== userId;
  switch (row.status) {
    case 'draft':
      return ['edit', 'submit', 'comment'];
    case 'review':
      return reviewer ? ['release', 'return', 'comment'] : ['comment'];
    default:
      return ['newRevision'];
  }
}

/** The review conversation of a case series, oldest first. */
export function commentsOf(db: Db, seriesId: string): CaseComment[] {
  return db
    .select({ c: caseComments, name: users.name, email: users.email })
    .from(caseComments)
    .leftJoin(users, eq(users.id, caseComments.authorId))
    .where(eq(caseComments.seriesId, seriesId))
    .orderBy(caseComments.createdAt, sql`"case_comments".rowid`)
    .all()
    .map(({ c, name, email }) => ({
      id: c.id, revision: c.revision, kind: c.kind, text: c.text, createdAt: c.createdAt,
      author: c.authorId && name !== null && email !== null ? { id: c.authorId, name, email } : null,
    }));
}

export function toDetail(db: Db, row: LoadCaseRow, userId: string): CaseDetail {
  const summary = toSummary(db, row);
  return {
    ...summary,
    submittedBy: personOf(db, row.submittedBy),
    submittedAt: row.submittedAt,
    subscribed: isSubscribed(db, row.seriesId, userId),
    actions: caseActionsFor(row, memberRole(db, userId, row.workspaceId), userId),
    comments: commentsOf(db, row.seriesId),
    // the page says what changed of a superseded revision too
    inputChanges: row.status === 'superseded' ? inputChanges(db, row) : summary.inputChanges,
    currentInputsBlocked: rederivationBlocked(db, row),
    caution: cautionFor(row.inputs.mission.crewed),
    inputs: row.inputs,
    results: row.results,
  };
}

export interface CaseFilter {
  missionId?: string | undefined;
  status?: LoadCaseRow['status'] | undefined;
  kind?: LoadCaseRow['kind'] | undefined;
}

type FilterShape = Record<keyof CaseFilter, boolean>;

/** The case list's query for the filters that are given, their values left as placeholders. */
function caseListQuery(db: Db, given: FilterShape) {
  const conditions: SQL[] = [];
  if (given.missionId) conditions.push(eq(loadCases.missionId, sql.placeholder('missionId')));
  if (given.status) conditions.push(eq(loadCases.status, sql.placeholder('status')));
  if (given.kind) conditions.push(eq(loadCases.kind, sql.placeholder('kind')));
  return db
    .select({
      c: {
        id: loadCases.id, missionId: loadCases.missionId, workspaceId: loadCases.workspaceId, seriesId: loadCases.seriesId,
        name: loadCases.name, kind: loadCases.kind, status: loadCases.status, revision: loadCases.revision, checksum: loadCases.checksum,
        authorId: loadCases.authorId, releasedBy: loadCases.releasedBy, releasedAt: loadCases.releasedAt,
        version: loadCases.version, createdAt: loadCases.createdAt, updatedAt: loadCases.updatedAt,
      },
      // Read out of the JSON in SQL so a list does not parse every case's time series.
      // Copied out of the results when they are written (resultSummary); read out of the JSON only
      // for a row written without them, as parsing each case's results costs ~0.3 ms a case.
      orbitAverageAbsorbedW: sql<number>`coalesce(${loadCases.orbitAverageAbsorbedW}, json_extract(${loadCases.results}, '$.total.orbitAverageAbsorbedW'))`,
      betaDeg: sql<number>`coalesce(${loadCases.betaDeg}, json_extract(${loadCases.results}, '$.betaDeg'))`,
      missionName: missions.name,
      role: memberships.role,
    })
    .from(loadCases)
    .innerJoin(memberships, and(eq(memberships.workspaceId, loadCases.workspaceId), eq(memberships.userId, sql.placeholder('userId'))))
    .innerJoin(missions, eq(missions.id, loadCases.missionId))
    .where(conditions.length > 0 ? and(...conditions) : undefined)
    .orderBy(missions.name, loadCases.name, desc(loadCases.revision))
    .prepare();
}

/** One prepared case list query per database and combination of given filters (eight at most). */
const caseListQueries = preparedPer((_db: Db) => new Map<string, ReturnType<typeof caseListQuery>>());

/**
 * The cases of every workspace the user belongs to; a viewer's list holds released and superseded
 * ones only. Worked out again after any write to the database (memoisedRead): the list and each
 * case's currency with its mission depend on the database alone.
 */
export function listCases(ctx: AppContext, userId: string, filter: CaseFilter): readonly CaseSummary[] {
  return memoisedRead(ctx.db, `cases ${listKey(userId, filter)}`, () => readCaseList(ctx, userId, filter));
}

/**
 * The case list's answer ({ items }) as JSON text, as res.json would write it: made once per
 * database change like the list itself, so a repeated list is not serialised again.
 */
export function caseListJson(ctx: AppContext, userId: string, filter: CaseFilter): string {
  return memoisedRead(ctx.db, `cases json ${listKey(userId, filter)}`, () => JSON.stringify({ items: listCases(ctx, userId, filter) }));
}

const listKey = (userId: string, filter: CaseFilter) => JSON.stringify([userId, filter.missionId ?? null, filter.status ?? null, filter.kind ?? null]);

function readCaseList(ctx: AppContext, userId: string, filter: CaseFilter): CaseSummary[] {
  const given: FilterShape = { missionId: !!filter.missionId, status: !!filter.status, kind: !!filter.kind };
  const key = `${+given.missionId}${+given.status}${+given.kind}`;
  const queries = caseListQueries(ctx.db);
  let query = queries.get(key);
  if (query === undefined) {
    query = caseListQuery(ctx.db, given);
    queries.set(key, query);
  }
  const rows = query.all({ userId, missionId: filter.missionId, status: filter.status, kind: filter.kind });
  const missionNow = missionsNow(ctx.db);
  const people = new Map<string, Person>();
  const person = (id: string | null): Person => {
    if (!id) return null;
    if (!people.has(id)) people.set(id, personOf(ctx.db, id));
    return people.get(id) ?? null;
  };
  return rows
    .filter((r) => r.role !== 'viewer' || visibleToViewer(r.c.status))
    .map((r) => ({
      id: r.c.id, missionId: r.c.missionId, missionName: r.missionName, workspaceId: r.c.workspaceId, seriesId: r.c.seriesId,
      name: r.c.name, kind: r.c.kind, status: r.c.status, revision: r.c.revision, checksum: r.c.checksum,
      author: person(r.c.authorId), releasedBy: person(r.c.releasedBy), releasedAt: r.c.releasedAt,
      orbitAverageAbsorbedW: Number(r.orbitAverageAbsorbedW), betaDeg: Number(r.betaDeg),
      ...currency(ctx.db, { missionId: r.c.missionId, status: r.c.status, inputs: caseInputsOf(ctx.db, r.c.id, r.c.version) }, missionNow),
      version: r.c.version, createdAt: r.c.createdAt, updatedAt: r.c.updatedAt,
      ...phaseOfCase(caseInputsOf(ctx.db, r.c.id, r.c.version)),
    }));
}

/**
 * The subscribers' ids of a case series who are still members of its workspace: a subscription
 * that outlived its membership (removal ends them, but this is the last line) mails nobody.
 */
export function subscribersOf(db: Db, seriesId: string): string[] {
  const workspaceOfSeries = db.select({ id: loadCases.workspaceId }).from(loadCases).where(eq(loadCases.seriesId, seriesId)).limit(1);
  return db
    .select({ userId: caseSubscriptions.userId })
    .from(caseSubscriptions)
    .innerJoin(memberships, and(eq(memberships.userId, caseSubscriptions.userId), eq(memberships.workspaceId, workspaceOfSeries)))
    .where(eq(caseSubscriptions.caseSeriesId, seriesId))
    .all()
    .map((r) => r.userId);
}

export function emailsOf(db: Db, ids: string[]): { id: string; email: string }[] {
  if (ids.length === 0) return [];
  return db.select({ id: users.id, email: users.email }).from(users).where(inArray(users.id, ids)).all();
}

type Scalar = string | number | boolean | null;

/** Flattens a snapshot into path -> scalar; arrays of named objects are keyed by name. */
function flatten(value: unknown, path: string, out: Map<string, Scalar>): void {
  if (value === null || typeof value !== 'object') {
    out.set(path, value as Scalar);
    return;
  }
  if (Array.isArray(value)) {
    value.forEach((item, i) => {
      const key = item !== null && typeof item === 'object' && 'name' in item ? `[${String((item as { name: unknown }).name)}]` : `[${i}]`;
      flatten(item, `${path}${key}`, out);
    });
    return;
  }
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) flatten(v, path ? `${path}.${k}` : k, out);
}

const compared = (a: number | undefined, b: number | undefined) =>
  a === undefined || b === undefined ? null : { a, b, difference: round(b - a) };

/** Per-surface orbit-average differences, b minus a, by surface name. */
export function surfaceDifferences(a: CaseResultsContent, b: CaseResultsContent): CaseComparison['surfaces'] {
  const names = [...new Set([...a.surfaces.map((s) => s.name), ...b.surfaces.map((s) => s.name)])];
  return names.map((name) => {
    const sa = a.surfaces.find((s) => s.name === name);
    const sb = b.surfaces.find((s) => s.name === name);
    return {
      name,
      solarW: compared(sa?.orbitAverage.solarW, sb?.orbitAverage.solarW),
      albedoW: compared(sa?.orbitAverage.albedoW, sb?.orbitAverage.albedoW),
      irW: compared(sa?.orbitAverage.irW, sb?.orbitAverage.irW),
      absorbedW: compared(sa?.orbitAverage.absorbedW, sb?.orbitAverage.absorbedW),
      peakAbsorbedW: compared(sa?.peak.absorbedW, sb?.peak.absorbedW),
    };
  });
}

/** Two cases side by side, the older as A and the newer as B, so every difference is new − old. */
export function compareCases(db: Db, first: LoadCaseRow, second: LoadCaseRow): CaseComparison {
  const newer = (x: LoadCaseRow, y: LoadCaseRow) => (x.seriesId === y.seriesId ? x.revision > y.revision : x.createdAt > y.createdAt);
  const [a, b] = newer(first, second) ? [second, first] : [first, second];
  const fa = new Map<string, Scalar>();
  const fb = new Map<string, Scalar>();
  flatten(a.inputs, '', fa);
  flatten(b.inputs, '', fb);
  const paths = [...new Set([...fa.keys(), ...fb.keys()])];
  return {
    a: toSummary(db, a),
    b: toSummary(db, b),
    inputs: paths.map((path) => ({ path, a: fa.get(path) ?? null, b: fb.get(path) ?? null, changed: fa.get(path) !== fb.get(path) })),
    surfaces: surfaceDifferences(a.results, b.results),
    total: { orbitAverageAbsorbedW: compared(a.results.total.orbitAverageAbsorbedW, b.results.total.orbitAverageAbsorbedW)! },
  };
}
