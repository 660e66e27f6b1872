/**
 * The bad-input corpus: for every write route, a valid request (so an accidental pass would
 * change the database and be caught) and the generated ways to break it. Sync mutations broken
 * inside an otherwise valid push are separate: the contract answers those per mutation.
 */
import { randomUUID } from 'node:crypto';
import type { Role } from '../../shared/roles';
import {
  bodyCases,
  fieldCases,
  HUGE,
  nested,
  nestedText,
  SQLISH,
  withRawValue,
  type BodyPayload,
  type FieldSpec,
  type Json,
  type JsonObject,
} from './corpus-values';

/** Ids and secrets the corpus needs from the test database. */
export interface CorpusContext {
  refreshToken: string;
  consentVersion: string;
  linkId: string;
  guardianUserId: string;
  unlinkedPlayerId: string;
  erasePlayer: { id: string; name: string };
  u16SquadId: string;
  u16SessionId: string;
  u16DrillId: string;
  u16PlayerId: string;
  u16Shirt: number;
  /** A session of a squad the assistant coach does not staff (the first team). */
  unstaffedSessionId: string;
  otherClubSquadId: string;
  otherClubPlayerId: string;
  /** The demo club's training ground. */
  groundId: string;
}

/** A multipart upload. */
export interface Multipart {
  file?: { buffer: Buffer; name: string; type: string; field?: string };
  /** Whether to attach the file a second time. */
  twice?: boolean;
  fields?: Record<string, string>;
}

/** One malformed request. */
export interface HttpCase {
  route: string;
  label: string;
  as: Role | null;
  url: string;
  payload?: BodyPayload;
  multipart?: Multipart;
  /** The field the 400 must name. */
  field?: string;
  /** Whether any 4xx with a clear error is right. */
  loose?: boolean;
  /** The status the answer must have, when not 400 (413 for a body over the limit). */
  status?: number;
}

/** One malformed mutation inside an otherwise valid push: answered `rejected`. */
export interface MutationCase {
  label: string;
  mutation: Json;
  /** The field the rejection must name. */
  field?: string;
}

const STRONG_PASSWORD = 'a-Sturdy-passphrase-2026';
const FAKE_TOKEN = 'f'.repeat(43);

const text = (required: boolean, extra: Partial<FieldSpec> = {}): FieldSpec => ({ kind: 'text', required, bounded: true, ...extra });
const of = (kind: FieldSpec['kind'], required = true, extra: Partial<FieldSpec> = {}): FieldSpec => ({ kind, required, ...extra });

interface JsonRoute {
  route: string;
  as: Role | null;
  url: string;
  body: JsonObject;
  fields: Record<string, FieldSpec>;
}

