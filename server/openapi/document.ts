/**
 * The OpenAPI 3.1 document of API v1, built from the route list (./routes.ts) and the zod
 * schemas of shared/schemas through zod's own JSON Schema output (draft 2020-12, the dialect of
 * OpenAPI 3.1). Request schemas are described as they are sent (`io: 'input'`: a coerced number
 * may arrive as text), responses as the server writes them. Built once, on first request.
 */
import { z } from 'zod';
import { apiRoutes, type Access, type RouteDoc } from './routes';
import { errorSchema } from '@shared/schemas/responses';

type JsonSchema = Record<string, unknown>;
type Operation = Record<string, unknown>;

/** The versioned base path every documented path is under. */
export const API_V1 = '/api/v1';

/** Express's `/results/:id` → OpenAPI's `/results/{id}`. */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
}

const REF_PREFIX = '#/$defs/';

/**
 * A zod schema as JSON Schema; schemas named with `.meta({ id })` go to components.schemas and
 * are referred to from there.
 */
function toSchema(schema: z.ZodType, io: 'input' | 'output', components: Record<string, JsonSchema>): JsonSchema {
  const { $schema: _dialect, $defs, ...root } = z.toJSONSchema(schema, { io, unrepresentable: 'any', target: 'draft-2020-12' }) as JsonSchema & { $defs?: Record<string, JsonSchema> };
  const relink = (node: unknown): unknown => {
    if (Array.isArray(node)) return node.map(relink);
    if (!node || typeof node !== 'object') return node;
    return Object.fromEntries(
      Object.entries(node).map(([k, v]) => [k, k === '$ref' && typeof v === 'string' && v.startsWith(REF_PREFIX) ? `#/components/schemas/${v.slice(REF_PREFIX.length)}` : relink(v)]),
    );
  };
  for (const [id, def] of Object.entries($defs ?? {})) components[id] ??= relink(def) as JsonSchema;
  return relink(root) as JsonSchema;
}

/** An object schema's fields as OpenAPI parameters of `where` (path or query). */
function parametersOf(schema: z.ZodType, where: 'path' | 'query', components: Record<string, JsonSchema>) {
  const json = toSchema(schema, 'input', components) as { properties?: Record<string, JsonSchema>; required?: string[] };
  return Object.entries(json.properties ?? {}).map(([name, property]) => {
    const { description, ...rest } = property as JsonSchema & { description?: string };
    return {
      name,
      in: where,
      required: where === 'path' || (json.required ?? []).includes(name),
      ...(description ? { description } : {}),
      schema: rest,
      ...(where === 'query' && rest.type === 'array' ? { style: 'form', explode: true } : {}),
    };
  });
}

const SIGNED_IN = [{ sessionCookie: [] }, { bearerToken: [] }];
const SIGNED_IN_WRITE = [{ sessionCookie: [], csrfToken: [] }, { bearerToken: [] }];

/** Who may call: the security requirements (an empty one for routes anyone may call). */
function securityOf(access: Access, write: boolean) {
  const signedIn = write ? SIGNED_IN_WRITE : SIGNED_IN;
  return access === 'public' ? [{}, ...signedIn] : signedIn;
}

const ERROR_TEXT: Record<number, string> = {
  400: 'Invalid input: `issues` names each field at fault',
  401: 'Not signed in, or the API token is unknown or revoked',
  403: 'Signed in, but this account may not (or the X-CSRF-Token header is missing or wrong)',
  404: 'No such record, or not visible to you',
  409: 'Conflicts with the current state (someone changed it first, or it was already decided)',
  413: 'The upload is too large',
  415: 'The upload is not of an accepted type',
  429: 'Too many requests: wait as `Retry-After` says',
};

function responsesOf(route: RouteDoc, components: Record<string, JsonSchema>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const { answer } = route;
  if ('empty' in answer) out['204'] = { description: 'Done; no body' };
  else if ('file' in answer) {
    out['200'] = { description: 'The file', content: { [answer.file]: { schema: answer.file === 'image/jpeg' ? { type: 'string', contentMediaType: 'image/jpeg' } : { type: 'string' } } } };
  } else {
    out[String(answer.status ?? 200)] = {
      description: answer.paged ? 'One page of the list; `Link` names the first, prev, next and last pages' : 'Done',
      ...(answer.paged
        ? { headers: { Link: { description: 'RFC 8288 links to the first, prev, next and last pages', schema: { type: 'string' }, example: '</api/v1/results?page=1>; rel="first", </api/v1/results?page=2>; rel="next", </api/v1/results?page=7>; rel="last"' } } }
        : {}),
      content: { 'application/json': { schema: toSchema(answer.json, 'output', components) } },
    };
    if (answer.also === 202) out['202'] = { description: 'Accepted: proposed for review, not applied yet', content: { 'application/json': { schema: toSchema(answer.json, 'output', components) } } };
    else if (answer.also) out[String(answer.also.status)] = { description: answer.also.description, content: { 'application/json': { schema: toSchema(answer.also.json, 'output', components) } } };
  }
  const errors = new Set<number>([400, ...(route.errors ?? []), ...Object.keys(route.refusals ?? {}).map(Number)]);
  if (route.access !== 'public') errors.add(401);
  if (route.access !== 'public' && route.access !== 'signed-in') errors.add(403);
  if (route.method !== 'get' && route.access !== 'public') errors.add(403);
  if (route.params) errors.add(404);
  for (const status of [...errors].sort()) {
    const refusal = route.refusals?.[status as 400 | 409];
    out[String(status)] = refusal
      ? { description: ERROR_TEXT[status], content: { 'application/json': { schema: { anyOf: [toSchema(errorSchema, 'output', components), toSchema(refusal, 'output', components)] } } } }
      : { $ref: `#/components/responses/Error${status}` };
  }
  return out;
}

