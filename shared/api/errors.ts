// The error shape of every 4xx and 5xx answer (API.md, "Errors").
import { z } from 'zod';

export const errorDetail = z.object({
  path: z.string().optional(),
  message: z.string(),
  row: z.number().int().optional(),
  column: z.string().optional(),
  value: z.string().optional(),
});

export const errorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.array(errorDetail).optional(),
  }),
});

export type ErrorDetail = z.infer<typeof errorDetail>;
export type ErrorBody = z.infer<typeof errorBody>;