function jsonRoutes(c: CorpusContext): JsonRoute[] {
  return [
    {
      route: 'POST /api/auth/login',
      as: null,
      url: '/api/auth/login',
      body: { email: 'head.coach@kestrel-vale.test', password: 'loftline-demo' },
      fields: { email: of('email'), password: text(true) },
    },
    {
      route: 'POST /api/auth/refresh',
      as: null,
      url: '/api/auth/refresh',
      body: { refreshToken: c.refreshToken },
      fields: { refreshToken: text(true) },
    },
    // Signing out with a token the server does not know answers 204 (no oracle), so any text is a valid sign-out.
    {
      route: 'POST /api/auth/logout',
      as: null,
      url: '/api/auth/logout',
      body: { refreshToken: c.refreshToken },
      fields: { refreshToken: text(true, { freeText: true }) },
    },
    {
      route: 'POST /api/auth/accept-invite',
      as: null,
      url: '/api/auth/accept-invite',
      body: { token: FAKE_TOKEN, password: STRONG_PASSWORD },
      fields: { token: text(true), password: text(true) },
    },
    {
      route: 'POST /api/auth/forgot-password',
      as: null,
      url: '/api/auth/forgot-password',
      body: { email: 'assistant.coach@kestrel-vale.test' },
      fields: { email: of('email') },
    },
    {
      route: 'POST /api/auth/reset-password',
      as: null,
      url: '/api/auth/reset-password',
      body: { token: FAKE_TOKEN, password: STRONG_PASSWORD },
      fields: { token: text(true), password: text(true) },
    },
    {
      route: 'PUT /api/me/digest-opt-in',
      as: 'player',
      url: '/api/me/digest-opt-in',
      body: { optIn: true },
      fields: { optIn: of('boolean') },
    },
    {
      route: 'POST /api/sync/push',
      as: 'assistant_coach',
      url: '/api/sync/push',
      body: { deviceId: 'corpus-phone', mutations: [validKick(c)] },
      fields: { deviceId: text(true, { freeText: true }), mutations: of('list') },
    },
    {
      route: 'POST /api/guardians/links',
      as: 'admin',
      url: '/api/guardians/links',
      body: { guardianUserId: c.guardianUserId, playerId: c.unlinkedPlayerId, relationship: 'Aunt' },
      fields: { guardianUserId: of('uuid'), playerId: of('uuid'), relationship: text(false, { freeText: true }) },
    },
    {
      route: 'POST /api/guardians/links/:id/consent',
      as: 'guardian',
      url: `/api/guardians/links/${c.linkId}/consent`,
      body: { consent: true, textVersion: c.consentVersion },
      fields: { consent: of('literal'), textVersion: text(true) },
    },
    {
      route: 'PUT /api/guardians/links/:id/digest',
      as: 'guardian',
      url: `/api/guardians/links/${c.linkId}/digest`,
      body: { optIn: false },
      fields: { optIn: of('boolean') },
    },
    {
      route: 'POST /api/admin/players/:id/erase',
      as: 'admin',
      url: `/api/admin/players/${c.erasePlayer.id}/erase`,
      body: { mode: 'anonymise', confirmName: c.erasePlayer.name },
      fields: { mode: of('enum'), confirmName: { kind: 'text', required: true, freeText: true } },
    },
    {
      route: 'POST /api/admin/invites',
      as: 'admin',
      url: '/api/admin/invites',
      body: {
        email: 'new.kicking.coach@kestrel-vale.test',
        displayName: 'New Kicking Coach',
        role: 'assistant_coach',
        squadIds: [c.u16SquadId],
      },
      fields: {
        email: of('email'),
        displayName: text(true, { freeText: true }),
        role: of('enum'),
        squadIds: of('uuid[]', false),
        playerId: of('uuid', false),
      },
    },
    {
      route: 'POST /api/grounds',
      as: 'admin',
      url: '/api/grounds',
      body: { name: 'North field', latitude: 52.77, longitude: -1.55, altitudeM: 88, kickingBearingDeg: 205 },
      fields: {
        name: text(true, { freeText: true }),
        latitude: of('number'),
        longitude: of('number'),
        altitudeM: of('number'),
        kickingBearingDeg: of('number'),
      },
    },
    {
      route: 'PUT /api/grounds/:id',
      as: 'admin',
      url: `/api/grounds/${c.groundId}`,
      body: { name: 'Longmere Lane', latitude: 52.77, longitude: -1.55, altitudeM: 88, kickingBearingDeg: 205 },
      fields: {
        name: text(true, { freeText: true }),
        latitude: of('number'),
        longitude: of('number'),
        altitudeM: of('number'),
        kickingBearingDeg: of('number'),
      },
    },
    {
      route: 'PUT /api/club/settings',
      as: 'admin',
      url: '/api/club/settings',
      body: { timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'm', locale: 'en-GB' },
      fields: { timingBiasS: of('number'), timingSdS: of('number'), distanceUnit: of('enum', false), locale: text(false) },
    },
    {
      route: 'POST /api/digests/run',
      as: 'admin',
      url: '/api/digests/run',
      body: { weekStart: '2026-11-09' },
      fields: { weekStart: of('date', false) },
    },
  ];
}

/** A kick upsert that the assistant coach may push (U16 session and player). */
export function validKick(c: CorpusContext): JsonObject {
  return {
    id: randomUUID(),
    entity: 'kick',
    op: 'upsert',
    data: {
      id: randomUUID(),
      sessionId: c.u16SessionId,
      drillId: c.u16DrillId,
      playerId: c.u16PlayerId,
      technique: 'lofted',
      foot: 'right',
      backspinStep: 1,
      sidespinStep: 0,
      targetDistanceM: 30,
      targetRadiusM: 3,
      outcome: 'on_target',
      carryM: 29.5,
      recordedAt: '2026-11-18T18:10:00Z',
    },
  };
}

