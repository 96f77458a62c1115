// Who a request comes from, set by the authenticate middleware.
import type { Role } from '../../shared/api/workspaces';
import type { UserRow } from '../db/schema';

export interface RequestAuth {
  user: UserRow;
  kind: 'session' | 'token';
  readOnly: boolean;
  tokenId?: string;
  /** The sessions row of a cookie-borne request. */
  sessionId?: string;
}

declare global {
  namespace Express {
    interface Request {
      auth?: RequestAuth;
      /** The caller's membership in the :workspaceId of the route, set by workspaceAccess. */
      membership?: { workspaceId: string; role: Role };
    }
  }
}
