// The workspace roles as a plain list, without zod: the client's navigation and guards load with
// the first page, and importing them from workspaces.ts would pull zod into that first load.
export const roles = ['owner', 'analyst', 'thermal', 'viewer'] as const;
export type Role = (typeof roles)[number];
