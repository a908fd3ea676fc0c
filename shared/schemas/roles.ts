import { z } from 'zod';
import { ROLES, ROLE_LABELS } from './role-names';

/** The list and its names live in ./role-names.ts (no zod), for the first screen; offered here beside the schema. */
export { ROLES, ROLE_LABELS };
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const meSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  email: z.string().nullable(),
  roles: z.array(roleSchema),
});
export type Me = z.infer<typeof meSchema>;

export const personSchema = meSchema.extend({
  rolesFromIdentityProvider: z.array(roleSchema),
  rolesGranted: z.array(roleSchema),
  rolesWithdrawn: z.array(roleSchema),
  lastSignInAt: z.string().nullable(),
});
export type Person = z.infer<typeof personSchema>;

/** Someone who may be given joint tasks: a person holding the fitter role. */
export const fitterSchema = z.object({ id: z.string().uuid(), name: z.string() });
export type Fitter = z.infer<typeof fitterSchema>;

export const personRolesBodySchema = z.object({ roles: z.array(roleSchema) });
export const personIdParamsSchema = z.object({ id: z.string().uuid({ message: 'not a person id' }) });
