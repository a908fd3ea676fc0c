import { ROLES, ROLE_LABELS } from './schemas/role-names';
import type { Role } from './schemas/roles';

/**
 * Who may do what: the one table. The server's guard (`requirePermission`), the navigation, the
 * pages' buttons and the role-table test all read it; no role list is written anywhere else.
 * Actions are `<object>.<verb>`; an action the product does not have yet is listed with the roles
 * its issue settles, so the guard and the page agree from the first route that uses it.
 */
export const PERMISSIONS = {
  // the line register
  'lines.read': ROLES,
  'lines.import': ['planner', 'admin'],
  // trade computations and the plant's choices
  'calc.use': ROLES,
  'plantSettings.read': ROLES,
  'plantSettings.edit': ['admin'],
  // people
  'people.manage': ['admin'],
  // work orders (DESIGN.md sections 7 and 8)
  'workOrders.read': ROLES,
  'workOrders.plan': ['planner', 'supervisor'],
  'workOrders.cancelAfterIsolation': ['supervisor'],
  'workOrders.close': ['planner'],
  // lockout (OSHA 29 CFR 1910.147)
  'locks.apply': ['fitter', 'supervisor'],
  'locks.handover': ['fitter', 'supervisor'],
  'isolation.verify': ['operations', 'supervisor'],
  'locks.removeAbsent': ['supervisor'],
  // joints, holds, tests, release (DESIGN.md sections 9 and 10)
  'joints.record': ['fitter'],
  'joints.redo': ['fitter', 'supervisor'],
  'holds.temperatureLog': ['planner', 'fitter', 'supervisor'],
  'holds.engineeringEntry': ['supervisor'],
  'tests.record': ['fitter', 'operations', 'supervisor'],
  'tests.witness': ['operations', 'supervisor'],
  'lines.release': ['operations'],
  // the record
  'audit.read': ['supervisor', 'admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof PERMISSIONS;

/** The roles that may do `action`. */
export const rolesFor = (action: Action): readonly Role[] => PERMISSIONS[action];

/** Whether someone holding `roles` may do `action`; no person, no permission. */
export function may(person: { roles: readonly Role[] } | null | undefined, action: Action): boolean {
  const allowed: readonly Role[] = PERMISSIONS[action];
  return !!person && person.roles.some((r) => allowed.includes(r));
}

const lower = (r: Role) => ROLE_LABELS[r].toLowerCase();
const withArticle = (words: string) => `${/^[aeiou]/.test(words) ? 'an' : 'a'} ${words}`;

/** "a maintenance planner or an administrator": who may do `action`, in words. */
export function whoMay(action: Action): string {
  const roles = rolesFor(action);
  return roles.length === ROLES.length ? 'anyone signed in' : withArticle(roles.map(lower).join(' or '));
}

/** The refusal a person sees, on the server's 403 and on a page that mirrors it. */
export function refusalFor(action: Action, roles: readonly Role[]): string {
  return `Only ${whoMay(action)} may do this; your roles are ${roles.map(lower).join(' and ') || 'none'}.`;
}
