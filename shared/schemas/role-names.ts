// The roles and their names, without zod: the navigation and the permission table read these on the
// first screen, where the schema library would cost its download and start-up. The schemas
// (./roles.ts) are built from the same list and re-export it.

export const ROLES = ['planner', 'fitter', 'operations', 'supervisor', 'admin'] as const;

export const ROLE_LABELS: Record<(typeof ROLES)[number], string> = {
  planner: 'Maintenance planner',
  fitter: 'Pipefitter',
  operations: 'Operations shift lead',
  supervisor: 'Supervisor',
  admin: 'Administrator',
};