/** Path-parameter breakage for a route with `:id`. */
function pathCases(route: string, as: Role, template: string, otherClubId: string): HttpCase[] {
  const url = (id: string) => template.replace(':id', encodeURIComponent(id));
  const body: Json = route.startsWith('DELETE')
    ? null
    : route.includes('erase')
      ? { mode: 'anonymise', confirmName: 'Nobody' }
      : route.includes('consent')
        ? { consent: false }
        : { optIn: false };
  const payload: BodyPayload | undefined = body === null ? undefined : { json: body };
  return [
    ...['not-a-uuid', '123', SQLISH[0]!, 'x'.repeat(2000), '%00', '..%2F..%2Fetc'].map((id): HttpCase => ({
      route,
      label: `path id ${JSON.stringify(id.slice(0, 20))}`,
      as,
      url: url(id),
      payload,
      field: 'id',
    })),
    { route, label: 'path id unknown', as, url: url(randomUUID()), payload, loose: true },
    { route, label: 'path id of another club', as, url: url(otherClubId), payload, loose: true },
  ];
}

const csv = (s: string, name = 'kicks.csv', type = 'text/csv') => ({ buffer: Buffer.from(s, 'utf8'), name, type });

function importCases(c: CorpusContext): HttpCase[] {
  const cases: HttpCase[] = [];
  const roster = 'POST /api/imports/roster';
  const kicks = 'POST /api/imports/kicks';
  const goodRoster = 'squad,name,shirt_number,birth_year,foot,guardian_emails\nU12 Corpus,Ana Silva,7,2014,left,ana@example.test\n';
  const badFiles: [string, Multipart][] = [
    ['no file', {}],
    ['file in the wrong field', { file: { ...csv(goodRoster), field: 'upload' } }],
    ['empty file', { file: csv('') }],
    ['header only', { file: csv('squad,name\r\n') }],
    ['missing columns', { file: csv('team,player\nA,B\n') }],
    ['unclosed quote', { file: csv('squad,name\n"U12,Ana\n') }],
    [
      'binary renamed .csv',
      { file: { buffer: Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), name: 'photo.csv', type: 'text/csv' } },
    ],
    ['not a .csv name', { file: csv(goodRoster, 'roster.xlsx') }],
    ['an image type', { file: csv(goodRoster, 'roster.csv', 'image/png') }],
    ['over 5 MB', { file: csv('squad,name\n' + `U9 X,${'n'.repeat(100)}\n`.repeat(55_000)) }],
    ['two files', { file: csv(goodRoster), twice: true }],
  ];
  for (const [label, multipart] of badFiles)
    cases.push({ route: roster, label, as: 'admin', url: '/api/imports/roster', multipart, loose: true });
  const badRows: [string, string][] = [
    ['a row without a name', 'squad,name,shirt_number\nU12 Corpus,,7\n'],
    ['a negative shirt number', 'squad,name,shirt_number\nU12 Corpus,Ana Silva,-7\n'],
    ['a birth year in words', 'squad,name,birth_year\nU12 Corpus,Ana Silva,two thousand\n'],
    ['an SQL-looking guardian e-mail', `squad,name,guardian_emails\nU12 Corpus,Ana Silva,"${SQLISH[0]}"\n`],
    ['a huge name', `squad,name\nU12 Corpus,${'n'.repeat(5000)}\n`],
    ['a foot of "both"', 'squad,name,foot\nU12 Corpus,Ana Silva,both\n'],
  ];
  for (const [label, body] of badRows)
    cases.push({
      route: roster,
      label,
      as: 'admin',
      url: '/api/imports/roster',
      multipart: { file: csv(body, 'roster.csv') },
      loose: true,
    });
  cases.push({
    route: roster,
    label: 'dryRun=maybe',
    as: 'admin',
    url: '/api/imports/roster?dryRun=maybe',
    multipart: { file: csv(goodRoster, 'roster.csv') },
    field: 'dryRun',
  });

  const mapping: JsonObject = {
    squadId: c.u16SquadId,
    technique: 'lofted',
    targetDistanceM: 30,
    targetRadiusM: 3,
    device: 'Corpus radar',
    columns: { player: 'player', speed: 'speed', carry: 'carry' },
    units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
  };
  const goodKicks = `player,speed,carry\n${c.u16Shirt},25,30\n`;
  const withMapping = (m: string, file = csv(goodKicks)): Multipart => ({ file, fields: { mapping: m } });
  const mappingFields: Record<string, FieldSpec> = {
    squadId: of('uuid'),
    technique: of('enum'),
    targetDistanceM: of('distance'),
    targetRadiusM: of('distance'),
    device: text(false, { freeText: true }),
    columns: of('object'),
    units: of('object'),
  };
  for (const bc of [
    ...fieldCases(mapping, mappingFields),
    ...bodyCases(mapping, mappingFields).filter(
      (b) => !b.label.includes('MB') && !b.label.includes('text/plain') && !b.label.includes('empty body'),
    ),
  ]) {
    const m = 'raw' in bc.payload ? bc.payload.raw : JSON.stringify(bc.payload.json);
    // A mapping that is not valid JSON is named as `mapping`; inside valid JSON the schema names the field.
    const notJson = (() => {
      try {
        JSON.parse(m);
        return false;
      } catch {
        return true;
      }
    })();
    // multer refuses a field over 64 kB before the router sees it, naming the multipart field.
    const field = notJson || m.length > 64 * 1024 ? 'mapping' : bc.field === 'body' ? undefined : bc.field;
    cases.push({
      route: kicks,
      label: `mapping: ${bc.label}`,
      as: 'head_coach',
      url: '/api/imports/kicks',
      multipart: withMapping(m),
      field,
      loose: field === undefined || bc.loose,
    });
  }
  const kickRows: [string, string][] = [
    ['speed in words', `player,speed,carry\n${c.u16Shirt},fast,30\n`],
    ['a negative carry', `player,speed,carry\n${c.u16Shirt},25,-30\n`],
    ['an unknown player', 'player,speed,carry\n999,25,30\n'],
    ['an SQL-looking player', `player,speed,carry\n"${SQLISH[2]}",25,30\n`],
    ['NaN and Infinity as values', `player,speed,carry\n${c.u16Shirt},NaN,Infinity\n`],
    ['a mapped column missing from the file', `player,velocity\n${c.u16Shirt},25\n`],
  ];
  for (const [label, body] of kickRows)
    cases.push({
      route: kicks,
      label,
      as: 'head_coach',
      url: '/api/imports/kicks',
      multipart: withMapping(JSON.stringify(mapping), csv(body)),
      loose: true,
    });
  cases.push({
    route: kicks,
    label: 'mapping missing',
    as: 'head_coach',
    url: '/api/imports/kicks',
    multipart: { file: csv(goodKicks) },
    field: 'mapping',
  });
  cases.push({
    route: kicks,
    label: 'a squad of another club',
    as: 'head_coach',
    url: '/api/imports/kicks',
    multipart: withMapping(JSON.stringify({ ...mapping, squadId: c.otherClubSquadId })),
    loose: true,
  });
  cases.push({
    route: kicks,
    label: 'columns.player missing',
    as: 'head_coach',
    url: '/api/imports/kicks',
    multipart: withMapping(JSON.stringify({ ...mapping, columns: { speed: 'speed' } })),
    field: 'columns.player',
  });
  cases.push({
    route: kicks,
    label: 'neither speed nor carry',
    as: 'head_coach',
    url: '/api/imports/kicks',
    multipart: withMapping(JSON.stringify({ ...mapping, columns: { player: 'player' } })),
    field: 'mapping.columns',
  });
  cases.push({
    route: kicks,
    label: 'an unknown unit',
    as: 'head_coach',
    url: '/api/imports/kicks',
    multipart: withMapping(JSON.stringify({ ...mapping, units: { speed: 'furlongs/fortnight' } })),
    field: 'units.speed',
  });
  cases.push({
    route: kicks,
    label: 'mapping nested 20,000 deep',
    as: 'head_coach',
    url: '/api/imports/kicks',
    multipart: withMapping(withRawValue(mapping, 'columns', nestedText(20_000))),
    field: 'columns',
  });
  return cases;
}

