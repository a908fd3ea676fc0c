/**
 * The local sign-in fake's accounts, one per role (two fitters, since lockouts are personal).
 * `groups` is what a plant directory would send; OIDC_ROLE_MAP turns it into Linewright roles.
 * The people are invented.
 */
export const DEMO_PASSWORD = 'linewright';

export const DEMO_ACCOUNTS = [
  { username: 'planner', name: 'Ines Varga', email: 'ines.varga@marrowby.invalid', groups: ['plant-planning'], role: 'planner' },
  { username: 'fitter', name: 'Tomas Lind', email: 'tomas.lind@marrowby.invalid', groups: ['plant-pipefitters'], role: 'fitter' },
  { username: 'fitter2', name: 'Noor Haddad', email: 'noor.haddad@marrowby.invalid', groups: ['plant-pipefitters'], role: 'fitter' },
  { username: 'operations', name: 'Maud Okafor', email: 'maud.okafor@marrowby.invalid', groups: ['plant-operations'], role: 'operations' },
  { username: 'supervisor', name: 'Rafe Adeyemi', email: 'rafe.adeyemi@marrowby.invalid', groups: ['plant-supervisors'], role: 'supervisor' },
  { username: 'admin', name: 'Kit Morrow', email: 'kit.morrow@marrowby.invalid', groups: ['plant-systems'], role: 'admin' },
] as const;

/** The mapping a plant would put in OIDC_ROLE_MAP for the fake's groups. */
export const DEMO_ROLE_MAP =
  'plant-planning=planner,plant-pipefitters=fitter,plant-operations=operations,plant-supervisors=supervisor,plant-systems=admin';
