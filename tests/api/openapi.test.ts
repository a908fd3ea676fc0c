import { describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { openApiPath } from '@server/openapi/document';
import { rolesFor, type Action } from '@shared/permissions';
import { ROLES } from '@shared/schemas/roles';
import { WORK_ORDER_STATES } from '@shared/schemas/work-orders';
import { useTestApp } from '../helpers/app';
import { Browserless } from '../helpers/browserless';
import { listRoutes } from '../helpers/app-routes';

/** Served by the app but not API routes: the client's pages, present when a build is there. */
const NOT_API = new Set(['GET /{*splat}']);
const METHODS = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace'];

const users = useTestApp({ signIn: ['planner'] });
const served = async () => {
  const res = await new Browserless().get('/api/openapi.json');
  expect(res.status).toBe(200);
  return res.body;
};
/** Every operation as "METHOD /express/:path", with the operation. */
const operations = (doc: any): [string, any][] =>
  Object.entries<Record<string, any>>(doc.paths).flatMap(([path, item]) =>
    Object.entries(item).filter(([m]) => METHODS.includes(m)).map(([m, op]) => [`${m.toUpperCase()} ${path.replace(/\{(\w+)\}/g, ':$1')}`, op] as [string, any]));
const resolve = (doc: any, schema: any) => (schema.$ref ? doc.components.schemas[schema.$ref.replace('#/components/schemas/', '')] : schema);

describe('the OpenAPI document lists every route, and only routes that exist', () => {
  const routes = listRoutes(createApp()).filter((r) => !NOT_API.has(r));

  it('every route the app has is in the document', async () => {
    const listed = new Set(operations(await served()).map(([route]) => route));
    const missing = routes.filter((r) => !listed.has(r));
    expect(missing, `routes without an entry in server/openapi/route-docs.ts: ${missing.join(', ')}`).toEqual([]);
  });

  it('every operation in the document is a route the app has', async () => {
    const gone = operations(await served()).map(([route]) => route).filter((r) => !routes.includes(r));
    expect(gone, `entries whose route does not exist: ${gone.join(', ')}`).toEqual([]);
  });

  it('turns Express paths into OpenAPI paths', () => {
    expect(openApiPath('PUT /api/people/:id/roles')).toEqual(['put', '/api/people/{id}/roles']);
  });
});

describe('GET /api/openapi.json', () => {
  it('answers without a sign-in with an OpenAPI 3.1 document', async () => {
    const doc = await served();
    expect(doc.openapi).toMatch(/^3\.1\.\d+$/);
    expect(doc.info).toEqual(expect.objectContaining({ title: expect.any(String), version: expect.any(String) }));
    expect(typeof doc.paths).toBe('object');
    expect(doc.components.securitySchemes.session).toEqual(expect.objectContaining({ type: 'apiKey', in: 'cookie', name: 'lw.sid' }));
    for (const path of Object.keys(doc.paths)) expect(path).toMatch(/^\/[^:]*$/);
  });

  it('gives every operation a unique id, a success answer, the error shape, and the path parameters its path names', async () => {
    const doc = await served();
    const ids = new Set<string>();
    for (const [route, op] of operations(doc)) {
      expect(ids.has(op.operationId), `${route}: operationId ${op.operationId} twice`).toBe(false);
      ids.add(op.operationId);
      expect(Object.keys(op.responses).some((s) => /^[23]\d\d$/.test(s)), `${route} has no success answer`).toBe(true);
      expect(op.responses.default.content['application/json'].schema).toEqual({ $ref: '#/components/schemas/ApiError' });
      const named = [...route.matchAll(/:(\w+)/g)].map((m) => m[1]).sort();
      const declared = op.parameters.filter((p: any) => p.in === 'path').map((p: any) => p.name).sort();
      expect(declared, `${route}: path parameters`).toEqual(named);
    }
  });

  it('resolves every $ref to a schema of its components', async () => {
    const doc = await served();
    const refs = [...JSON.stringify(doc).matchAll(/"\$ref":"([^"]+)"/g)].map((m) => m[1]!);
    expect(refs.length).toBeGreaterThan(50);
    for (const ref of new Set(refs)) {
      expect(ref).toMatch(/^#\/components\/schemas\//);
      expect(doc.components.schemas[ref.split('/').pop()!], ref).toBeDefined();
    }
  });

  it('names the permission and the roles that hold it on every operation, as shared/permissions.ts has them', async () => {
    for (const [route, op] of operations(await served())) {
      const allow = op['x-permission'];
      expect(op.description, route).toContain('Who may call it:');
      if (allow === 'public') {
        expect(op.security, route).toEqual([]);
        expect(op['x-roles'], route).toBeUndefined();
      } else {
        expect(op['x-roles'], route).toEqual(allow === 'signed-in' ? [...ROLES] : [...rolesFor(allow as Action)]);
        expect(op.responses[401], `${route} answers 401 without a session`).toBeDefined();
      }
    }
  });

  it('describes the work-order create body from its shared schema, with the fields it requires', async () => {
    const doc = await served();
    const op = doc.paths['/api/work-orders'].post;
    const body = resolve(doc, op.requestBody.content['application/json'].schema);
    expect(body.required).toEqual(expect.arrayContaining(['kind', 'priority', 'scope', 'requestedBy', 'lineIds']));
    expect(body.required).not.toContain('windowStart'); // it has a default: the client may leave it out
    expect(body.properties.kind.enum).toEqual(['repair', 'tie-in', 'replacement']);
    expect(body.properties.lineIds).toEqual(expect.objectContaining({ type: 'array', minItems: 1 }));
    expect(op['x-roles']).toEqual(['planner', 'supervisor']);
    expect(op.responses[201].content['application/json'].schema).toEqual({ $ref: '#/components/schemas/WorkOrder' });
    expect(resolve(doc, doc.paths['/api/work-orders/{id}'].patch.requestBody.content['application/json'].schema).required).toEqual(['version']);
  });

  it('describes parameters from the schemas the routes validate with', async () => {
    const doc = await served();
    const list = doc.paths['/api/work-orders'].get.parameters;
    expect(list.find((p: any) => p.name === 'state')).toEqual(expect.objectContaining({ in: 'query', required: false, schema: { type: 'array', items: { type: 'string', enum: [...WORK_ORDER_STATES] } } }));
    expect(list.find((p: any) => p.name === 'pageSize').schema).toEqual(expect.objectContaining({ type: 'integer', maximum: 200, default: 50 }));
    const schedule = doc.paths['/api/schedule'].get.parameters;
    expect(schedule.filter((p: any) => p.required).map((p: any) => p.name).sort()).toEqual(['from', 'to']);
    const person = doc.paths['/api/people/{id}/roles'].put.parameters[0];
    expect(person).toEqual(expect.objectContaining({ name: 'id', in: 'path', required: true }));
    expect(person.schema.format).toBe('uuid');
  });

  it('describes answers with the shared schemas: the order refers to its lines and joint tasks by name', async () => {
    const doc = await served();
    const order = doc.components.schemas.WorkOrder;
    expect(order.properties.lines.items).toEqual({ $ref: '#/components/schemas/Line' });
    expect(order.properties.jointTasks.items).toEqual({ $ref: '#/components/schemas/JointTask' });
    expect(doc.components.schemas.ApiError.properties.error.required).toEqual(['code', 'message']);
  });

  it('the signed-in person GET /api/me answers with carries every field the document requires of Me', async () => {
    const doc = await served();
    const me = (await users.planner.get('/api/me')).body;
    const schema = resolve(doc, doc.paths['/api/me'].get.responses[200].content['application/json'].schema);
    for (const field of schema.required) expect(me, field).toHaveProperty(field);
  });
});
