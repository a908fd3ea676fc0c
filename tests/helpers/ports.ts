/**
 * Loopback ports of a test run, apart from `npm start`'s so both can run at once. Set
 * LW_TEST_PORT_BASE to run two test runs side by side.
 */
const base = Number(process.env.LW_TEST_PORT_BASE ?? 5290);
export const TEST_PORTS = { app: base, idp: base + 1, mailHttp: base + 2, smtp: base + 3, pg: base + 4, redis: base + 5 } as const;
