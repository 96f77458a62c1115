// Every route of the API, in the order the dispatcher tries them (the first that matches answers).
// A new feature adds its list here; the OpenAPI document is made from the same list.
import type { ApiRoute } from '../http/api-route';
import { adminRoutes } from './admin';
import { apiDocsRoutes } from './api-docs';
import { authRoutes } from './auth';
import { caseRoutes } from './cases';
import { environmentRoutes } from './environment';
import { environmentTableRoutes } from './environment-table';
import { customBodyRoutes } from './custom-bodies';
import { ephemerisRoutes } from './ephemerides';
import { invitationRoutes } from './invitations';
import { missionRoutes } from './missions';
import { thermalRoutes } from './thermal';
import { thermalModelRoutes } from './thermal-models';
import { tokenRoutes } from './tokens';
import { workspaceRoutes } from './workspaces';

export const apiRoutes: readonly ApiRoute[] = [
  ...authRoutes,
  ...tokenRoutes,
  ...workspaceRoutes,
  ...invitationRoutes,
  ...adminRoutes,
  ...environmentRoutes,
  ...thermalRoutes,
  ...missionRoutes,
  ...environmentTableRoutes,
  ...customBodyRoutes,
  ...ephemerisRoutes,
  ...caseRoutes,
  ...apiDocsRoutes,
  ...thermalModelRoutes,
];
