/**
 * Mapping between database rows and the synced `data` shape of each entity, so push and
 * pull speak exactly the contract of `shared/schemas/sync.ts`.
 */
import type { DrillData, KickData, SessionData, SyncEntity, SyncRow, VideoTrack } from '../../shared/schemas/sync';
import { drills, kicks, trainingSessions } from '../db/schema';

type SessionRow = typeof trainingSessions.$inferSelect;
type DrillRow = typeof drills.$inferSelect;
type KickRow = typeof kicks.$inferSelect;

/** The Drizzle table behind each synced entity. */
export const ENTITY_TABLES = { training_session: trainingSessions, drill: drills, kick: kicks } as const;

/** Order in which a batch is applied so parents exist before children, whatever the client sent. */
export const ENTITY_RANK: Record<SyncEntity, number> = { training_session: 0, drill: 1, kick: 2 };

function bookkeeping(row: { id: string; version: number; updatedAt: string; deletedAt: string | null }) {
  return { id: row.id, version: row.version, updatedAt: row.updatedAt, deletedAt: row.deletedAt };
}

/** A session row as synced data. */
export function sessionToSync(r: SessionRow): SyncRow {
  return {
    ...bookkeeping(r),
    squadId: r.squadId,
    startedAt: r.startedAt,
    endedAt: r.endedAt,
    temperatureC: r.temperatureC,
    altitudeM: r.altitudeM,
    relativeHumidityPct: r.relativeHumidityPct,
    pressureHpa: r.pressureHpa,
    windSpeedMs: r.windSpeedMs,
    windFromDeg: r.windFromDeg,
    ballSize: r.ballSize,
    conditionsSource: r.conditionsSourceJson ? (JSON.parse(r.conditionsSourceJson) as Record<string, string>) : null,
    groundId: r.groundId,
    conditionsObservedAt: r.conditionsObservedAt,
    notes: r.notes,
    recordedBy: r.recordedBy,
  };
}

/** A drill row as synced data. */
export function drillToSync(r: DrillRow): SyncRow {
  return {
    ...bookkeeping(r),
    sessionId: r.sessionId,
    technique: r.technique,
    targetDistanceM: r.targetDistanceM,
    targetRadiusM: r.targetRadiusM,
    lateralOffsetM: r.lateralOffsetM,
    backspinStep: r.backspinStep,
    sidespinStep: r.sidespinStep,
    label: r.label,
  };
}

/** A kick row as synced data. */
export function kickToSync(r: KickRow): SyncRow {
  return {
    ...bookkeeping(r),
    sessionId: r.sessionId,
    drillId: r.drillId,
    playerId: r.playerId,
    technique: r.technique,
    foot: r.foot,
    backspinStep: r.backspinStep,
    sidespinStep: r.sidespinStep,
    targetDistanceM: r.targetDistanceM,
    targetRadiusM: r.targetRadiusM,
    outcome: r.outcome,
    carryM: r.carryM,
    stillAirCarryM: r.stillAirCarryM,
    lateralM: r.lateralM,
    measuredSpeedMs: r.measuredSpeedMs,
    launchAngleDeg: r.launchAngleDeg,
    measuredSpinRps: r.measuredSpinRps,
    hangTimeS: r.hangTimeS,
    measuredSource: r.measuredSource,
    videoTrack: r.videoTrackJson ? (JSON.parse(r.videoTrackJson) as VideoTrack) : null,
    recordedAt: r.recordedAt,
    recordedBy: r.recordedBy,
  };
}

/** Column values for a session upsert. */
export function sessionColumns(d: SessionData) {
  return {
    squadId: d.squadId,
    startedAt: d.startedAt,
    endedAt: d.endedAt ?? null,
    temperatureC: d.temperatureC ?? null,
    altitudeM: d.altitudeM ?? null,
    relativeHumidityPct: d.relativeHumidityPct ?? null,
    pressureHpa: d.pressureHpa ?? null,
    windSpeedMs: d.windSpeedMs ?? null,
    windFromDeg: d.windFromDeg ?? null,
    ballSize: d.ballSize,
    conditionsSourceJson: d.conditionsSource ? JSON.stringify(d.conditionsSource) : null,
    // Undefined (an older client that does not know the field) leaves the stored value alone.
    groundId: d.groundId,
    conditionsObservedAt: d.conditionsObservedAt,
    notes: d.notes ?? null,
  };
}

/** Column values for a drill upsert. */
export function drillColumns(d: DrillData) {
  return {
    sessionId: d.sessionId,
    technique: d.technique,
    targetDistanceM: d.targetDistanceM,
    targetRadiusM: d.targetRadiusM,
    lateralOffsetM: d.lateralOffsetM ?? 0,
    backspinStep: d.backspinStep ?? 0,
    sidespinStep: d.sidespinStep ?? 0,
    label: d.label ?? null,
  };
}

/** Column values for a kick upsert. */
export function kickColumns(d: KickData) {
  return {
    sessionId: d.sessionId,
    drillId: d.drillId ?? null,
    playerId: d.playerId,
    technique: d.technique,
    foot: d.foot,
    backspinStep: d.backspinStep,
    sidespinStep: d.sidespinStep,
    targetDistanceM: d.targetDistanceM,
    targetRadiusM: d.targetRadiusM,
    outcome: d.outcome,
    carryM: d.carryM ?? null,
    lateralM: d.lateralM ?? null,
    measuredSpeedMs: d.measuredSpeedMs ?? null,
    launchAngleDeg: d.launchAngleDeg ?? null,
    measuredSpinRps: d.measuredSpinRps ?? null,
    hangTimeS: d.hangTimeS ?? null,
    // Undefined (an older client that does not know the fields) keeps the stored measurement's source and
    // track (`keepMeasurement`); null clears them.
    measuredSource: d.measuredSource ?? null,
    videoTrackJson: d.videoTrack ? JSON.stringify(d.videoTrack) : null,
    keepMeasurement: d.measuredSource === undefined && d.videoTrack === undefined ? 1 : 0,
    recordedAt: d.recordedAt,
  };
}
