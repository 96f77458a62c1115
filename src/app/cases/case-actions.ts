import type { CaseActionName, CaseDetail } from '../../../shared/api/cases';
import type { Role } from '../../../shared/api/workspaces';

/** What a case page may offer: the changes the server says the caller may make now, and reading for every member. */
export type CaseAction = CaseActionName | 'compare' | 'subscribe' | 'export';

// PRODUCT.md: thermal engineers (and owners, who may do everything) derive, change and release
// cases; analysts and viewers read them. Which change is open now (status, four eyes) is the
// server's answer (`actions` of the case), so the page never offers what the server refuses.
const EDITORS: readonly Role[] = ['thermal', 'owner'];

const FOR_EVERY_MEMBER: readonly CaseAction[] = ['compare', 'subscribe', 'export'];

export function mayChangeCases(role: Role | null): boolean {
  return role !== null && EDITORS.includes(role);
}

export function caseActions(loadCase: Pick<CaseDetail, 'actions'>, role: Role | null): ReadonlySet<CaseAction> {
  if (role === null) return new Set();
  return new Set([...loadCase.actions, ...FOR_EVERY_MEMBER]);
}
