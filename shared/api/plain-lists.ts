// Plain constant lists the client needs as values, without zod: whatever the client imports as a
// value from a schema module (workspaces.ts, ephemerides.ts) brings zod with it, into the first
// load (navigation, guards) or into the page's chunk. The schema modules take their lists from here.
export const roles = ['owner', 'analyst', 'thermal', 'viewer'] as const;
export type Role = (typeof roles)[number];

/** Each role as people say it (PRODUCT.md "Users and roles"), wherever a role is shown or written: pages, mails, audit lines. */
export const roleLabels: Readonly<Record<Role, string>> = {
  owner: 'Owner',
  analyst: 'Mission analyst',
  thermal: 'Thermal engineer',
  viewer: 'Viewer',
};

/** The inertial frames a CSV ephemeris may declare. */
export const ephemerisFrames = ['EME2000', 'J2000', 'ICRF', 'GCRF'] as const;
export type EphemerisFrame = (typeof ephemerisFrames)[number];
