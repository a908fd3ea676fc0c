import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { Person } from '@server/db/models/person';
import { apiErrorSchema } from '@shared/schemas/errors';
import { rolesFor, type Action } from '@shared/permissions';
import { ROLE_LABELS, ROLES, type Role } from '@shared/schemas/roles';
import { startTestApp } from '../helpers/app';
import { Browserless, signedIn } from '../helpers/browserless';
import { listRoutes } from '../helpers/app-routes';

/**
 * Every route the app has, and who may call it. A route added anywhere without a row here fails
 * the completeness check below, and so does a row whose route is gone.
 *
 * `route` is the method and path as Express has it; `allow` the permission (shared/permissions.ts)
 * the route is guarded by, or 'signed-in' for anyone with a session, or 'public'; `sample` the URL
 * called (params filled in with values that need no data: a 404 for an allowed role is fine, it is
 * "not 401/403"); `body` is sent to writes and is chosen to fail validation harmlessly, so nothing
 * is created. `endsSession` rows get a fresh sign-in of their own.
 */
interface Row {
  route: string;
  allow: Action | 'signed-in' | 'public';
  sample?: string;
  body?: unknown;
  endsSession?: boolean;
}

const NO_ID = randomUUID();

const TABLE: Row[] = [
  { route: 'GET /api/health', allow: 'public' },
  { route: 'GET /api/openapi.json', allow: 'public' },
  { route: 'GET /auth/login', allow: 'public' },
  { route: 'GET /auth/callback', allow: 'public' }, // without a sign-in under way it answers 400
  { route: 'POST /auth/logout', allow: 'public', endsSession: true }, // signing out without a session is harmless
  { route: 'GET /api/me', allow: 'signed-in' },
  { route: 'GET /api/people', allow: 'people.manage' },
  { route: 'PUT /api/people/:id/roles', allow: 'people.manage', sample: `/api/people/${NO_ID}/roles`, body: { roles: ['not-a-role'] } },
  { route: 'GET /api/lines', allow: 'lines.read' },
  { route: 'GET /api/lines/export.csv', allow: 'lines.read' },
  { route: 'GET /api/lines/:lineNumber', allow: 'lines.read', sample: '/api/lines/RT-NO-SUCH-LINE' },
  { route: 'POST /api/line-imports', allow: 'lines.import', body: {} }, // no file: 400
  { route: 'GET /api/line-imports/:id', allow: 'lines.import', sample: `/api/line-imports/${NO_ID}` },
  { route: 'GET /api/line-imports/:id/rows', allow: 'lines.import', sample: `/api/line-imports/${NO_ID}/rows` },
  { route: 'POST /api/line-imports/:id/confirm', allow: 'lines.import', sample: `/api/line-imports/${NO_ID}/confirm`, body: {} },
  { route: 'GET /api/line-imports', allow: 'lines.import' },
  { route: 'POST /api/line-imports/:id/cancellation', allow: 'lines.import', sample: `/api/line-imports/${NO_ID}/cancellation`, body: {} }, // no such import: 404
  { route: 'POST /api/calc/joint', allow: 'calc.use', body: {} }, // an empty joint: 400
  { route: 'GET /api/plant-settings', allow: 'plantSettings.read' },
  { route: 'PUT /api/plant-settings', allow: 'plantSettings.edit', body: { testCap: 'not-a-cap' } }, // 400, nothing changes
  { route: 'GET /api/work-orders', allow: 'workOrders.read' },
  { route: 'POST /api/work-orders', allow: 'workOrders.plan', body: {} }, // no fields: 400
  { route: 'GET /api/work-orders/:id', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}` },
  { route: 'PATCH /api/work-orders/:id', allow: 'workOrders.plan', sample: `/api/work-orders/${NO_ID}`, body: {} }, // no version: 400
  { route: 'POST /api/work-orders/:id/plan', allow: 'workOrders.plan', sample: `/api/work-orders/${NO_ID}/plan` }, // no such order: 404
  { route: 'POST /api/work-orders/:id/cancellation', allow: 'workOrders.plan', sample: `/api/work-orders/${NO_ID}/cancellation`, body: {} }, // no reason: 400
  { route: 'POST /api/work-orders/:id/joint-tasks', allow: 'workOrders.plan', sample: `/api/work-orders/${NO_ID}/joint-tasks`, body: {} },
  { route: 'GET /api/work-orders/:id/isolation-plan', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/isolation-plan` },
  { route: 'PUT /api/work-orders/:id/isolation-plan', allow: 'workOrders.plan', sample: `/api/work-orders/${NO_ID}/isolation-plan`, body: {} },
  { route: 'GET /api/work-orders/:id/window-plan', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/window-plan` },
  { route: 'DELETE /api/joint-tasks/:id', allow: 'workOrders.plan', sample: `/api/joint-tasks/${NO_ID}` }, // no such task: 404
  { route: 'PUT /api/joint-tasks/:id/fitter', allow: 'workOrders.plan', sample: `/api/joint-tasks/${NO_ID}/fitter`, body: {} },
  { route: 'GET /api/schedule', allow: 'workOrders.read' }, // no range: 400
  { route: 'GET /api/fitters', allow: 'workOrders.plan' },
  { route: 'GET /api/work-orders/:id/lockout', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/lockout` },
  { route: 'POST /api/work-orders/:id/locks', allow: 'locks.apply', sample: `/api/work-orders/${NO_ID}/locks`, body: {} },
  { route: 'POST /api/work-orders/:id/lock-box', allow: 'locks.apply', sample: `/api/work-orders/${NO_ID}/lock-box`, body: {} },
  { route: 'POST /api/work-orders/:id/handovers', allow: 'locks.handover', sample: `/api/work-orders/${NO_ID}/handovers`, body: {} },
  { route: 'POST /api/work-orders/:id/verification', allow: 'isolation.verify', sample: `/api/work-orders/${NO_ID}/verification`, body: {} },
  { route: 'POST /api/locks/:id/removal', allow: 'locks.apply', sample: `/api/locks/${NO_ID}/removal`, body: { absent: 'no' } }, // 400
  { route: 'GET /api/shift', allow: 'workOrders.read' },
  { route: 'GET /api/joint-tasks/:id', allow: 'workOrders.read', sample: `/api/joint-tasks/${NO_ID}` },
  { route: 'POST /api/joint-tasks/:id/steps', allow: 'joints.record', sample: `/api/joint-tasks/${NO_ID}/steps`, body: {} },
  { route: 'POST /api/joint-tasks/:id/redo', allow: 'joints.redo', sample: `/api/joint-tasks/${NO_ID}/redo`, body: {} },
  { route: 'POST /api/joint-tasks/:id/photos', allow: 'joints.record', sample: `/api/joint-tasks/${NO_ID}/photos`, body: {} }, // no picture: 400
  { route: 'GET /api/photos/:id', allow: 'workOrders.read', sample: `/api/photos/${NO_ID}` },
  { route: 'GET /api/work-orders/:id/pressure-tests', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/pressure-tests` },
  { route: 'POST /api/work-orders/:id/pressure-tests', allow: 'tests.witness', sample: `/api/work-orders/${NO_ID}/pressure-tests`, body: {} },
  { route: 'GET /api/work-orders/:id/release-check', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/release-check` },
  { route: 'POST /api/work-orders/:id/release', allow: 'lines.release', sample: `/api/work-orders/${NO_ID}/release`, body: {} },
  { route: 'GET /api/release-queue', allow: 'workOrders.read' },
  { route: 'GET /api/line-status', allow: 'workOrders.read' },
  { route: 'GET /api/work-orders/:id/record-gaps', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/record-gaps` },
  { route: 'POST /api/work-orders/:id/close', allow: 'workOrders.close', sample: `/api/work-orders/${NO_ID}/close` },
  { route: 'GET /api/work-orders/:id/record.pdf', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/record.pdf` },
  { route: 'GET /api/work-orders/:id/temperature-logs', allow: 'workOrders.read', sample: `/api/work-orders/${NO_ID}/temperature-logs` },
  { route: 'POST /api/work-orders/:id/temperature-logs', allow: 'holds.temperatureLog', sample: `/api/work-orders/${NO_ID}/temperature-logs`, body: {} }, // no file: 400
  { route: 'POST /api/temperature-logs/:id/apply', allow: 'holds.temperatureLog', sample: `/api/temperature-logs/${NO_ID}/apply` },
  { route: 'POST /api/holds/:id/engineering', allow: 'holds.engineeringEntry', sample: `/api/holds/${NO_ID}/engineering`, body: {} },
];

