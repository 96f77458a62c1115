import { caseActions, mayChangeCases } from './case-actions';

// The changes come from the server's `actions` (status, role and four eyes decided there); every
// member may compare, follow and export (PRODUCT.md role table).
describe('caseActions', () => {
  it('offers exactly the changes the server allows, plus reading for every member', () => {
    const actions = caseActions({ actions: ['comment'] }, 'thermal');
    expect([...actions].sort()).toEqual(['comment', 'compare', 'export', 'subscribe']);
    expect(actions.has('release')).toBe(false);
  });

  it('offers nothing to someone who is not a member', () => {
    expect(caseActions({ actions: ['edit'] }, null).size).toBe(0);
  });

  it('lets thermal engineers and owners change cases, not analysts and viewers', () => {
    expect(mayChangeCases('thermal')).toBe(true);
    expect(mayChangeCases('owner')).toBe(true);
    expect(mayChangeCases('analyst')).toBe(false);
    expect(mayChangeCases('viewer')).toBe(false);
  });
});
