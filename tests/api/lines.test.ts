import { describe, expect, it } from 'vitest';
import { sequelize } from '@server/db/sequelize';
import { lineDetailSchema, lineListResponseSchema } from '@shared/schemas/lines';
import { useTestApp } from '../helpers/app';
import { createOrder } from '../helpers/work-orders';
import { Browserless, signedIn } from '../helpers/browserless';
import { makeIsolationPoint, makeLines, uniquePrefix } from '../helpers/line-rows';
import { statementsOf } from '../helpers/statements';

const users = useTestApp({ signIn: ['planner'] });

/** A list filter of several values goes as one repeated parameter per value (`?area=A&area=B`), as the client sends it. */
const toQuery = (query: Record<string, string | string[]>) =>
  new URLSearchParams(Object.entries(query).flatMap(([k, v]) => (Array.isArray(v) ? v : [v]).map((x): [string, string] => [k, x])));
const list = async (query: Record<string, string | string[]>) => {
  const res = await users.planner.get(`/api/lines?${toQuery(query)}`);
  expect(res.status).toBe(200);
  return lineListResponseSchema.parse(res.body);
};
const numbers = (body: { rows: { lineNumber: string }[] }) => body.rows.map((r) => r.lineNumber);

describe('reading the line register', () => {
  it('every signed-in role may read the register and a line', async () => {
    const p = uniquePrefix('ROLES');
    await makeLines(p, [{}]);
    for (const role of ['planner', 'fitter', 'operations', 'supervisor', 'admin']) {
      const b = await signedIn(role);
      const page = await b.get(`/api/lines?area=${encodeURIComponent(`${p} area`)}`);
      expect(page.status, role).toBe(200);
      expect(page.body.total, role).toBe(1);
      expect((await b.get(`/api/lines/${p}-001`)).status, role).toBe(200);
    }
  });

  it('without a session the register, a line and the export answer 401 in the one error shape', async () => {
    const anon = new Browserless();
    for (const path of ['/api/lines', '/api/lines/ANY-1', '/api/lines/export.csv']) {
      const res = await anon.get(path);
      expect(res.status, path).toBe(401);
      expect(res.body, path).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
    }
  });

  it('seven lines in pages of three come as 3, 3 and 1, each page knowing the total of 7', async () => {
    const p = uniquePrefix('PAGE');
    await makeLines(p, Array.from({ length: 7 }, () => ({})));
    const query = { area: `${p} area`, pageSize: '3' };
    const pages = [await list({ ...query, page: '1' }), await list({ ...query, page: '2' }), await list({ ...query, page: '3' })];
    expect(pages.map((pg) => pg.rows.length)).toEqual([3, 3, 1]);
    expect(pages.map((pg) => pg.total)).toEqual([7, 7, 7]);
    expect(pages[2]).toMatchObject({ page: 3, pageSize: 3 });
    expect(pages.flatMap(numbers)).toEqual(Array.from({ length: 7 }, (_, i) => `${p}-00${i + 1}`));
    expect((await list({ ...query, page: '4' })).rows).toEqual([]);
  });

  it('sorting by size goes by inches (1/2, 3/4, 1-1/4, 2, 10), not by the text, with ties by line number', async () => {
    const p = uniquePrefix('SIZE');
    await makeLines(p, ['10', '2', '1-1/4', '3/4', '1/2', '2'].map((nominalSize) => ({ nominalSize })));
    const asc = await list({ area: `${p} area`, sort: 'nominalSize' });
    expect(asc.rows.map((r) => r.nominalSize)).toEqual(['1/2', '3/4', '1-1/4', '2', '2', '10']);
    expect(numbers(asc).slice(3, 5)).toEqual([`${p}-002`, `${p}-006`]);
    const desc = await list({ area: `${p} area`, sort: 'nominalSize', dir: 'desc' });
    expect(desc.rows.map((r) => r.nominalSize)).toEqual(['10', '2', '2', '1-1/4', '3/4', '1/2']);
    expect(numbers(desc).slice(1, 3)).toEqual([`${p}-002`, `${p}-006`]);
  });

  it('sorting by design pressure descending puts the highest first', async () => {
    const p = uniquePrefix('PSI');
    await makeLines(p, [{ designPressurePsi: 50 }, { designPressurePsi: 150 }, { designPressurePsi: 90 }]);
    const body = await list({ area: `${p} area`, sort: 'designPressurePsi', dir: 'desc' });
    expect(body.rows.map((r) => r.designPressurePsi)).toEqual([150, 90, 50]);
  });

  it('filters by areas, materials, sizes and statuses, each a list, and together', async () => {
    const p = uniquePrefix('FILTER');
    const [a, b, c] = ['North', 'South', 'East'].map((w) => `${p} ${w}`);
    await makeLines(p, [
      { area: a, material: 'PVC', nominalSize: '2', status: 'in-service' },
      { area: a, material: 'CPVC', nominalSize: '3', status: 'locked-out' },
      { area: b, material: 'ABS', nominalSize: '1-1/2', status: 'out-of-service' },
      { area: c, material: 'CPVC', nominalSize: '2', status: 'in-service' },
    ]);
    const all = [a, b, c];
    expect(numbers(await list({ area: [a, b] }))).toEqual([`${p}-001`, `${p}-002`, `${p}-003`]);
    expect(numbers(await list({ area: all, material: ['CPVC', 'ABS'] }))).toEqual([`${p}-002`, `${p}-003`, `${p}-004`]);
    expect(numbers(await list({ area: all, size: ['2', '1-1/2'] }))).toEqual([`${p}-001`, `${p}-003`, `${p}-004`]);
    expect(numbers(await list({ area: all, status: ['locked-out', 'out-of-service'] }))).toEqual([`${p}-002`, `${p}-003`]);
    expect(numbers(await list({ area: all, material: 'CPVC', size: '2', status: 'in-service' }))).toEqual([`${p}-004`]);
    expect((await list({ area: all, size: '7' })).total).toBe(0); // not a listed size: nothing matches it
  });

  it('an area whose name holds a comma is one area, alone or with a second one', async () => {
    const p = uniquePrefix('COMMA');
    const [north, caustic] = [`${p} Tank farm, north`, `${p} 200 Caustic`];
    await makeLines(p, [{ area: north }, { area: caustic }, { area: `${p} Tank farm` }]);
    expect(numbers(await list({ area: north }))).toEqual([`${p}-001`]);
    expect(numbers(await list({ area: [north, caustic] }))).toEqual([`${p}-001`, `${p}-002`]);
    // The comma is part of the name, not a separator: the two halves are not filtered on.
    const raw = await users.planner.get(`/api/lines?area=${encodeURIComponent(north)}&area=${encodeURIComponent(caustic)}`);
    expect(raw.body.total).toBe(2);
  });

  it('searching finds part of a line number whatever its case', async () => {
    const p = uniquePrefix('Srch');
    await makeLines(p, [{ lineNumber: `${p}-CW-101` }, { lineNumber: `${p}-cw-102` }, { lineNumber: `${p}-HW-103` }]);
    const body = await list({ search: `${p.toLowerCase()}-Cw-10` });
    expect(numbers(body)).toEqual([`${p}-CW-101`, `${p}-cw-102`]);
  });

  it('a % or _ or \\ in the search is a character to find, not a wildcard', async () => {
    const p = uniquePrefix('WILD');
    await makeLines(p, [
      { lineNumber: `${p}-100%` }, { lineNumber: `${p}-1000` },
      { lineNumber: `${p}-A_1` }, { lineNumber: `${p}-AB1` },
      { lineNumber: `${p}-B\\2` }, { lineNumber: `${p}-B2` },
    ]);
    expect(numbers(await list({ search: `${p}-100%` }))).toEqual([`${p}-100%`]);
    expect(numbers(await list({ search: `${p}-A_1` }))).toEqual([`${p}-A_1`]);
    expect(numbers(await list({ search: `${p}-B\\` }))).toEqual([`${p}-B\\2`]);
  });

  it('each row counts its isolation points', async () => {
    const p = uniquePrefix('IPC');
    const [first, second] = await makeLines(p, [{}, {}]);
    await makeIsolationPoint(first, `${p}-V1`);
    await makeIsolationPoint(first, `${p}-B1`, 'blind');
    const body = await list({ area: `${p} area` });
    expect(body.rows.map((r) => [r.lineNumber, r.isolationPointCount])).toEqual([[first.lineNumber, 2], [second.lineNumber, 0]]);
  });

  it('a page asked again is the kept answer, without a statement, until a point is added to one of its lines', async () => {
    const p = uniquePrefix('KEPT');
    const [line] = await makeLines(p, [{}]);
    const query = { area: `${p} area`, sort: 'lineNumber' };
    expect((await list(query)).rows[0]!.isolationPointCount).toBe(0);
    expect(await statementsOf(() => list(query))).toBe(0);
    // Written outside the app's requests, as another process would.
    await makeIsolationPoint(line!, `${p}-V9`);
    expect((await list(query)).rows[0]!.isolationPointCount).toBe(1);
  });

  it('the facets list every area of the register and its sizes in order of inches, whatever the filters', async () => {
    const p = uniquePrefix('FACET');
    await makeLines(p, [
      { area: `${p} Zeta`, nominalSize: '12' },
      { area: `${p} Alpha`, nominalSize: '1-1/4' },
      { area: `${p} Alpha`, nominalSize: '3/4' },
    ]);
    const { facets } = await list({ area: `${p} Zeta` });
    expect(facets.areas).toEqual(expect.arrayContaining([`${p} Alpha`, `${p} Zeta`]));
    expect(facets.areas).toEqual([...new Set(facets.areas)].sort());
    const at = (s: string) => facets.sizes.indexOf(s);
    expect([at('3/4'), at('1-1/4'), at('12')].every((i) => i >= 0)).toBe(true);
    expect(at('3/4')).toBeLessThan(at('1-1/4'));
    expect(at('1-1/4')).toBeLessThan(at('12'));
  });

  it('the count, the facets and a search follow a change to the register at once, even one made outside this process', async () => {
    const p = uniquePrefix('FRESH');
    const [first] = await makeLines(p, [{}, {}, {}]);
    const outOfService = { area: `${p} area`, status: 'out-of-service' };
    expect((await list(outOfService)).total).toBe(0);
    expect((await list(outOfService)).total).toBe(0); // asked twice: the second answer may be the kept count
    // Another API process or the worker writes through its own connection; so does this update.
    await sequelize.query(`update lines set status = 'out-of-service' where id = $1`, { bind: [first!.id] });
    expect((await list(outOfService)).total).toBe(1);
    expect((await list({ search: `${p}-00` })).total).toBe(3);
    await makeLines(`${p}-NEW`, [{ area: `${p} later` }]);
    const after = await list({ search: `${p}-` });
    expect(after.total).toBe(4);
    expect(after.facets.areas).toContain(`${p} later`);
  });

  it('a query the register does not know is refused with the field named', async () => {
    const res = await users.planner.get('/api/lines?sort=colour&pageSize=1000');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(Object.keys(res.body.error.details)).toEqual(expect.arrayContaining(['sort', 'pageSize']));
  });

  it('a NUL character in a filter or the search is refused as a bad query, not a server error', async () => {
    for (const query of ['area=a%00b', 'size=2%00', 'search=a%00b']) {
      const res = await users.planner.get(`/api/lines?${query}`);
      expect(res.status, query).toBe(400);
      expect(res.body.error.code).toBe('bad_request');
    }
    const exported = await users.planner.get('/api/lines/export.csv?area=a%00b');
    expect(exported.status).toBe(400);
  });
});

