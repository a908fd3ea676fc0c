import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { AppError } from '@server/errors';

type Parts = { params?: z.ZodType; query?: z.ZodType; body?: z.ZodType };

/** What the handler receives: each part parsed by its schema (a part without one is absent). */
export type Valid<P extends Parts> = {
  [K in keyof P]: P[K] extends z.ZodType ? z.output<P[K]> : never;
};

/** Turns zod issues into `{ field: [messages] }`, the shape forms map onto their fields. */
export function issuesToDetails(error: z.ZodError): Record<string, string[]> {
  const details: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    (details[key] ??= []).push(issue.message);
  }
  return details;
}

/**
 * Validates the request's parts with the shared schemas and hands the handler the parsed, typed
 * values: `validate({ params, query, body }, async ({ params, body }, req, res) => …)`. A part that
 * fails answers 400 with the fields and their messages; the handler never sees raw input.
 */
export function validate<P extends Parts>(
  parts: P,
  handler: (valid: Valid<P>, req: Request, res: Response, next: NextFunction) => unknown,
): RequestHandler {
  return async (req, res, next) => {
    const valid: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = parts[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (!result.success) {
        throw AppError.badRequest(`Some of the ${part === 'body' ? 'fields' : part} are not valid.`, issuesToDetails(result.error));
      }
      valid[part] = result.data;
    }
    await handler(valid as Valid<P>, req, res, next);
  };
}
