import { createRequire } from 'node:module';
import type { BrowserContext, Page } from 'playwright-core';
import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Line } from '@server/db/models/line';
import { LineImport } from '@server/db/models/line-import';
import { WorkOrder } from '@server/db/models/work-order';
import { APP } from '../helpers/browserless';
import { signedInPage, VIEWPORTS } from '../helpers/chromium';
import { useBrowserApp } from '../helpers/browser-app';
import { lineRow, testPrefix, toCsv } from '../helpers/import-csv';
import { makeIsolationPoint, makeLines } from '../helpers/line-rows';
import { plannableOrder, plantForWorkOrders, windowOf } from '../helpers/work-orders';

type Username = 'planner' | 'admin' | 'fitter' | 'operations';
/** What a page needs that the test makes first. */
interface Made {
  lineNumber: string;
  importId: string;
  /** An order whose plan fits its window, and one whose 2-hour window is too short. */
  orderId: string;
  orderNumber: string;
  lateOrderId: string;
  /** A planned order with a joint on the fitter's shift, and that joint. */
  shiftOrderId: string;
  jointId: string;
}
interface PageCase {
  name: string;
  /** The role that uses the page; null: signed out. */
  as: Username | null;
  path: (made: Made) => string;
  /** Text on the page once it has loaded what it shows. */
  shows: string;
}

/**
 * Every page of the app, as the role that uses it sees it. A new page joins this list as a new
 * route joins the role table.
 */
const PAGES: PageCase[] = [
  { name: 'the line register', as: 'planner', path: () => '/lines', shows: 'Rows per page' },
  { name: 'a line', as: 'planner', path: (m) => `/lines/${encodeURIComponent(m.lineNumber)}`, shows: 'Isolation points (1)' },
  { name: 'a new import', as: 'planner', path: () => '/imports/new', shows: 'How an import works' },
  { name: 'an import preview with a rejected row', as: 'planner', path: (m) => `/imports/${m.importId}`, shows: 'is not a material' },
  { name: 'the joint calculator', as: 'planner', path: () => '/calculator', shows: '✓ Checked by the server' },
  { name: 'People & roles', as: 'admin', path: () => '/admin/people', shows: 'Kit Morrow' },
  { name: 'plant settings', as: 'admin', path: () => '/admin/plant', shows: 'Save plant settings' },
  { name: 'the work orders', as: 'planner', path: () => '/work-orders', shows: 'What the states mean' },
  { name: 'a work order whose plan fits', as: 'planner', path: (m) => `/work-orders/${m.orderId}`, shows: 'The plan fits the window' },
  { name: 'a work order whose plan is late', as: 'planner', path: (m) => `/work-orders/${m.lateOrderId}`, shows: 'The plan does not fit the window' },
  { name: 'a new work order', as: 'planner', path: () => '/work-orders/new', shows: 'Create the order' },
  { name: 'editing a work order', as: 'planner', path: (m) => `/work-orders/${m.orderId}/edit`, shows: 'Save the changes' },
  { name: 'the schedule', as: 'planner', path: () => '/schedule?week=2027-03-01', shows: 'Next week' },
  { name: 'the fitter’s shift', as: 'fitter', path: () => '/shift', shows: 'Section not isolated yet' },
  { name: 'a joint on the shift tablet', as: 'fitter', path: (m) => `/joints/${m.jointId}`, shows: 'Prepare the ends' },
  { name: 'the release queue and line status board', as: 'operations', path: () => '/release', shows: 'Lines out of service' },
  { name: 'sign-in', as: null, path: () => '/sign-in', shows: 'Sign in with the plant directory' },
  { name: 'a page that does not exist', as: 'planner', path: () => '/no-such-page', shows: 'There is no page here' },
];

/** WCAG 2.0, 2.1 and 2.2, levels A and AA: what axe checks. */
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const AXE_SCRIPT = createRequire(import.meta.url).resolve('axe-core/axe.min.js');

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  targets: string[];
}

const { users, browser } = useBrowserApp({ signIn: ['planner', 'fitter'], before: plantForWorkOrders });
const prefix = testPrefix('A11Y');
let made: Made;
const contexts = new Map<Username | null, BrowserContext>();