describe('one line of the register', () => {
  it('comes with its isolation points in tag order', async () => {
    const p = uniquePrefix('DETAIL');
    const [line] = await makeLines(p, [{ sdr: 21, schedule: null, drawingRef: 'P&ID-7', notes: 'Near the pump' }]);
    await makeIsolationPoint(line, `${p}-V2`);
    await makeIsolationPoint(line, `${p}-B1`, 'blind');
    await makeIsolationPoint(line, `${p}-V1`);
    const res = await users.planner.get(`/api/lines/${encodeURIComponent(line.lineNumber)}`);
    expect(res.status).toBe(200);
    const body = lineDetailSchema.parse(res.body);
    expect(body).toMatchObject({ lineNumber: line.lineNumber, sdr: 21, schedule: null, drawingRef: 'P&ID-7', isolationPointCount: 3 });
    expect(body.isolationPoints.map((ip) => ip.tag)).toEqual([`${p}-B1`, `${p}-V1`, `${p}-V2`]);
    expect(body.isolationPoints[0]).toMatchObject({ kind: 'blind', normalPosition: 'installed', notes: null });
  });

  it('a line number with a slash, a quote or a space is found when the client encodes it', async () => {
    const p = uniquePrefix('ODD');
    const lineNumber = `${p}-2"-CW/101 A`;
    await makeLines(p, [{ lineNumber }]);
    const res = await users.planner.get(`/api/lines/${encodeURIComponent(lineNumber)}`);
    expect(res.status).toBe(200);
    expect(res.body.lineNumber).toBe(lineNumber);
  });

  it('a line that is not in the register answers 404 naming it', async () => {
    const res = await users.planner.get('/api/lines/NO-SUCH-LINE-9');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: 'Line NO-SUCH-LINE-9 is not in the register.' } });
  });
});

describe('a line with work still open on it', () => {
  it('the register counts the orders not yet released, closed or cancelled on each line of the page', async () => {
    const p = uniquePrefix('OPEN');
    const [busy, quiet] = await makeLines(p, [{}, {}]);
    const first = await createOrder(users.planner, [busy!]);
    await createOrder(users.planner, [busy!]);
    const list = async () => Object.fromEntries((await users.planner.get(`/api/lines?area=${encodeURIComponent(`${p} area`)}`)).body.rows.map((r: { lineNumber: string; openWorkOrders: number }) => [r.lineNumber, r.openWorkOrders]));
    expect(await list()).toEqual({ [busy!.lineNumber]: 2, [quiet!.lineNumber]: 0 });
    // A cancelled order no longer stands between the line and service.
    expect((await users.planner.post(`/api/work-orders/${first.id}/cancellation`, { reason: 'Folded into the other order.' })).status).toBe(200);
    expect(await list()).toEqual({ [busy!.lineNumber]: 1, [quiet!.lineNumber]: 0 });
  });
});
