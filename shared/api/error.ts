import { z } from 'zod';

/** The one error body every API route answers with. */
export const ApiErrorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    issues: z
      .array(z.object({ path: z.array(z.union([z.string(), z.number()])), message: z.string() }))
      .optional(),
    /** With 412 (version_conflict): the version the server holds now. */
    currentVersion: z.number().int().optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof ApiErrorBody>;

export const errorCodes = {
  badRequest: 'bad_request',
  unauthenticated: 'unauthenticated',
  forbidden: 'forbidden',
  notFound: 'not_found',
  conflict: 'conflict',
  tooLarge: 'too_large',
  rateLimited: 'rate_limited',
  versionConflict: 'version_conflict',
  internal: 'internal',
} as const;
export type ErrorCode = (typeof errorCodes)[keyof typeof errorCodes];
