/**
 * Mutation generators for the bad-input corpus: from one valid JSON body and a description of
 * its fields, every way to break it that a careless or hostile client might send — wrong
 * types, missing and extra fields, huge strings, deep nesting, prototype-pollution keys,
 * SQL-looking text, invalid UUIDs and dates, non-finite and negative numbers.
 */

/** A JSON value. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
/** A JSON object. */
export type JsonObject = { [key: string]: Json };

/** What a field holds, so the generators know which values are wrong for it. */
export type FieldKind =
  | 'text'
  | 'email'
  | 'uuid'
  | 'date'
  | 'datetime'
  | 'number'
  | 'distance'
  | 'int'
  | 'boolean'
  | 'enum'
  | 'uuid[]'
  | 'list'
  | 'object'
  | 'literal';

/** One field of a body. */
export interface FieldSpec {
  kind: FieldKind;
  /** Whether leaving it out is an error. */
  required: boolean;
  /** Whether any text (e.g. SQL-looking) is legitimately accepted, so such text is not "bad". */
  freeText?: boolean;
  /** Whether the field has a length limit below the huge string's length. */
  bounded?: boolean;
}

/** How a broken body is sent: as a value (supertest serialises it) or as raw bytes. */
export type BodyPayload = { json: Json } | { raw: string; contentType?: string };

/** One generated mutation of a body. */
export interface BodyCase {
  label: string;
  payload: BodyPayload;
  /** The field the 400 must name. */
  field?: string;
  /** Whether any 4xx with a clear error is right (the value passes validation and a later check refuses it). */
  loose?: boolean;
  /** The status the answer must have, when not 400 (413 for a body over the limit). */
  status?: number;
}

/** A string far beyond any field's limit, still well inside the 1 MB body limit. */
export const HUGE = 'x'.repeat(200_000);
/** Text shaped like an injection attempt. */
export const SQLISH = ["' OR '1'='1'; DROP TABLE kicks; --", '1; DELETE FROM users WHERE 1=1', "Robert'); DROP TABLE players;--"];

const BAD_UUIDS = ['not-a-uuid', '00000000-0000-4000-8000-00000000000g', '0000000000004000800000000000000c', '', '../../etc/passwd'];
const BAD_DATES = ['2026-02-30', '2026-13-01', 'yesterday', '18/11/2026', ''];
const BAD_DATETIMES = ['2026-11-18T25:00:00Z', '2026-11-18', 'not a date', '2026-11-18T18:00:00', ''];

/** Values of the wrong JSON type for a field of this kind. */
function wrongTypes(kind: FieldKind): Json[] {
  switch (kind) {
    case 'number':
    case 'distance':
    case 'int':
      return ['12', true, [], {}];
    case 'boolean':
    case 'literal':
      return ['true', 1, [], {}];
    case 'list':
      return ['x', {}, 1, true];
    case 'uuid[]':
      return ['x', {}, 1, [1]];
    case 'object':
      return ['x', 1, [], true];
    default:
      return [12345, true, [], {}];
  }
}

/** Values of the right type but outside what the field allows. */
function outOfRange(kind: FieldKind): { label: string; value: Json }[] {
  switch (kind) {
    case 'uuid':
      return BAD_UUIDS.map((v) => ({ label: `invalid UUID ${JSON.stringify(v)}`, value: v }));
    case 'date':
      return BAD_DATES.map((v) => ({ label: `invalid date ${JSON.stringify(v)}`, value: v }));
    case 'datetime':
      return BAD_DATETIMES.map((v) => ({ label: `invalid date-time ${JSON.stringify(v)}`, value: v }));
    case 'email':
      return ['not-an-email', 'a@', '@b.test', ''].map((v) => ({ label: `invalid e-mail ${JSON.stringify(v)}`, value: v }));
    case 'distance':
      return [
        { label: 'negative distance', value: -5 },
        { label: 'absurd distance', value: 1e9 },
      ];
    case 'number':
      return [
        { label: 'absurd number', value: 1e9 },
        { label: 'absurdly negative number', value: -1e9 },
      ];
    case 'int':
      return [
        { label: 'fraction', value: 1.5 },
        { label: 'absurd integer', value: 1e9 },
      ];
    case 'enum':
      return [{ label: 'unknown choice', value: 'definitely-not-a-choice' }];
    case 'uuid[]':
      return [
        { label: 'invalid UUID in list', value: ['not-a-uuid'] },
        { label: 'list too long', value: Array.from({ length: 60 }, (_, i) => `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`) },
      ];
    default:
      return [];
  }
}

/** A value nested `depth` levels deep (arrays of arrays). */
export function nested(depth: number): Json {
  let v: Json = 1;
  for (let i = 0; i < depth; i++) v = [v];
  return v;
}

/** The JSON text of a value nested `depth` levels deep (JSON.stringify itself overflows the stack on these). */
export function nestedText(depth: number): string {
  return '['.repeat(depth) + '1' + ']'.repeat(depth);
}