/** The roles a row lets through, read from the permission table. */
const mayCall = (row: Row): readonly Role[] | 'public' => (row.allow === 'public' ? 'public' : row.allow === 'signed-in' ? ROLES : rolesFor(row.allow));

/** Served by the app but not API routes: the client's pages, present when a build is there. */
const NOT_API = new Set(['GET /{*splat}']);

const methodOf = (row: Row) => row.route.split(' ')[0];
const urlOf = (row: Row) => row.sample ?? row.route.split(' ')[1];
const call = (b: Browserless, row: Row) => b.json(methodOf(row), urlOf(row), methodOf(row) === 'GET' ? undefined : (row.body ?? {}));
const label = (r: Role) => ROLE_LABELS[r].toLowerCase();

let stop: () => Promise<void>;
const sessions = new Map<Role, Browserless>();

beforeAll(async () => {
  stop = await startTestApp();
  for (const role of ROLES) {
    const b = await signedIn(role);
    // Each demo account holds exactly its directory role here, whatever another test granted or withdrew.
    const me = await b.get('/api/me');
    await Person.update({ rolesGranted: [], rolesWithdrawn: [] }, { where: { id: me.body.id } });
    sessions.set(role, b);
  }
});
afterAll(() => stop());

describe('the role table lists every route, and only routes that exist', () => {
  const routes = listRoutes(createApp()).filter((r) => !NOT_API.has(r));
  const listed = new Set(TABLE.map((row) => row.route));

  it('finds the routes it knows are there (the walk of the router stack works)', () => {
    expect(routes).toEqual(expect.arrayContaining(['GET /api/health', 'GET /api/me', 'PUT /api/people/:id/roles', 'POST /auth/logout']));
  });

  it('every route the app has is in the table', () => {
    const missing = routes.filter((r) => !listed.has(r));
    expect(missing, `routes without a row in tests/api/role-table.test.ts: ${missing.join(', ')}`).toEqual([]);
  });

  it('every row in the table is a route the app has', () => {
    const gone = [...listed].filter((r) => !routes.includes(r));
    expect(gone, `rows whose route does not exist: ${gone.join(', ')}`).toEqual([]);
  });
});

