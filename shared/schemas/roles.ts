import { z } from 'zod';

export const ROLES = ['planner', 'fitter', 'operations', 'supervisor', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  planner: 'Maintenance planner',
  fitter: 'Pipefitter',
  operations: 'Operations shift lead',
  supervisor: 'Supervisor',
  admin: 'Administrator',
};

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