/** Every malformed request (HTTP answer 4xx). */
export function buildHttpCorpus(c: CorpusContext): HttpCase[] {
  const cases: HttpCase[] = [];
  for (const r of jsonRoutes(c)) {
    for (const bc of [...fieldCases(r.body, r.fields), ...bodyCases(r.body, r.fields)])
      cases.push({
        route: r.route,
        label: bc.label,
        as: r.as,
        url: r.url,
        payload: bc.payload,
        field: bc.field,
        loose: bc.loose,
        ...(bc.status ? { status: bc.status } : {}),
      });
  }
  cases.push(...pathCases('DELETE /api/guardians/links/:id', 'admin', '/api/guardians/links/:id', randomUUID()));
  cases.push(...pathCases('POST /api/guardians/links/:id/consent', 'guardian', '/api/guardians/links/:id/consent', randomUUID()));
  cases.push(...pathCases('PUT /api/guardians/links/:id/digest', 'guardian', '/api/guardians/links/:id/digest', randomUUID()));
  cases.push(...pathCases('POST /api/admin/players/:id/erase', 'admin', '/api/admin/players/:id/erase', c.otherClubPlayerId));
  cases.push(...pathCases('POST /api/admin/users/:id/invite', 'admin', '/api/admin/users/:id/invite', randomUUID()));
  cases.push(...pathCases('POST /api/admin/users/:id/disable', 'admin', '/api/admin/users/:id/disable', randomUUID()));
  const unsub = 'POST /api/digests/unsubscribe';
  for (const [label, query] of [
    ['no token', ''],
    ['an empty token', '?token='],
    ['a garbage token', '?token=garbage'],
    ['an SQL-looking token', `?token=${encodeURIComponent(SQLISH[0]!)}`],
    ['a huge token', `?token=${'t'.repeat(8000)}`],
    ['two tokens', '?token=a.b.c&token=d.e.f'],
    ['a forged token', '?token=eyJhbGciOiJub25lIn0.eyJsIjoiMDAwMDAwMDAtMDAwMC00MDAwLTgwMDAtMDAwMDAwMDAwMDAxIn0.'],
  ] as const) {
    cases.push({ route: unsub, label, as: null, url: `/api/digests/unsubscribe${query}`, payload: { json: {} }, loose: true });
  }
  cases.push({
    route: unsub,
    label: 'malformed JSON body',
    as: null,
    url: '/api/digests/unsubscribe?token=x',
    payload: { raw: '{"a":' },
    field: 'body',
  });
  cases.push({
    route: unsub,
    label: '__proto__ body',
    as: null,
    url: '/api/digests/unsubscribe?token=x',
    payload: { raw: '{"__proto__":{"x":1}}' },
    field: '__proto__',
  });
  cases.push(...importCases(c));
  const push = 'POST /api/sync/push';
  const kick = validKick(c);
  const kickData = kick['data'] as JsonObject;
  cases.push(
    {
      route: push,
      label: '501 mutations',
      as: 'assistant_coach',
      url: '/api/sync/push',
      payload: { json: { deviceId: 'p', mutations: Array.from({ length: 501 }, () => validKick(c)) } },
      field: 'mutations',
    },
    {
      route: push,
      label: 'NaN inside a mutation',
      as: 'assistant_coach',
      url: '/api/sync/push',
      payload: { raw: JSON.stringify({ deviceId: 'p', mutations: [kick] }).replace('"carryM":29.5', '"carryM":NaN') },
      field: 'body',
    },
    {
      route: push,
      label: '__proto__ inside mutation data',
      as: 'assistant_coach',
      url: '/api/sync/push',
      payload: { raw: JSON.stringify({ deviceId: 'p', mutations: [kick] }).replace('"carryM":29.5', '"__proto__":{"clubId":"x"}') },
      field: 'mutations.0.data.__proto__',
    },
    {
      route: push,
      label: 'constructor inside mutation data',
      as: 'assistant_coach',
      url: '/api/sync/push',
      payload: { json: { deviceId: 'p', mutations: [{ ...kick, data: { ...kickData, constructor: { prototype: { x: 1 } } } }] } },
      field: 'mutations.0.data.constructor',
    },
    {
      route: push,
      label: 'mutation data nested 64 deep',
      as: 'assistant_coach',
      url: '/api/sync/push',
      payload: { json: { deviceId: 'p', mutations: [{ ...kick, data: { ...kickData, notes: nested(64) } }] } },
    },
    {
      route: push,
      label: 'deviceId of 200,000 characters',
      as: 'assistant_coach',
      url: '/api/sync/push',
      payload: { json: { deviceId: HUGE, mutations: [] } },
      field: 'deviceId',
    },
  );
  return cases;
}

