import type { MembershipSummary } from '../../../shared/api/auth';
import { roles, type Role } from '../../../shared/api/plain-lists';

export type SectionId = 'missions' | 'overview' | 'cases' | 'environment' | 'bodies' | 'thermal' | 'members' | 'audit' | 'tokens' | 'mail';

interface Section {
  readonly id: SectionId;
  readonly label: string;
  readonly icon: string;
  /** workspace: lives under /w/:workspaceId; account: the user's own; admin: instance administrators. */
  readonly scope: 'workspace' | 'account' | 'admin';
  /** Roles in the current workspace that may open it (workspace scope only). */
  readonly roles: readonly Role[];
}

// One table decides both what the side navigation offers and what the route guards let through,
// so a link is never shown to someone the page would turn away. Roles follow PRODUCT.md.
const SECTIONS: readonly Section[] = [
  { id: 'missions', label: 'Missions', icon: 'public', scope: 'workspace', roles },
  { id: 'overview', label: 'Overview', icon: 'dashboard', scope: 'workspace', roles },
  { id: 'cases', label: 'Load cases', icon: 'stacked_line_chart', scope: 'workspace', roles },
  // every member reads the table the cases use; owners and thermal engineers edit it (the page says so)
  { id: 'environment', label: 'Environment table', icon: 'table_chart', scope: 'workspace', roles },
  // every member reads the workspace's own bodies; owners, thermal engineers and analysts edit them (the page says so)
  { id: 'bodies', label: 'Bodies', icon: 'brightness_3', scope: 'workspace', roles },
  { id: 'thermal', label: 'Thermal models', icon: 'device_thermostat', scope: 'workspace', roles: ['thermal', 'owner'] },
  { id: 'members', label: 'Members', icon: 'group', scope: 'workspace', roles: ['owner'] },
  { id: 'audit', label: 'Audit log', icon: 'history', scope: 'workspace', roles: ['owner'] },
  { id: 'tokens', label: 'API tokens', icon: 'key', scope: 'account', roles },
  { id: 'mail', label: 'Mail outbox', icon: 'outgoing_mail', scope: 'admin', roles: [] },
];

export interface NavEntry {
  readonly id: SectionId;
  readonly label: string;
  readonly icon: string;
  readonly link: readonly string[];
}

function linkOf(section: Section, workspaceId: string | null): readonly string[] {
  switch (section.scope) {
    case 'workspace':
      return ['/w', workspaceId ?? '', section.id];
    case 'account':
      return ['/', section.id];
    case 'admin':
      return ['/admin', section.id];
  }
}

/** The side navigation for a user in their current workspace (null when they belong to none). */
export function navEntriesFor(membership: MembershipSummary | null, isAdmin: boolean): NavEntry[] {
  return SECTIONS.filter((section) => {
    switch (section.scope) {
      case 'workspace':
        return membership !== null && section.roles.includes(membership.role);
      case 'account':
        return true;
      case 'admin':
        return isAdmin;
    }
  }).map((section) => ({
    id: section.id,
    label: section.label,
    icon: section.icon,
    link: linkOf(section, membership?.workspaceId ?? null),
  }));
}

/** Whether a role may open the given workspace section (false for account and admin sections). */
export function roleMayOpen(role: Role, id: SectionId): boolean {
  const section = SECTIONS.find((s) => s.id === id);
  return section?.scope === 'workspace' && section.roles.includes(role);
}
