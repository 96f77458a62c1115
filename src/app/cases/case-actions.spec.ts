import { caseActions, mayChangeCases } from './case-actions';

// The mapping follows PRODUCT.md's role table (thermal and owner change and release cases; analysts
// and viewers read) and issue 5's life cycle (draft -> review -> released -> superseded).
describe('caseActions', () => {
  it('lets a thermal engineer edit and submit a draft, but not release it', () => {
    const actions = caseActions('draft', 'thermal');
    expect(actions.has('edit')).toBe(true);
    expect(actions.has('submit')).toBe(true);
    expect(actions.has('release')).toBe(false);
    expect(actions.has('newRevision')).toBe(false);
  });

  it('offers release only for a case in review, to thermal engineers and owners', () => {
    expect(caseActions('review', 'owner').has('release')).toBe(true);
    expect(caseActions('review', 'thermal').has('release')).toBe(true);
    expect(caseActions('review', 'analyst').has('release')).toBe(false);
    expect(caseActions('review', 'owner').has('edit')).toBe(false);
  });

  it('starts a new revision from a released or superseded case, never edits it', () => {
    for (const status of ['released', 'superseded'] as const) {
      const actions = caseActions(status, 'thermal');
      expect(actions.has('newRevision')).toBe(true);
      expect(actions.has('edit')).toBe(false);
      expect(actions.has('release')).toBe(false);
    }
  });

  it('gives viewers and analysts reading actions only', () => {
    for (const role of ['viewer', 'analyst'] as const) {
      for (const status of ['draft', 'review', 'released', 'superseded'] as const) {
        expect([...caseActions(status, role)].sort()).toEqual(['compare', 'export', 'subscribe']);
      }
      expect(mayChangeCases(role)).toBe(false);
    }
  });

  it('offers nothing without a role in the workspace', () => {
    expect(caseActions('released', null).size).toBe(0);
    expect(mayChangeCases(null)).toBe(false);
  });
});
