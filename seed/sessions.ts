/**
 * Generates one training session of the demo scenario — its conditions, two or three drills
 * and every logged repetition — as rows ready to insert. Each session draws from its own
 * labelled random stream, so the same squad, week and slot always give the same session.
 */
import type { drills, kicks, trainingSessions } from '../api/db/schema';
import { conditionsOf } from '../api/analysis/flight-inputs';
import { dayOfYearUtc, londonWallClockToUtc } from './calendar';
import {
  classifyLanding,
  flyRepetition,
  freeKickOutcome,
  measureLaunch,
  roundToHalf,
  seenLanding,
  spinStepsByEye,
  WALL_HEIGHT_M,
  type Intentions,
  type Outcome,
} from './kick-physics';
import { Prng } from './prng';
import type { SquadSpec } from './roster';
import type { PlayerTruth, Technique } from './truth';

/** A training-session row as inserted. */
export type SessionRow = typeof trainingSessions.$inferInsert;
/** A drill row as inserted. */
export type DrillRow = typeof drills.$inferInsert;
/** A kick row as inserted. */
export type KickRow = typeof kicks.$inferInsert;

/** A squad player as the generator needs them. */
export interface SessionPlayer {
  id: string;
  dominantFoot: 'left' | 'right';
  truth: PlayerTruth;
  extraWork: boolean;
  /** One of the first team's free-kick takers: a few extra repetitions in curled free-kick drills. */
  freeKickTaker: boolean;
}

/** Everything one session depends on. */
export interface SessionInput {
  clubId: string;
  groundId: string;
  groundAltitudeM: number;
  squad: SquadSpec & { id: string };
  players: readonly SessionPlayer[];
  /** Staff who may record this squad's sessions, with device ids and relative weights. */
  recorders: readonly { userId: string; deviceId: string; weight: number }[];
  weekIndex: number;
  slotIndex: number;
  /** 00:00 UTC of the session's calendar day. */
  dayStartUtc: Date;
  periodStartMs: number;
  periodLengthMs: number;
  /** Hands out the next change_seq (must be called inside the seeding transaction). */
  nextSeq: () => number;
  /** The players' intention tables, shared across sessions (built on first use). */
  intentions: Intentions;
}

/** The rows one session produces. */
export interface GeneratedSession {
  session: SessionRow;
  drills: DrillRow[];
  kicks: KickRow[];
}

/** Sensible drill target distances (metres) per squad and technique (common coaching practice). */
export const TARGET_RANGE_M: Record<SquadSpec['key'], Record<Technique, [number, number]>> = {
  u14: { driven: [18, 28], lofted: [25, 38], chipped: [12, 18], curled: [16, 24] },
  u16: { driven: [20, 32], lofted: [28, 44], chipped: [12, 20], curled: [18, 26] },
  first: { driven: [22, 35], lofted: [30, 50], chipped: [14, 22], curled: [18, 28] },
};

const WIND_DIRECTIONS_DEG = [0, 45, 90, 135, 180, 225, 270, 315];
const WIND_DIRECTION_WEIGHTS = [3, 2, 2, 1, 2, 1, 2, 2];

const SESSION_NOTES = [
  'Pitch 2, heavy underfoot after rain.',
  'Gusty towards the end; targets moved in for the last drill.',
  'Short session: fixture on Saturday.',
  'Floodlights on from the second drill.',
  'New flat cones for the target zones.',
];

const DRILL_LABELS: Record<Technique, string[]> = {
  driven: ['Driven pass into the channel', 'Driven ball to the far post', 'Low driven switch'],
  lofted: ['Lofted switch of play', 'Lofted ball over the back line', 'Long diagonal to the wide player'],
  chipped: ['Chip over the cone line', 'Chipped pass into the box', 'Delicate chip to the runner'],
  curled: ['Curled cross to the penalty spot', 'Inswinging corner delivery', 'Curled ball round the mannequin'],
};
const SET_PIECE_LABELS: Partial<Record<Technique, string>> = {
  curled: 'Free kick: curl over the wall',
  driven: 'Free kick: driven past the wall',
};