function operationOf(route: RouteDoc, components: Record<string, JsonSchema>): Operation {
  const write = route.method !== 'get';
  const parameters = [
    ...(route.params ? parametersOf(route.params, 'path', components) : []),
    ...(route.query ? parametersOf(route.query, 'query', components) : []),
  ];
  const roleNote = route.access === 'public' || route.access === 'signed-in' ? '' : ` Needs the ${route.access} role or above.`;
  const operation: Operation = {
    operationId: `${route.method}${openApiPath(route.path).replace(/[{}]/g, '').replace(/[^A-Za-z0-9]+(.)?/g, (_m, c: string | undefined) => (c ? c.toUpperCase() : ''))}`,
    summary: route.summary,
    ...(route.description || roleNote ? { description: `${route.description ?? ''}${roleNote}`.trim() } : {}),
    tags: [route.tag],
    security: securityOf(route.access, write),
    ...(parameters.length ? { parameters } : {}),
    responses: responsesOf(route, components),
  };
  if (route.body) {
    operation.requestBody = {
      required: true,
      content: { 'application/json': { schema: toSchema(route.body, 'input', components), ...(route.example ? { example: route.example } : {}) } },
    };
  } else if (route.upload) {
    const fields = route.upload.fields ? (toSchema(route.upload.fields, 'input', components) as { properties?: JsonSchema; required?: string[] }) : {};
    operation.requestBody = {
      required: true,
      content: {
        'multipart/form-data': {
          schema: {
            type: 'object',
            properties: { [route.upload.field]: { type: 'string', contentMediaType: 'application/octet-stream' }, ...(fields.properties ?? {}) },
            required: [route.upload.field, ...(fields.required ?? [])],
          },
        },
      },
    };
  }
  return operation;
}

/** The whole document. */
export function buildOpenApiDocument(routes: readonly RouteDoc[] = apiRoutes) {
  const components: Record<string, JsonSchema> = {};
  const errorBody = toSchema(errorSchema, 'output', components);
  const paths: Record<string, Record<string, Operation>> = {};
  for (const route of routes) {
    const path = openApiPath(route.path);
    paths[path] ??= {};
    if (paths[path][route.method]) throw new Error(`${route.method.toUpperCase()} ${route.path} is described twice in server/openapi/routes.ts`);
    paths[path][route.method] = operationOf(route, components);
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Edgeledger API',
      version: '1',
      summary: 'Sharpening results, reference pages and the comparison, for scripts and clients.',
      description:
        'Reads need no account unless a route says so. Writes are made either with the session cookie and its `X-CSRF-Token` header ' +
        '(GET /session gives the token) or with an API token (`Authorization: Bearer …`, made on your page by publishers). ' +
        'Lists that page say so in their `Link` header (RFC 8288: first, prev, next, last). The unversioned paths under /api answer the same as /api/v1. ' +
        'Demo data on a development server is invented.',
      license: { name: 'CC BY 4.0 (the data)', url: 'https://creativecommons.org/licenses/by/4.0/' },
    },
    servers: [{ url: API_V1, description: 'API v1 on this server' }],
    tags: [...new Set(routes.map((r) => r.tag))].map((name) => ({ name })),
    paths,
    components: {
      schemas: components,
      responses: Object.fromEntries(
        Object.entries(ERROR_TEXT).map(([status, description]) => [`Error${status}`, { description, content: { 'application/json': { schema: errorBody } } }]),
      ),
      securitySchemes: {
        sessionCookie: { type: 'apiKey', in: 'cookie', name: 'edgeledger', description: 'The session cookie set by signing in (named `__Host-edgeledger` in production).' },
        csrfToken: { type: 'apiKey', in: 'header', name: 'X-CSRF-Token', description: 'With the session cookie, every write sends the token GET /session gives.' },
        bearerToken: { type: 'http', scheme: 'bearer', description: 'An API token made on your page (publishers); no CSRF token needed.' },
      },
    },
  };
}

export type OpenApiDocument = ReturnType<typeof buildOpenApiDocument>;

let built: string | null = null;

/** The document as JSON text, built once. */
export function openApiJson(): string {
  built ??= JSON.stringify(buildOpenApiDocument());
  return built;
}
