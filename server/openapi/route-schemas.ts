// Schemas for routes that validate with a schema of their own, not a shared one, written here in
// the route's words so the document still says what they take and answer.

import { z } from 'zod';

/** auth-routes.ts keeps `returnTo` inline: only paths inside the app. */
export const signInQuerySchema = z.object({ returnTo: z.string().regex(/^\/(?!\/)[^\s\\]*$/).optional() });
export const callbackQuerySchema = z.object({ code: z.string().optional(), state: z.string().optional(), iss: z.string().optional() });
export const signOutResponseSchema = z.object({ redirectTo: z.string() });
export const healthResponseSchema = z.object({ ok: z.literal(true) });
export const uploadBodySchema = z.object({ file: z.string().meta({ contentMediaType: 'text/csv', description: 'the register CSV file' }) });
/** The trade engine's answer for one joint (shared/trade/joint-picture.ts): a TypeScript type, not a schema. */
export const jointPictureSchema = z.looseObject({ ok: z.boolean(), problems: z.array(z.string()), notes: z.array(z.string()) });
export const openApiDocumentSchema = z.looseObject({ openapi: z.string(), info: z.looseObject({}), paths: z.looseObject({}), components: z.looseObject({}) });
