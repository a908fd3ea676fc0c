// Builds the OpenAPI 3.1 document from the route registry (route-docs.ts) and the shared zod
// schemas, with zod 4's own z.toJSONSchema (JSON Schema draft 2020-12, the dialect OpenAPI 3.1
// uses). Built once, on the first request.

import { z } from 'zod';
import { rolesFor, whoMay } from '@shared/permissions';
import { ROLES } from '@shared/schemas/roles';
import { REQUEST_SCHEMAS, RESPONSE_SCHEMAS } from './components';
import { ROUTE_DOCS, type RouteDoc } from './route-docs';

type Json = Record<string, unknown>;
type Io = 'input' | 'output';

const API_VERSION = '0.1.0';
const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const INLINE = '__inline_';

/** One side's schemas (request bodies as sent, answers as sent back) in one pass, so a named schema is a $ref wherever it appears. */
function convertSide(named: Record<string, z.ZodType>, used: z.ZodType[], io: Io) {
  const registry = z.registry<{ id: string }>();
  const nameOf = new Map<z.ZodType, string>();
  const add = (schema: z.ZodType, id: string) => {
    registry.add(schema, { id });
    nameOf.set(schema, id);
  };
  for (const [name, schema] of Object.entries(named)) add(schema, name);
  used.forEach((schema, i) => nameOf.has(schema) || add(schema, `${INLINE}${i}`));
  const { schemas } = z.toJSONSchema(registry, { io, target: 'draft-2020-12', unrepresentable: 'any', uri: (id) => `#/components/schemas/${id}` });
  const clean = (s: Json) => Object.fromEntries(Object.entries(s).filter(([k]) => k !== '$schema' && k !== '$id'));
  if (JSON.stringify(schemas).includes(`"$ref":"#/components/schemas/${INLINE}`)) throw new Error('an unnamed schema is used inside another: name it in server/openapi/components.ts');
  return {
    components: Object.fromEntries(Object.keys(named).map((name) => [name, clean(schemas[name] as Json)])),
    schemaOf: (schema: z.ZodType): Json => {
      const name = nameOf.get(schema)!;
      return name.startsWith(INLINE) ? clean(schemas[name] as Json) : ref(name);
    },
  };
}

/** 'PUT /api/people/:id/roles' → ['put', '/api/people/{id}/roles']. */
export function openApiPath(route: string): [method: string, path: string] {
  const [method, path] = route.split(' ') as [string, string];
  return [method.toLowerCase(), path.replace(/:(\w+)/g, '{$1}')];
}

function parameters(schema: z.ZodObject | undefined, where: 'path' | 'query'): Json[] {
  if (!schema) return [];
  const js = z.toJSONSchema(schema, { io: 'input', target: 'draft-2020-12', unrepresentable: 'any' }) as { properties?: Record<string, Json>; required?: string[] };
  return Object.entries(js.properties ?? {}).map(([name, prop]) => ({
    name,
    in: where,
    required: where === 'path' || (js.required ?? []).includes(name),
    schema: prop,
    ...(prop.type === 'array' ? { style: 'form', explode: true } : {}),
  }));
}

const errorResponse = (description: string) => ({ description, content: { 'application/json': { schema: ref('ApiError') } } });

/** The refusals a route has by its kind, then the entry's own. */
function errors(doc: RouteDoc): Record<string, Json> {
  const out: Record<number, string> = {};
  const write = !doc.route.startsWith('GET ');
  if (doc.params || doc.query || doc.body) out[400] = 'A field or parameter is not valid; `details` names each with its messages.';
  if (doc.allow !== 'public') out[401] = 'Not signed in.';
  const guarded = doc.allow !== 'public' && doc.allow !== 'signed-in' && rolesFor(doc.allow).length < ROLES.length;
  if (guarded || write) {
    out[403] = [guarded && `Only ${whoMay(doc.allow as Parameters<typeof whoMay>[0])} may do this.`, write && 'A change must come from the app\'s own origin.'].filter(Boolean).join(' ');
  }
  if (doc.params) out[404] = 'No such record.';
  Object.assign(out, doc.errors);
  return { ...Object.fromEntries(Object.entries(out).map(([status, d]) => [status, errorResponse(d)])), default: errorResponse('An unexpected fault (500): the message is hidden outside development.') };
}

