import type { Role } from '../../../shared/api/workspaces';

/** What each role may do in a workspace, in PRODUCT.md's words ("Users and roles"). */
export const ROLE_ABILITIES: Readonly<Record<Role, { readonly who: string; readonly may: readonly string[] }>> = {
  owner: {
    who: 'Lead of the workspace',
    may: ['Everything in the workspace', 'Invite and remove members', 'Set members’ roles', 'Read the audit log'],
  },
  analyst: {
    who: 'Mission analyst',
    may: ['Create and edit missions, orbits and ephemerides', 'Run environment computations'],
  },
  thermal: {
    who: 'Thermal engineer',
    may: [
      'Everything an analyst may',
      'Edit spacecraft surfaces, thermal models and load cases',
      'Release a load case',
    ],
  },
  viewer: {
    who: 'Other teams (power, structures, systems)',
    may: ['Read missions and released cases', 'Export cases', 'Create personal API tokens for import'],
  },
};

export const ROLE_ORDER: readonly Role[] = ['owner', 'thermal', 'analyst', 'viewer'];