describe('without a session', () => {
  for (const row of TABLE) {
    if (row.allow === 'public') {
      it(`${row.route} answers without a sign-in`, async () => {
        expect([401, 403]).not.toContain((await call(new Browserless(), row)).status);
      });
    } else {
      it(`${row.route} answers 401 in the one error shape`, async () => {
        const res = await call(new Browserless(), row);
        expect(res.status).toBe(401);
        expect(res.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
      });
    }
  }
});

describe.each(TABLE)('$route', (row) => {
  it.each(ROLES)('as %s', async (role) => {
    const b = row.endsSession ? await signedIn(role) : sessions.get(role)!;
    const res = await call(b, row);
    const may = mayCall(row);
    if (may === 'public' || may.includes(role)) {
      expect([401, 403], `${role} should be let through (got ${res.status} ${JSON.stringify(res.body)})`).not.toContain(res.status);
      return;
    }
    expect(res.status, `${role} should be refused`).toBe(403);
    expect(apiErrorSchema.strict().parse(res.body).error.code).toBe('forbidden');
    const message: string = res.body.error.message;
    expect(message).toMatch(/^Only an? .+ may do this/);
    for (const allowed of may) expect(message).toContain(label(allowed));
    expect(message).toContain(`your roles are ${label(role)}`);
  });
});
