/** The REST API's base; the server serves the client, so the path is same-origin. */
export const API_BASE = '/api/v1';

/** Joins path segments under the API base, encoding each so an id or token cannot change the route. */
export function apiPath(...segments: readonly string[]): string {
  return `${API_BASE}/${segments.map((s) => encodeURIComponent(s)).join('/')}`;
}
