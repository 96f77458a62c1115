import type { MembershipSummary } from '../../../shared/api/auth';
import type { Role } from '../../../shared/api/workspaces';
import { navEntriesFor, roleMayOpen } from './navigation';

// The expected sections per role follow PRODUCT.md's role table and the shell brief
// (thermal models for thermal and owner; members and audit for owners; mail for administrators).
function membership(role: Role): MembershipSummary {
  return { workspaceId: 'ws-kestrel', workspaceName: 'Kestrel', role };
}

function ids(role: Role | null, isAdmin = false): string[] {
  return navEntriesFor(role === null ? null : membership(role), isAdmin).map((e) => e.id);
}

describe('navEntriesFor', () => {
  it('gives an owner every workspace section', () => {
    expect(ids('owner')).toEqual(['missions', 'overview', 'cases', 'environment', 'bodies', 'thermal', 'members', 'audit', 'tokens']);
  });

  it('gives a thermal engineer thermal models but not members or audit', () => {
    expect(ids('thermal')).toEqual(['missions', 'overview', 'cases', 'environment', 'bodies', 'thermal', 'tokens']);
  });

  it('gives analysts and viewers neither thermal models nor owner pages', () => {
    expect(ids('analyst')).toEqual(['missions', 'overview', 'cases', 'environment', 'bodies', 'tokens']);
    expect(ids('viewer')).toEqual(['missions', 'overview', 'cases', 'environment', 'bodies', 'tokens']);
  });

  it('adds the mail outbox only for an instance administrator, whatever the role', () => {
    expect(ids('viewer', true)).toContain('mail');
    expect(ids('owner', false)).not.toContain('mail');
  });

  it('offers only account pages to a user in no workspace', () => {
    expect(ids(null)).toEqual(['tokens']);
    expect(ids(null, true)).toEqual(['tokens', 'mail']);
  });

  it('links workspace sections under the current workspace id', () => {
    const members = navEntriesFor(membership('owner'), false).find((e) => e.id === 'members');
    expect(members?.link).toEqual(['/w', 'ws-kestrel', 'members']);
  });
});

describe('roleMayOpen', () => {
  it('agrees with the navigation for every role and workspace section', () => {
    const roles: Role[] = ['owner', 'analyst', 'thermal', 'viewer'];
    for (const role of roles) {
      const shown = new Set(ids(role));
      for (const section of ['missions', 'overview', 'cases', 'environment', 'bodies', 'thermal', 'members', 'audit'] as const) {
        expect(roleMayOpen(role, section), `${role} / ${section}`).toBe(shown.has(section));
      }
    }
  });

  it('never opens account or admin sections through a workspace role', () => {
    expect(roleMayOpen('owner', 'mail')).toBe(false);
    expect(roleMayOpen('owner', 'tokens')).toBe(false);
  });
});