/** Techniques each squad practises, with relative weights (the first team does more set pieces). */
const TECHNIQUE_WEIGHTS: Record<SquadSpec['key'], Record<Technique, number>> = {
  u14: { driven: 4, lofted: 3, chipped: 2, curled: 2 },
  u16: { driven: 3, lofted: 3, chipped: 2, curled: 3 },
  first: { driven: 3, lofted: 3, chipped: 2, curled: 4 },
};

const iso = (ms: number): string => new Date(Math.round(ms)).toISOString();
const clamp = (x: number, lo: number, hi: number): number => Math.max(lo, Math.min(hi, x));

/** Picks `n` distinct techniques by weight. */
function pickTechniques(prng: Prng, weights: Record<Technique, number>, n: number): Technique[] {
  const pool = (Object.keys(weights) as Technique[]).slice();
  const chosen: Technique[] = [];
  while (chosen.length < n && pool.length > 0) {
    const t = prng.weighted(
      pool,
      pool.map((k) => weights[k]),
    );
    chosen.push(t);
    pool.splice(pool.indexOf(t), 1);
  }
  return chosen;
}

/** Default spin steps a coach would set for the technique. */
function drillSpin(prng: Prng, technique: Technique): { backspinStep: number; sidespinStep: number } {
  switch (technique) {
    case 'lofted':
      return { backspinStep: prng.int(1, 2), sidespinStep: 0 };
    case 'chipped':
      return { backspinStep: prng.weighted([1, 2], [1, 2]), sidespinStep: 0 };
    case 'driven':
      return { backspinStep: prng.pick([1, 0]), sidespinStep: 0 };
    case 'curled':
      return { backspinStep: 0, sidespinStep: prng.pick([-2, -1, 1, 2]) };
  }
}

/** Session conditions: seasonal temperature, wind, humidity (all as a coach would enter them). */
function drawConditions(prng: Prng, startedAt: Date, squad: SquadSpec) {
  const doy = dayOfYearUtc(startedAt);
  const seasonalC = 11 - 6.5 * Math.cos((2 * Math.PI * (doy - 25)) / 365.25);
  const timeOfDayC = squad.key === 'first' ? 0.5 : -1; // morning vs. evening session
  const temperatureC = roundToHalf(clamp(seasonalC + timeOfDayC + prng.normal(0, 1.5), 4, 18));
  const windSpeedMs = roundToHalf(clamp(Math.abs(prng.normal(0, 3.2)) + 0.3, 0, 9));
  const windFromDeg = prng.weighted(WIND_DIRECTIONS_DEG, WIND_DIRECTION_WEIGHTS);
  const relativeHumidityPct = Math.round(clamp(80 - 1.2 * (temperatureC - 10) + prng.normal(0, 6), 55, 95));
  const fromWeather = prng.chance(0.3);
  const conditionsSource = {
    temperatureC: fromWeather ? 'weather' : 'coach',
    relativeHumidityPct: 'weather',
    windSpeedMs: fromWeather ? 'weather' : 'coach',
    windFromDeg: 'coach',
    altitudeM: 'ground',
    ballSize: 'default',
  };
  return { temperatureC, windSpeedMs, windFromDeg, relativeHumidityPct, conditionsSource };
}

