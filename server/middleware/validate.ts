import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError } from '@server/errors';

type Parts = { params?: z.ZodType; query?: z.ZodType; body?: z.ZodType };

/** Turns zod issues into `{ field: [messages] }`, the shape forms map onto their fields. */
export function issuesToDetails(error: z.ZodError): Record<string, string[]> {
  const details: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    (details[key] ??= []).push(issue.message);
  }
  return details;
}

/** Validates with the shared schemas; the parsed values replace the raw ones (query in res.locals). */
export function validate(parts: Parts): RequestHandler {
  return (req, res, next) => {
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = parts[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (!result.success) {
        throw AppError.badRequest(`Some of the ${part === 'body' ? 'fields' : part} are not valid.`, issuesToDetails(result.error));
      }
      if (part === 'query') res.locals.query = result.data;
      else (req as unknown as Record<string, unknown>)[part] = result.data;
    }
    next();
  };
}
