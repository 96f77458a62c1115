import type { Role } from '../../../shared/api/plain-lists';

/**
 * What each role may do in a workspace, in PRODUCT.md's words ("Users and roles"); `who` where the
 * role's label (roleLabels, shared/api/plain-lists.ts) does not already say who holds it.
 */
export const ROLE_ABILITIES: Readonly<Record<Role, { readonly who?: string; readonly may: readonly string[] }>> = {
  owner: {
    who: 'lead of the workspace',
    may: ['Everything in the workspace', 'Invite and remove members', 'Set members’ roles', 'Read the audit log'],
  },
  analyst: {
    may: ['Create and edit missions, orbits and ephemerides', 'Run environment computations'],
  },
  thermal: {
    may: [
      'Everything an analyst may',
      'Edit spacecraft surfaces, thermal models and load cases',
      'Release a load case',
    ],
  },
  viewer: {
    who: 'other teams: power, structures, systems',
    may: ['Read missions and released cases', 'Export cases', 'Create personal API tokens for import'],
  },
};

export const ROLE_ORDER: readonly Role[] = ['owner', 'thermal', 'analyst', 'viewer'];