/** Generates one session with its drills and kicks. */
export function generateSession(input: SessionInput): GeneratedSession {
  const { squad } = input;
  const prng = Prng.fromLabel(`session:${squad.key}:${input.weekIndex}:${input.slotIndex}`);
  const slot = squad.sessionSlots[input.slotIndex];
  if (!slot) throw new Error(`Squad ${squad.key} has no session slot ${input.slotIndex}`);
  const startedAt = londonWallClockToUtc(input.dayStartUtc, slot.hour, slot.minute);
  const startMs = startedAt.getTime() + prng.int(-3, 6) * 60_000; // coaches rarely start on the dot
  const endMs = startMs + slot.durationMin * 60_000;
  const progressAt = (ms: number): number => clamp((ms - input.periodStartMs) / input.periodLengthMs, 0, 1);
  const recorder = prng.weighted(
    input.recorders,
    input.recorders.map((r) => r.weight),
  );
  const conditions = drawConditions(prng, startedAt, squad);

  const sessionId = prng.uuid();
  const session: SessionRow = {
    id: sessionId,
    clubId: input.clubId,
    squadId: squad.id,
    groundId: input.groundId,
    startedAt: iso(startMs),
    endedAt: iso(endMs),
    temperatureC: conditions.temperatureC,
    altitudeM: input.groundAltitudeM,
    relativeHumidityPct: conditions.relativeHumidityPct,
    pressureHpa: null,
    windSpeedMs: conditions.windSpeedMs,
    windFromDeg: conditions.windFromDeg,
    ballSize: squad.ballSize,
    conditionsSourceJson: JSON.stringify(conditions.conditionsSource),
    notes: prng.chance(0.2) ? prng.pick(SESSION_NOTES) : null,
    recordedBy: recorder.userId,
    deviceId: recorder.deviceId,
    createdAt: iso(startMs),
    updatedAt: iso(startMs),
    deletedAt: null,
    version: 1,
    changeSeq: input.nextSeq(),
  };

  // Attendance: most of the squad; the players who do extra work always turn up.
  let present = input.players.filter((pl) => pl.extraWork || prng.chance(0.86));
  if (present.length < 11) present = input.players.slice();
  const extraToday = new Set(present.filter((pl) => pl.extraWork && prng.chance(0.22)).map((pl) => pl.id));

  const drillCount = prng.chance(0.55) ? 2 : 3;
  const techniques = pickTechniques(prng, TECHNIQUE_WEIGHTS[squad.key], drillCount);
  const warmUpMs = 12 * 60_000;
  const drillSlotMs = (endMs - startMs - warmUpMs - 5 * 60_000) / drillCount;
  const drillRows: DrillRow[] = [];
  const kickRows: KickRow[] = [];

  techniques.forEach((technique, drillIndex) => {
    const drillStartMs = startMs + warmUpMs + drillIndex * drillSlotMs;
    const [lo, hi] = TARGET_RANGE_M[squad.key][technique];
    const targetDistanceM = Math.round(prng.uniform(lo, hi) * (1 + 0.05 * progressAt(drillStartMs)));
    const targetRadiusM = clamp(roundToHalf(0.09 * targetDistanceM + prng.uniform(-0.5, 0.5)), 2, 4);
    const spin = drillSpin(prng, technique);
    const setPiece = (technique === 'curled' && prng.chance(0.45)) || (technique === 'driven' && prng.chance(0.25));
    const drillId = prng.uuid();
    const drill: DrillRow = {
      id: drillId,
      clubId: input.clubId,
      sessionId,
      technique,
      targetDistanceM,
      targetRadiusM,
      lateralOffsetM: 0,
      backspinStep: spin.backspinStep,
      sidespinStep: spin.sidespinStep,
      label: (setPiece ? SET_PIECE_LABELS[technique] : undefined) ?? prng.pick(DRILL_LABELS[technique]),
      createdAt: iso(drillStartMs),
      updatedAt: iso(drillStartMs),
      deletedAt: null,
      version: 1,
      changeSeq: input.nextSeq(),
    };
    drillRows.push(drill);

    // Who kicks in this drill, and how many repetitions each.
    const reps = new Map<SessionPlayer, number>();
    for (const pl of present) {
      if (extraToday.has(pl.id)) reps.set(pl, Math.ceil(41 / drillCount) + prng.int(0, 4));
      else if (prng.chance(drillCount === 3 ? 0.8 : 0.92)) reps.set(pl, drillCount === 2 ? prng.int(5, 11) : prng.int(5, 8));
    }
    const order: SessionPlayer[] = [];
    // Free-kick takers stay on for a few more curled free kicks (drawn aside, so the session's stream is unchanged).
    if (setPiece && technique === 'curled') {
      const extra = Prng.fromLabel(`free-kick-extra:${drillId}`);
      for (const [pl, n] of reps) if (pl.freeKickTaker) reps.set(pl, n + extra.int(3, 5));
    }
    const maxReps = Math.max(0, ...reps.values());
    for (let r = 0; r < maxReps; r++) for (const [pl, n] of reps) if (r < n) order.push(pl);
    const spacingMs = (drillSlotMs * 0.9) / Math.max(1, order.length);

    // The repetitions themselves come from the drill's own stream, so the session's structure above
    // (drills, targets, who kicks how often) never depends on how the balls flew.
    const flight = Prng.fromLabel(`flight:${drillId}`);
    const conditionsForFit = conditionsOf({
      temperatureC: conditions.temperatureC,
      altitudeM: input.groundAltitudeM,
      relativeHumidityPct: conditions.relativeHumidityPct,
      pressureHpa: null,
      windSpeedMs: conditions.windSpeedMs,
      windFromDeg: conditions.windFromDeg,
      ballSize: squad.ballSize,
      conditionsSourceJson: session.conditionsSourceJson,
    });
    order.forEach((pl, i) => {
      const recordedMs = drillStartMs + (i + 0.5) * spacingMs + prng.uniform(-2000, 2000);
      // Curled drills are practised on the stronger foot: the weaker foot's inside curl would bend the other way.
      const weakFoot = prng.chance(0.08) && technique !== 'curled';
      const kickId = prng.uuid();
      const foot = weakFoot ? (pl.dominantFoot === 'left' ? 'right' : 'left') : pl.dominantFoot;
      const rep = flyRepetition(flight, input.intentions, {
        key: `${pl.id}:${technique}`,
        truth: pl.truth.techniques[technique],
        progress: progressAt(recordedMs),
        weakFoot,
        targetDistanceM,
        ballSize: squad.ballSize,
        conditions: conditionsForFit,
        freeKick: setPiece,
      });
      const steps = spinStepsByEye(flight, rep.launch);
      // The coach's call is made on the landing spot as paced out (0.5 m resolution).
      const seen = seenLanding(rep);
      let outcome: Outcome = classifyLanding(seen, targetDistanceM, targetRadiusM);
      if (setPiece) outcome = freeKickOutcome(rep, technique, WALL_HEIGHT_M[squad.key]) ?? outcome;
      const logLanding = outcome !== 'blocked' && outcome !== 'over' && flight.chance(0.35);
      const measured = squad.key === 'first' && flight.chance(0.1) ? measureLaunch(flight, rep.launch) : null;
      kickRows.push({
        id: kickId,
        clubId: input.clubId,
        sessionId,
        drillId,
        playerId: pl.id,
        technique,
        foot,
        backspinStep: steps.backspinStep,
        sidespinStep: steps.sidespinStep,
        targetDistanceM,
        targetRadiusM,
        outcome,
        carryM: logLanding ? seen.carryM : null,
        lateralM: logLanding ? seen.lateralM : null,
        measuredSpeedMs: measured?.speedMs ?? null,
        launchAngleDeg: measured?.launchAngleDeg ?? null,
        measuredSpinRps: measured?.spinRps ?? null,
        recordedAt: iso(recordedMs),
        recordedBy: recorder.userId,
        deviceId: recorder.deviceId,
        createdAt: iso(recordedMs),
        updatedAt: iso(recordedMs),
        deletedAt: null,
        version: 1,
        changeSeq: input.nextSeq(),
      });
    });
  });

  return { session, drills: drillRows, kicks: kickRows };
}