beforeAll(async () => {
  const [line] = await makeLines(prefix, [{ drawingRef: 'P&ID-310', notes: 'Feed to the neutralisation pit.' }]);
  await makeIsolationPoint(line, `${prefix}-V1`);
  // One changed, one new and one rejected row, so the preview shows each kind.
  const upload = await users.planner.upload('/api/line-imports', `${prefix}.csv`, toCsv([
    lineRow(line.lineNumber, { area: line.area, service: line.service }),
    lineRow(`${prefix}-900`),
    lineRow(`${prefix}-901`, { material: 'HDPE' }),
  ]));
  expect(upload.status).toBe(201);
  const order = await plannableOrder(users.planner, [line]);
  const late = await plannableOrder(users.planner, [line], { over: { ...windowOf('2027-03-08T06:00:00-06:00', 2), forecastLowF: 34 } });
  // On the fitter's shift: a planned order (a week on, so it overlaps neither) with a joint assigned to them.
  const onShift = await plannableOrder(users.planner, [line], { over: windowOf('2027-03-15T06:00:00-05:00', 12) });
  const fitter = await users.fitter.get('/api/me');
  const jointId = onShift.jointTasks[0].id;
  expect((await users.planner.put(`/api/joint-tasks/${jointId}/fitter`, { personId: fitter.body.id })).status).toBe(200);
  expect((await users.planner.post(`/api/work-orders/${onShift.id}/plan`, {})).status).toBe(200);
  made = { lineNumber: line.lineNumber, importId: upload.body.id, orderId: order.id, orderNumber: order.number, lateOrderId: late.id, shiftOrderId: onShift.id, jointId };
});
afterAll(async () => {
  if (made) await LineImport.destroy({ where: { id: made.importId } });
  if (made) await WorkOrder.destroy({ where: { id: [made.orderId, made.lateOrderId, made.shiftOrderId] } }); // its joints and plan go with it
  await Line.destroy({ where: { lineNumber: { [Op.like]: `${prefix}-%` } } });
  for (const context of contexts.values()) await context.close();
});

/** A tab of the role's browser (signed in once per role), at tablet size; axe's script is injected, so the page's CSP is bypassed. */
async function open(as: Username | null, pagePath: string): Promise<Page> {
  const known = contexts.get(as);
  if (known) {
    const page = await known.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${APP}${pagePath}`);
    return page;
  }
  if (as === null) {
    const context = await browser().newContext({ viewport: VIEWPORTS.tablet, bypassCSP: true });
    contexts.set(as, context);
    return open(as, pagePath);
  }
  const { context, page } = await signedInPage(browser(), APP, as, pagePath, { bypassCSP: true });
  contexts.set(as, context);
  if (new URL(page.url()).pathname !== pagePath) await page.goto(`${APP}${pagePath}`);
  return page;
}

async function axeViolations(page: Page): Promise<Violation[]> {
  await page.addScriptTag({ path: AXE_SCRIPT });
  return page.evaluate(async (tags) => {
    type AxeResult = { violations: { id: string; impact: string | null; help: string; nodes: { target: unknown[] }[] }[] };
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<AxeResult> } }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: tags } });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.map(String).join(' ')) }));
  }, WCAG_TAGS);
}

const described = (violations: Violation[]) =>
  violations.map((v) => `${v.id} (${v.impact}): ${v.help}\n    ${v.targets.join('\n    ')}`).join('\n');

describe('every page passes an automatic WCAG 2.2 AA check at tablet size', () => {
  it.each(PAGES)('$name has no serious or critical axe finding', async ({ as, path: pathOf, shows }) => {
    const page = await open(as, pathOf(made));
    try {
      await page.getByText(shows).first().waitFor();
      await page.waitForLoadState('networkidle');
      const serious = (await axeViolations(page)).filter((v) => v.impact === 'serious' || v.impact === 'critical');
      expect(serious, `axe found on ${pathOf(made)}:\n${described(serious)}`).toEqual([]);
    } finally {
      await page.close();
    }
  });
});
