// Who may call a workspace's routes (RouteAccess of server/http/api-route.ts): the role lists the
// route declarations name, checked against the path's :workspaceId by the dispatcher.
import { roles, type Role } from '../../shared/api/workspaces';
import type { RouteAccess } from '../http/api-route';
import { editorRoles } from '../missions/mission-access';

const members = (workspaceRoles: readonly Role[]): RouteAccess => ({ workspaceRoles });

/** Every member, viewers included. */
export const anyMember = members(roles);
export const ownerOnly = members(['owner']);
/** Those who change a workspace's missions and materials: owner, analyst, thermal engineer. */
export const missionEditors = members(editorRoles);
/** Those who change a workspace's environment table and load cases: owner and thermal engineer. */
export const thermalEditors = members(['owner', 'thermal']);