/** Every malformed mutation inside an otherwise valid push (answered `rejected`, nothing written). */
export function buildMutationCorpus(c: CorpusContext): MutationCase[] {
  const out: MutationCase[] = [];
  const envelope = (data: JsonObject, entity: string): JsonObject => ({ id: randomUUID(), entity, op: 'upsert', data });
  const session: JsonObject = {
    id: randomUUID(),
    squadId: c.u16SquadId,
    startedAt: '2026-11-18T18:00:00Z',
    ballSize: 5,
    temperatureC: 12,
    windSpeedMs: 3,
    windFromDeg: 90,
    notes: 'Corpus session',
  };
  const drill: JsonObject = {
    id: randomUUID(),
    sessionId: c.u16SessionId,
    technique: 'lofted',
    targetDistanceM: 30,
    targetRadiusM: 3,
    label: 'Corpus drill',
  };
  const kick = validKick(c)['data'] as JsonObject;
  const specs: [string, JsonObject, Record<string, FieldSpec>][] = [
    [
      'training_session',
      session,
      {
        id: of('uuid'),
        squadId: of('uuid'),
        startedAt: of('datetime'),
        ballSize: of('int'),
        temperatureC: of('number', false),
        windSpeedMs: of('distance', false),
        windFromDeg: of('number', false),
        notes: text(false, { freeText: true }),
      },
    ],
    [
      'drill',
      drill,
      {
        id: of('uuid'),
        sessionId: of('uuid'),
        technique: of('enum'),
        targetDistanceM: of('distance'),
        targetRadiusM: of('distance'),
        label: text(false, { freeText: true }),
      },
    ],
    [
      'kick',
      kick,
      {
        id: of('uuid'),
        sessionId: of('uuid'),
        playerId: of('uuid'),
        drillId: of('uuid', false),
        technique: of('enum'),
        foot: of('enum'),
        backspinStep: of('int'),
        sidespinStep: of('int'),
        targetDistanceM: of('distance'),
        targetRadiusM: of('distance'),
        outcome: of('enum'),
        carryM: of('distance', false),
        measuredSpeedMs: of('distance', false),
        recordedAt: of('datetime'),
      },
    ],
  ];
  for (const [entity, data, fields] of specs) {
    for (const bc of fieldCases(data, fields)) {
      if (!('json' in bc.payload)) continue; // raw literals cannot sit inside an otherwise valid JSON batch
      const nullable = !fields[bc.field ?? '']?.required && bc.label.endsWith(' null');
      if (nullable) continue; // optional measurements may be null
      out.push({ label: `${entity}: ${bc.label}`, mutation: envelope(bc.payload.json as JsonObject, entity), field: `data.${bc.field}` });
    }
  }
  const base = validKick(c);
  out.push(
    { label: 'envelope: id not a UUID', mutation: { ...base, id: 'not-a-uuid' }, field: 'id' },
    { label: 'envelope: id missing', mutation: { entity: 'kick', op: 'upsert', data: kick }, field: 'id' },
    { label: 'envelope: unknown entity', mutation: { ...base, entity: 'users' }, field: 'entity' },
    { label: 'envelope: SQL-looking entity', mutation: { ...base, entity: SQLISH[0]! }, field: 'entity' },
    { label: 'envelope: unknown op', mutation: { ...base, op: 'drop' }, field: 'op' },
    { label: 'envelope: data a string', mutation: { ...base, data: 'x' }, field: 'data' },
    { label: 'envelope: data an array', mutation: { ...base, data: [] }, field: 'data' },
    { label: 'envelope: data null', mutation: { ...base, data: null }, field: 'data' },
    { label: 'envelope: negative baseVersion', mutation: { ...base, baseVersion: -1 }, field: 'baseVersion' },
    { label: 'envelope: fractional baseVersion', mutation: { ...base, baseVersion: 1.5 }, field: 'baseVersion' },
    { label: 'envelope: the mutation a string', mutation: 'kick', field: 'body' },
    { label: 'envelope: the mutation null', mutation: null, field: 'body' },
    {
      label: 'delete: id not a UUID',
      mutation: { id: randomUUID(), entity: 'kick', op: 'delete', data: { id: 'nope' } },
      field: 'data.id',
    },
    {
      label: 'kick: unknown session',
      mutation: envelope({ ...kick, id: randomUUID(), sessionId: randomUUID() }, 'kick'),
      field: 'data.sessionId',
    },
    {
      label: 'kick: a session of a squad the coach does not staff',
      mutation: envelope({ ...kick, id: randomUUID(), sessionId: c.unstaffedSessionId }, 'kick'),
    },
    {
      label: 'kick: another club’s player',
      mutation: envelope({ ...kick, id: randomUUID(), playerId: c.otherClubPlayerId }, 'kick'),
      field: 'data.playerId',
    },
    {
      label: 'kick: a drill of another session',
      mutation: envelope({ ...kick, id: randomUUID(), drillId: randomUUID() }, 'kick'),
      field: 'data.drillId',
    },
    {
      label: 'session: another club’s squad',
      mutation: envelope({ ...session, id: randomUUID(), squadId: c.otherClubSquadId }, 'training_session'),
    },
    {
      label: 'session: conditionsSource with an unknown source',
      mutation: envelope({ ...session, id: randomUUID(), conditionsSource: { temperatureC: 'guess' } }, 'training_session'),
      field: 'data.conditionsSource.temperatureC',
    },
    {
      label: 'session: notes of 200,000 characters',
      mutation: envelope({ ...session, id: randomUUID(), notes: HUGE }, 'training_session'),
      field: 'data.notes',
    },
    {
      label: 'drill: label of 200,000 characters',
      mutation: envelope({ ...drill, id: randomUUID(), label: HUGE }, 'drill'),
      field: 'data.label',
    },
    // Issue 15: the flight model's domain, unknown fields, unknown condition keys, dates out of bounds.
    ...(
      [
        ['carryM', 0],
        ['measuredSpeedMs', 0],
        ['launchAngleDeg', 0],
        ['launchAngleDeg', -8],
        ['lateralM', 61],
        ['measuredSpinRps', -1],
      ] as const
    ).map(([field, value]) => ({
      label: `kick: ${field} ${value}, outside the model's domain`,
      mutation: envelope({ ...kick, id: randomUUID(), [field]: value }, 'kick'),
      field: `data.${field}`,
    })),
    {
      label: 'kick: an unknown field',
      mutation: envelope({ ...kick, id: randomUUID(), carryMeters: 30 }, 'kick'),
      field: 'data.carryMeters',
    },
    {
      label: 'kick: recorded in the year 0000',
      mutation: envelope({ ...kick, id: randomUUID(), recordedAt: '0000-01-01T00:00:00Z' }, 'kick'),
      field: 'data.recordedAt',
    },
    {
      label: 'session: conditionsSource with an unknown key',
      mutation: envelope({ ...session, id: randomUUID(), conditionsSource: { junk: 'coach' } }, 'training_session'),
      field: 'data.conditionsSource.junk',
    },
    {
      label: 'session: ends in the year 9999',
      mutation: envelope({ ...session, id: randomUUID(), endedAt: '9999-12-31T23:59:59Z' }, 'training_session'),
      field: 'data.endedAt',
    },
  );
  return out;
}