/** The body's JSON with one field's value replaced by a raw literal (`NaN`, `Infinity`, `1e400`). */
export function withRawValue(body: JsonObject, field: string, literal: string): string {
  const marker = '"__RAW_LITERAL__"';
  return JSON.stringify({ ...body, [field]: '__RAW_LITERAL__' }).replace(marker, literal);
}

/** Body-level breakage, the same for every JSON route. */
export function bodyCases(body: JsonObject, fields: Record<string, FieldSpec>): BodyCase[] {
  const first = Object.keys(fields)[0] ?? 'x';
  const anyRequired = Object.values(fields).some((f) => f.required);
  const raw = (label: string, text: string, field?: string, contentType?: string): BodyCase => ({
    label,
    payload: { raw: text, contentType },
    field,
  });
  const cases: BodyCase[] = [
    raw('truncated JSON', JSON.stringify(body).slice(0, -3), 'body'),
    raw('NaN literal', withRawValue(body, first, 'NaN'), 'body'),
    raw('Infinity literal', withRawValue(body, first, 'Infinity'), 'body'),
    raw('-Infinity literal', withRawValue(body, first, '-Infinity'), 'body'),
    raw('single-quoted JSON', JSON.stringify(body).replaceAll('"', "'"), 'body'),
    raw('a bare string', '"hello"', 'body'),
    raw('a bare number', '42', 'body'),
    raw('null', 'null', 'body'),
    { ...raw('more than 1 MB', JSON.stringify({ ...body, padding: 'p'.repeat(1_100_000) }), 'body'), status: 413 },
    { label: 'an array instead of an object', payload: { json: [body] }, field: 'body' },
    { label: 'an extra field', payload: { json: { ...body, isAdmin: true } }, field: 'isAdmin' },
    {
      label: 'an extra role field',
      payload: { json: { ...body, role: 'admin', clubId: '00000000-0000-4000-8000-0000000000c2' } },
      field: 'clubId',
    },
    raw('__proto__ key', JSON.stringify(body).replace(/}$/, ',"__proto__":{"isAdmin":true,"role":"admin"}}'), '__proto__'),
    raw('constructor.prototype keys', JSON.stringify(body).replace(/}$/, ',"constructor":{"prototype":{"isAdmin":true}}}'), 'constructor'),
    raw('__proto__ nested in a field', withRawValue(body, first, '{"__proto__":{"polluted":true}}'), `${first}.__proto__`),
    { label: 'deep nesting (64 levels)', payload: { json: { ...body, [first]: nested(64) } } },
    raw('deep nesting (20,000 levels)', withRawValue(body, first, nestedText(20_000))),
    {
      label: 'a thousand extra fields',
      payload: { json: { ...body, ...Object.fromEntries(Array.from({ length: 1000 }, (_, i) => [`extra${i}`, i])) } },
    },
  ];
  if (anyRequired) {
    cases.push({ label: 'an empty object', payload: { json: {} } });
    cases.push(raw('JSON sent as text/plain', JSON.stringify(body), undefined, 'text/plain'));
    cases.push(raw('an empty body', '', undefined, 'application/json'));
  }
  return cases;
}

/** Field-level breakage: each field missing, null, of the wrong type, huge, out of range. */
export function fieldCases(body: JsonObject, fields: Record<string, FieldSpec>, prefix = ''): BodyCase[] {
  const cases: BodyCase[] = [];
  const set = (name: string, value: Json): JsonObject => ({ ...body, [name]: value });
  for (const [name, spec] of Object.entries(fields)) {
    const field = prefix + name;
    if (spec.required) {
      const { [name]: _dropped, ...rest } = body;
      cases.push({ label: `${name} missing`, payload: { json: rest }, field });
    }
    if (spec.kind !== 'literal' || spec.required) cases.push({ label: `${name} null`, payload: { json: set(name, null) }, field });
    for (const value of wrongTypes(spec.kind))
      cases.push({ label: `${name} as ${JSON.stringify(value)}`, payload: { json: set(name, value) }, field });
    for (const { label, value } of outOfRange(spec.kind))
      cases.push({ label: `${name}: ${label}`, payload: { json: set(name, value) }, field });
    if (spec.kind === 'number' || spec.kind === 'distance' || spec.kind === 'int') {
      // JSON.parse reads an overflowing literal as Infinity: it must not reach the database.
      cases.push({ label: `${name} 1e400 (parses to Infinity)`, payload: { raw: withRawValue(body, name, '1e400') }, field });
      cases.push({ label: `${name} "NaN" as text`, payload: { json: set(name, 'NaN') }, field });
    }
    if (spec.kind !== 'text' || spec.bounded)
      cases.push({ label: `${name} a 200,000-character string`, payload: { json: set(name, HUGE) }, field });
    if (!spec.freeText && spec.kind !== 'boolean') {
      for (const sql of SQLISH.slice(0, 2)) {
        const label = `${name} SQL-looking ${JSON.stringify(sql.slice(0, 16))}…`;
        // Plain text fields (tokens, passwords) take any characters: a later check refuses the value.
        cases.push(
          spec.kind === 'text'
            ? { label, payload: { json: set(name, sql) }, loose: true }
            : { label, payload: { json: set(name, sql) }, field },
        );
      }
    }
  }
  return cases;
}
