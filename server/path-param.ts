// Express 5 types a path parameter as string | string[] (the array for '/{*splat}' routes).
import type { Request } from 'express';

/** The named path parameter as one string ('' when absent), joined when it is a splat. */
export function pathParam(req: Request, name: string): string {
  const value: unknown = req.params[name];
  if (Array.isArray(value)) return value.join('/');
  return typeof value === 'string' ? value : '';
}
