/**
 * Measured-kick import from any ball-measuring device's CSV: the coach maps columns to fields
 * and picks units; players are matched by shirt number or name within the squad. A commit
 * creates one session and drill for the upload and its kicks, each with an id derived from its
 * natural key (player, time, measurements), so importing the same rows again adds nothing.
 */
import { audit } from '../audit';
import { createHash, randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import * as z from 'zod';
import { DEFAULT_ELEVATION_DEG, SPIN_STEP_RPS, simulateKick, type BackspinStep } from '../../shared/flight/index';
import { parseLocalDateTime } from '../../shared/dates';
import { domainWords, inDomain, KICK_DOMAIN, TECHNIQUES, type DomainRange, type Outcome } from '../../shared/schemas/sync';
import { ballOf } from '../analysis/flight-inputs';
import { nextChangeSeq, withChangeSeqBlock, type Db } from '../db/client';
import { cachedStatement } from '../db/statements';
import { clubs, drills, players, squads, trainingSessions, uploads } from '../db/schema';
import { Forbidden, Invalid, parseOrThrow } from '../errors';
import type { Scope } from '../scope/scope';
import { readCsv } from './csv';
import type { KicksSummary } from '../../shared/schemas/imports';
import { ImportInvalid, type ImportAnswer, type ImportRowError } from './import-types';
import { distanceToM, speedToMs, spinToRps } from './units';

const column = z.string().trim().min(1).max(120).optional();

/** The `mapping` field of `POST /api/imports/kicks`. */
export const kickMappingSchema = z.strictObject({
  squadId: z.uuid({ error: 'squadId must be a squad id' }),
  technique: z.enum(TECHNIQUES, { error: `technique must be one of ${TECHNIQUES.join(', ')}` }),
  targetDistanceM: z.number({ error: 'targetDistanceM must be a number' }).min(1).max(120),
  targetRadiusM: z.number({ error: 'targetRadiusM must be a number' }).min(0.25).max(30),
  device: z.string().trim().max(80).optional(),
  columns: z.strictObject({
    player: z.string({ error: 'columns.player is required' }).trim().min(1, { error: 'columns.player is required' }),
    time: column,
    speed: column,
    launchAngle: column,
    spin: column,
    carry: column,
    lateral: column,
  }),
  units: z.strictObject({
    speed: z.enum(['m/s', 'km/h', 'mph'], { error: 'units.speed must be m/s, km/h or mph' }).default('m/s'),
    spin: z.enum(['rev/s', 'rpm'], { error: 'units.spin must be rev/s or rpm' }).default('rev/s'),
    distance: z.enum(['m', 'yd'], { error: 'units.distance must be m or yd' }).default('m'),
  }),
});
export type KickMapping = z.infer<typeof kickMappingSchema>;

/** What a measured-kick commit did (shape defined once in shared/). */
export type { KicksSummary };

interface KickRow {
  id: string;
  playerId: string;
  foot: 'left' | 'right';
  recordedAt: string;
  speedMs: number | null;
  angleDeg: number | null;
  spinRps: number | null;
  carryM: number | null;
  lateralM: number | null;
  outcome: Outcome;
}

/** A UUID-shaped id from a natural key (SHA-256; version nibble 4 and RFC 4122 variant so it passes UUID checks). */
export function naturalKeyId(key: string): string {
  const h = createHash('sha256').update(key).digest('hex').split('');
  h[12] = '4';
  h[16] = ((parseInt(h[16]!, 16) & 0x3) | 0x8).toString(16);
  const s = h.join('');
  return `${s.slice(0, 8)}-${s.slice(8, 12)}-${s.slice(12, 16)}-${s.slice(16, 20)}-${s.slice(20, 32)}`;
}

function outcomeOf(carryM: number, lateralM: number, target: number, radius: number): Outcome {
  const d = carryM - target;
  if (Math.hypot(d, lateralM) <= radius) return 'on_target';
  if (Math.abs(d) >= Math.abs(lateralM)) return d < 0 ? 'short' : 'long';
  return lateralM > 0 ? 'left' : 'right';
}

function nearestBackspinStep(rps: number): number {
  let best = 0;
  for (const [step, rate] of Object.entries(SPIN_STEP_RPS))
    if (Math.abs(rate - rps) < Math.abs(SPIN_STEP_RPS[best as BackspinStep] - rps)) best = Number(step);
  return best;
}

/** Previews or commits a device export for one squad. */
export function importKicks(
  db: Db,
  scope: Scope,
  file: { name: string; buffer: Buffer },
  rawMapping: unknown,
  dryRun: boolean,
): ImportAnswer<KicksSummary> {
  const mapping = parseOrThrow(kickMappingSchema, rawMapping, 'Mapping');
  const squad = db
    .select()
    .from(squads)
    .where(and(eq(squads.id, mapping.squadId), isNull(squads.deletedAt)))
    .get();
  if (!squad || squad.clubId !== scope.user.clubId || !scope.canWriteSquad(squad.id))
    throw new Forbidden('You may not import kicks into this squad');
  // Device times without a zone are the club's wall-clock time.
  const clubTimeZone = db.select({ tz: clubs.timezone }).from(clubs).where(eq(clubs.id, squad.clubId)).get()?.tz ?? 'UTC';
  const cols = mapping.columns;
  const used = Object.entries(cols).filter((e): e is [string, string] => typeof e[1] === 'string');
  const table = readCsv(
    file.buffer,
    used.map(([, c]) => c),
  );
  if (!cols.speed && !cols.carry)
    throw new Invalid('Map at least a speed or a carry column', [{ field: 'mapping.columns', message: 'speed or carry is required' }]);
  const roster = db
    .select()
    .from(players)
    .where(and(eq(players.squadId, squad.id), isNull(players.deletedAt)))
    .all();
  const decimalComma = table.delimiter === ';';
  const num = (raw: string | undefined): number | null | 'bad' => {
    const v = (raw ?? '').trim();
    if (v === '') return null;
    const n = Number(decimalComma ? v.replace(',', '.') : v);
    return Number.isFinite(n) ? n : 'bad';
  };
  // Players by shirt number and by name, built once (the first match wins, as a scan of the roster would).
  const byShirt = new Map<number, (typeof roster)[number]>();
  const byName = new Map<string, (typeof roster)[number]>();
  for (const p of roster) {
    if (p.shirtNumber !== null && !byShirt.has(p.shirtNumber)) byShirt.set(p.shirtNumber, p);
    if (!byName.has(p.displayName.toLowerCase())) byName.set(p.displayName.toLowerCase(), p);
  }
  const errors: ImportRowError[] = [];
  const rows: KickRow[] = [];
  const hash = createHash('sha256').update(file.buffer).update(JSON.stringify(mapping)).digest('hex');
  for (const { row, values } of table.rows) {
    let rowHasError = false;
    const err = (col: string, message: string) => {
      rowHasError = true;
      errors.push({ row, column: col, message });
    };
    const who = values[cols.player.toLowerCase()]?.trim() ?? '';
    const player = /^\d+$/.test(who) ? byShirt.get(Number(who)) : byName.get(who.toLowerCase());
    if (!player) err(cols.player, `No player with shirt number or name "${who}" in ${squad.name}`);
    const read = (key: keyof typeof cols, convert: (n: number) => number, range: DomainRange, label: string): number | null => {
      const name = cols[key];
      if (!name) return null;
      const n = num(values[name.toLowerCase()]);
      if (n === 'bad') {
        err(name, `${label} is not a number`);
        return null;
      }
      if (n === null) return null;
      const v = convert(n);
      // The flight model's domain (KICK_DOMAIN), the same check as sync: a kick the fit cannot use is a row error.
      if (!inDomain(range, v)) {
        err(name, `${label} ${Math.round(v * 100) / 100} must be ${domainWords(range)}`);
        return null;
      }
      return v;
    };
    const speedMs = read('speed', (n) => speedToMs(n, mapping.units.speed), KICK_DOMAIN.measuredSpeedMs, 'Speed');
    const angleDeg = read('launchAngle', (n) => n, KICK_DOMAIN.launchAngleDeg, 'Launch angle');
    const spinRps = read('spin', (n) => spinToRps(n, mapping.units.spin), KICK_DOMAIN.measuredSpinRps, 'Spin');
    let carryM = read('carry', (n) => distanceToM(n, mapping.units.distance), KICK_DOMAIN.carryM, 'Carry');
    const lateralM = read('lateral', (n) => distanceToM(n, mapping.units.distance), KICK_DOMAIN.lateralM, 'Lateral');
    let recordedAt = new Date().toISOString();
    if (cols.time) {
      const t = parseLocalDateTime(values[cols.time.toLowerCase()] ?? '', clubTimeZone);
      if (t === null) err(cols.time, 'Time is not a date and time (e.g. 2026-11-30 18:05:10)');
      else recordedAt = t.toISOString();
    }
    if (!player || rowHasError) continue;
    let modelled = carryM;
    if (modelled === null && speedMs !== null) {
      // No carry from the device: fly the measured launch in still ISA air with the flight model.
      const flight = simulateKick({
        speed: speedMs,
        elevationDeg: angleDeg ?? DEFAULT_ELEVATION_DEG[mapping.technique],
        backspinRps: spinRps ?? 0,
        ball: ballOf(squad.ballSize),
      });
      modelled = flight.carryM;
    }
    if (carryM !== null) carryM = Math.round(carryM * 100) / 100;
    const key = [squad.id, player.id, cols.time ? recordedAt : `${hash}:${row}`, speedMs, angleDeg, spinRps, carryM, lateralM].join('|');
    rows.push({
      id: naturalKeyId(key),
      playerId: player.id,
      foot: player.dominantFoot,
      recordedAt,
      speedMs,
      angleDeg,
      spinRps,
      carryM,
      lateralM,
      outcome: outcomeOf(modelled ?? 0, lateralM ?? 0, mapping.targetDistanceM, mapping.targetRadiusM),
    });
  }
  const previous = db
    .select()
    .from(uploads)
    .where(
      and(
        eq(uploads.clubId, scope.user.clubId),
        eq(uploads.kind, 'measured_kicks'),
        eq(uploads.contentHash, hash),
        eq(uploads.status, 'committed'),
      ),
    )
    .get();
  const existing = (id: string) => cachedStatement(db.$client, 'SELECT 1 FROM kicks WHERE id = ?').get(id) !== undefined;
  if (previous) {
    return {
      dryRun,
      uploadId: previous.id,
      alreadyImported: true,
      rows: table.rows.length,
      errors: [],
      summary: JSON.parse(previous.summaryJson ?? '{}') as KicksSummary,
    };
  }
  if (dryRun) {
    const skipped = rows.filter((r) => existing(r.id)).length;
    return {
      dryRun,
      uploadId: null,
      alreadyImported: false,
      rows: table.rows.length,
      errors,
      summary: { kicksCreated: rows.length - skipped, kicksSkipped: skipped, sessionId: null },
    };
  }
  if (errors.length)
    throw new ImportInvalid(`The file has ${errors.length} problem${errors.length > 1 ? 's' : ''}; nothing was imported`, errors);
  const uploadId = randomUUID();
  // IMMEDIATE: wait for the write lock up front rather than fail mid-way when another connection commits first.
  const summary = db.transaction(
    (): KicksSummary =>
      // Change sequences handed out from memory, the counter written once: one counter update per kick was most of a big commit.
      withChangeSeqBlock(db, (): KicksSummary => {
        const fresh = rows.filter((r) => !existing(r.id));
        let sessionId: string | null = null;
        if (fresh.length) {
          sessionId = naturalKeyId(`session|${hash}`);
          const startedAt = fresh.map((r) => r.recordedAt).sort()[0]!;
          const user = scope.user.id;
          db.insert(trainingSessions)
            .values({
              id: sessionId,
              clubId: squad.clubId,
              squadId: squad.id,
              startedAt,
              ballSize: squad.ballSize,
              notes: `Imported from ${mapping.device ?? 'a measuring device'} (${file.name})`,
              recordedBy: user,
              deviceId: 'import',
              changeSeq: nextChangeSeq(db),
            })
            .run();
          const drillId = naturalKeyId(`drill|${hash}`);
          db.insert(drills)
            .values({
              id: drillId,
              clubId: squad.clubId,
              sessionId,
              technique: mapping.technique,
              targetDistanceM: mapping.targetDistanceM,
              targetRadiusM: mapping.targetRadiusM,
              label: `Measured ${mapping.technique}`,
              changeSeq: nextChangeSeq(db),
            })
            .run();
          const insert = cachedStatement(
            db.$client,
            `INSERT OR IGNORE INTO kicks (id, club_id, session_id, drill_id, player_id, technique, foot, backspin_step, sidespin_step, target_distance_m, target_radius_m,
           outcome, carry_m, lateral_m, measured_speed_ms, launch_angle_deg, measured_spin_rps, measured_source, recorded_at, recorded_by, device_id, change_seq)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, 0, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 'import', ?)`,
          );
          for (const r of fresh) {
            insert.run(
              r.id,
              squad.clubId,
              sessionId,
              drillId,
              r.playerId,
              mapping.technique,
              r.foot,
              r.spinRps === null ? 0 : nearestBackspinStep(r.spinRps),
              mapping.targetDistanceM,
              mapping.targetRadiusM,
              r.outcome,
              r.carryM,
              r.lateralM,
              r.speedMs,
              r.angleDeg,
              r.spinRps,
              // A device export is the only source of measured values through this import.
              r.speedMs === null && r.angleDeg === null && r.spinRps === null ? null : 'device',
              r.recordedAt,
              user,
              nextChangeSeq(db),
            );
          }
        }
        const s: KicksSummary = { kicksCreated: fresh.length, kicksSkipped: rows.length - fresh.length, sessionId };
        db.insert(uploads)
          .values({
            id: uploadId,
            clubId: squad.clubId,
            uploadedBy: scope.user.id,
            kind: 'measured_kicks',
            filename: file.name,
            sizeBytes: file.buffer.length,
            contentHash: hash,
            content: file.buffer.toString('utf8'),
            status: 'committed',
            committedAt: new Date().toISOString(),
            summaryJson: JSON.stringify(s),
          })
          .run();
        audit(db, { clubId: squad.clubId, userId: scope.user.id, action: 'import.kicks', entity: 'upload', entityId: uploadId, detail: s });
        return s;
      }),
    { behavior: 'immediate' },
  );
  return { dryRun, uploadId, alreadyImported: false, rows: table.rows.length, errors: [], summary };
}
