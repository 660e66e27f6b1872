/**
 * The OpenAPI 3.1 document, generated from the zod schemas the routers parse with (zod 4's own
 * `z.toJSONSchema`, JSON Schema draft 2020-12, which OpenAPI 3.1 uses as its schema dialect). Request
 * schemas are rendered as input (what a client may send, before defaults and transforms), answers as output.
 */
import * as z from 'zod';
import { errorBodySchema } from './responses';
import { OPERATIONS, type Operation } from './operations';

type Json = Record<string, unknown>;

/** Named schemas of the document (`components.schemas`), filled while the operations are rendered. */
type Components = Record<string, Json>;

/**
 * JSON Schema of a zod schema, for the given direction. Payloads defined once in shared/ carry an `id`
 * (zod metadata); zod renders them as `$defs`, which move to `components.schemas` so every operation
 * references the one definition. Request shapes get an `Input` suffix: before defaults and transforms, a
 * payload can differ from the answer with the same id.
 */
function schemaOf(schema: z.ZodType, io: 'input' | 'output', components: Components): Json {
  const suffix = io === 'input' ? 'Input' : '';
  const text = JSON.stringify(z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' })).replace(
    /"#\/\$defs\/([^"]+)"/g,
    (_, id: string) => `"#/components/schemas/${id}${suffix}"`,
  );
  const json = JSON.parse(text) as Json;
  delete json['$schema'];
  const defs = (json['$defs'] ?? {}) as Record<string, Json>;
  delete json['$defs'];
  for (const [id, def] of Object.entries(defs)) components[id + suffix] = def;
  return json;
}

/** `/api/players/:id.json` → `/api/players/{id}.json`. */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:([A-Za-z]+)/g, '{$1}');
}

function parameters(op: Operation, components: Components): Json[] {
  const out: Json[] = [...op.path.matchAll(/:([A-Za-z]+)/g)].map((m) => ({
    name: m[1],
    in: 'path',
    required: true,
    schema: { type: 'string', format: 'uuid' },
  }));
  if (op.query) {
    const query = schemaOf(op.query, 'input', components);
    const props = (query['properties'] ?? {}) as Record<string, Json>;
    const required = new Set((query['required'] ?? []) as string[]);
    for (const [name, schema] of Object.entries(props)) out.push({ name, in: 'query', required: required.has(name), schema });
  }
  return out;
}

/** The success response: 204 without a body, a non-JSON content type, or the JSON answer's schema. */
function successOf(op: Operation, components: Components): Json {
  if (op.noContent) return { description: 'Done (no body)' };
  if (op.produces) return { description: op.summary, content: { [op.produces]: { schema: { type: 'string' } } } };
  return { description: op.summary, content: { 'application/json': { schema: schemaOf(op.answer, 'output', components) } } };
}

function operation(op: Operation, components: Components): Json {
  const success = successOf(op, components);
  const error = {
    description: 'Refused: the body names the reason (and, for 400, each field)',
    content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
  };
  const out: Json = {
    operationId: `${op.method.toLowerCase()}${op.path.replace(/^\/api/, '').replace(/[^A-Za-z0-9]+(.)?/g, (_, c: string | undefined) => (c ? c.toUpperCase() : ''))}`,
    tags: [op.tag],
    summary: op.summary,
    description:
      op.access === 'public'
        ? 'No sign-in needed.'
        : `Signed-in roles: ${op.access.join(', ')}. Every answer is scoped to the caller's club.`,
    parameters: parameters(op, components),
    responses: { [op.noContent ? '204' : op.created ? '201' : '200']: success, '4XX': error },
  };
  if (op.access !== 'public') out['security'] = [{ bearer: [] }];
  if (op.body) out['requestBody'] = { required: true, content: { 'application/json': { schema: schemaOf(op.body, 'input', components) } } };
  if (op.upload) {
    out['requestBody'] = {
      required: true,
      content: {
        'multipart/form-data': {
          schema: { type: 'object', properties: { file: { type: 'string', contentMediaType: 'text/csv' } }, required: ['file'] },
        },
      },
    };
  }
  return out;
}

/** Builds the document (cheap: done once per server). */
export function buildOpenApiDocument(serverUrl: string): Json {
  const paths: Record<string, Json> = {};
  const schemas: Components = {};
  const error = schemaOf(errorBodySchema, 'output', schemas);
  for (const op of OPERATIONS) {
    const path = openApiPath(op.path);
    paths[path] = { ...(paths[path] ?? {}), [op.method.toLowerCase()]: operation(op, schemas) };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Loftline API',
      version: '1',
      description:
        'Kick logs, squads, players, reach and set-piece analysis, sync, imports and exports for a club. Distances are metres (SI) in every ' +
        'payload; the club setting `distanceUnit` changes only how screens, exports and mail show them. Sign in with `POST /api/auth/login` ' +
        'and send the access token as `Authorization: Bearer <token>`.',
    },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: { bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' } },
      schemas: { ...schemas, ...('$ref' in error ? {} : { Error: error }) },
    },
    paths,
  };
}