function who(doc: RouteDoc): string {
  if (doc.allow === 'public') return 'anyone, without signing in';
  if (doc.allow === 'signed-in') return 'anyone signed in';
  return `${whoMay(doc.allow)} (permission \`${doc.allow}\`)`;
}

function operation(doc: RouteDoc, req: (s: z.ZodType) => Json, res: (s: z.ZodType) => Json): Json {
  const [method, path] = openApiPath(doc.route);
  const okContent = doc.ok.schema ? { 'application/json': { schema: res(doc.ok.schema) } } : doc.ok.contentType ? { [doc.ok.contentType]: { schema: { type: 'string' } } } : undefined;
  const ok = { description: doc.ok.description, ...(okContent ? { content: okContent } : {}) };
  const body = doc.body && ('multipart' in doc.body ? { 'multipart/form-data': { schema: req(doc.body.multipart) } } : { 'application/json': { schema: req(doc.body) } });
  return {
    operationId: method + path.split(/[/.-]/).filter((w) => w && w !== 'api').map((w) => (w.startsWith('{') ? `By${w.slice(1, 2).toUpperCase()}${w.slice(2, -1)}` : w[0]!.toUpperCase() + w.slice(1))).join(''),
    tags: [doc.tag],
    summary: doc.summary,
    description: `${doc.description ? `${doc.description}\n\n` : ''}Who may call it: ${who(doc)}.`,
    'x-permission': doc.allow,
    ...(doc.allow === 'public' ? {} : { 'x-roles': doc.allow === 'signed-in' ? [...ROLES] : [...rolesFor(doc.allow)] }),
    security: doc.allow === 'public' ? [] : [{ session: [] }],
    parameters: [...parameters(doc.params, 'path'), ...parameters(doc.query, 'query')],
    ...(body ? { requestBody: { required: true, content: body } } : {}),
    responses: { [doc.ok.status]: ok, ...(doc.ok.alsoStatus ? { [doc.ok.alsoStatus]: ok } : {}), ...errors(doc) },
  };
}

export function buildOpenApiDocument(docs: readonly RouteDoc[] = ROUTE_DOCS): Json {
  const bodies = docs.flatMap((d) => (d.body ? ['multipart' in d.body ? d.body.multipart : d.body] : []));
  const answers = docs.flatMap((d) => (d.ok.schema ? [d.ok.schema] : []));
  const request = convertSide(REQUEST_SCHEMAS, bodies, 'input');
  const response = convertSide(RESPONSE_SCHEMAS, answers, 'output');
  const paths: Record<string, Record<string, Json>> = {};
  for (const doc of docs) {
    const [method, path] = openApiPath(doc.route);
    if (paths[path]?.[method]) throw new Error(`${doc.route} is described twice in server/openapi/route-docs.ts`);
    (paths[path] ??= {})[method] = operation(doc, request.schemaOf, response.schemaOf);
  }
  return {
    openapi: '3.1.1',
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    info: {
      title: 'Linewright API',
      version: API_VERSION,
      description:
        'Work orders, the line register and the trade engine of Linewright. Every error answers `{ error: { code, message, details? } }` (ApiError). ' +
        'Each operation names the permission that guards it (`x-permission`, from shared/permissions.ts: an action, `signed-in` or `public`) and the roles that hold it (`x-roles`). ' +
        'Sign in through GET /auth/login; the session is the `lw.sid` cookie. Writes must carry the app\'s own Origin.',
    },
    tags: [...new Set(docs.map((d) => d.tag))].map((name) => ({ name })),
    paths,
    components: {
      schemas: { ...request.components, ...response.components },
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'lw.sid', description: 'The session cookie set when a sign-in completes (GET /auth/callback).' } },
    },
    security: [{ session: [] }],
  };
}

let built: Json | undefined;
/** The document, built on first use (the schemas do not change while the process runs). */
export const openApiDocument = (): Json => (built ??= buildOpenApiDocument());
