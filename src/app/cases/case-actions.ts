import type { CaseStatus } from '../../../shared/api/case-content';
import type { Role } from '../../../shared/api/workspaces';

/** What a case page may offer; the server checks again (and four-eyes release is its call alone). */
export type CaseAction = 'edit' | 'submit' | 'release' | 'newRevision' | 'compare' | 'subscribe' | 'export';

// PRODUCT.md: thermal engineers (and owners, who may do everything) derive, change and release
// cases; analysts and viewers read them. The status decides the rest: a draft is edited and
// submitted, a case in review is released, a released or superseded one starts a new revision.
const EDITORS: readonly Role[] = ['thermal', 'owner'];

const BY_STATUS: Readonly<Record<CaseStatus, readonly CaseAction[]>> = {
  draft: ['edit', 'submit'],
  review: ['release'],
  released: ['newRevision'],
  superseded: ['newRevision'],
};

const FOR_EVERY_MEMBER: readonly CaseAction[] = ['compare', 'subscribe', 'export'];

export function mayChangeCases(role: Role | null): boolean {
  return role !== null && EDITORS.includes(role);
}

export function caseActions(status: CaseStatus, role: Role | null): ReadonlySet<CaseAction> {
  if (role === null) return new Set();
  return new Set([...(mayChangeCases(role) ? BY_STATUS[status] : []), ...FOR_EVERY_MEMBER]);
}
