/**
 * The demo academy's hidden truth: how each Kestrel Vale player really kicks each technique. The
 * repetitions the demo logs are flown from these values through the flight model (`kick-physics.ts`),
 * so fitting the logs should give them back — the recovery specs (`spec/recovery/recovery.spec.ts`) check
 * that. The truth lives here for the generator and the specs only: the API never serves it and it never
 * reaches the database.
 *
 * The truth speaks the profile model's language (`shared/flight/aimed-speed.ts`): a player strikes the
 * speed their usual ball needs to carry the target in standard conditions (still air, ISA sea level,
 * the same ball), smoothly capped by their ceiling, times a log-normal error; elevation, spin and aim vary
 * kick to kick around the player's own means. Values are squad norms scaled by one talent factor, with
 * per-technique individuality; ceilings follow maximal instep kicks of 26–35 m/s for adults (Andersen &
 * Dörge 2011, Scand. J. Med. Sci. Sports 21:79) and lower for youth on smaller balls (common practice).
 */
import { TECHNIQUES, type Technique } from '../shared/vocabulary';
import { Prng } from './prng';
import { PLAYERS, type ProgressProfile, type SquadKey } from './roster';

export { TECHNIQUES, type Technique };

/** One player's true kicking of one technique at one moment (dominant foot unless asked otherwise). */
export interface TrueKicking {
  /** μ: mean of ln(launch speed / intended speed); negative = tends to under-hit. */
  offsetLogMean: number;
  /** σ: spread of ln(launch speed / intended speed). */
  offsetLogSd: number;
  /** Speed ceiling, m/s: targets needing more are struck at about this speed. */
  ceilingMs: number;
  elevationDeg: number;
  sdElevationDeg: number;
  /** Backspin, rev/s (+ = backspin). */
  backspinRps: number;
  sdBackspinRps: number;
  /** Sidespin, rev/s (+ curls left); for curled balls its sign is the kicking foot's natural curl. */
  sidespinRps: number;
  sdSidespinRps: number;
  /** Mean aim error, degrees, + = left. */
  aimBiasDeg: number;
  sdAimDeg: number;
}

/** A player's truth for one technique: week one, and the changes by the end of week eight. */
export interface TrueTechnique {
  start: TrueKicking;
  /** Share of the speed bias shed by week eight, half of it of the speed and aim spreads, 40 % of it of the elevation and spin spreads (negative: regresses). */
  improvement: number;
  /** Fractional change of the ceiling by week eight. */
  ceilingGain: number;
}

/** A player's hidden truth, all techniques. */
export interface PlayerTruth {
  playerKey: string;
  squad: SquadKey;
  dominantFoot: 'left' | 'right';
  techniques: Record<Technique, TrueTechnique>;
}

/**
 * First-team free-kick takers, best first by design: distinct curled truths (spread, elevation, aim)
 * so that their on-target shares from a free kick differ clearly and the planner has a ranking to find.
 * They also do a few extra curled repetitions in free-kick drills.
 */
export const FREE_KICK_TAKERS: readonly string[] = [
  'dev-kapadia',
  'felix-ravenscroft',
  'oscar-lindmark',
  'idris-benhaddou',
  'gareth-pellow',
];

/** How each taker's curled truth departs from the squad norm: multipliers of speed and aim spread, elevation added. */
const TAKER_CURL: Record<string, { spread: number; elevationDeg: number; ceiling: number }> = {
  'dev-kapadia': { spread: 0.6, elevationDeg: 4, ceiling: 1.06 },
  'felix-ravenscroft': { spread: 0.78, elevationDeg: 3, ceiling: 1.03 },
  'oscar-lindmark': { spread: 0.95, elevationDeg: 2, ceiling: 1 },
  'idris-benhaddou': { spread: 1.15, elevationDeg: 0.5, ceiling: 0.97 },
  'gareth-pellow': { spread: 1.4, elevationDeg: -1, ceiling: 0.94 },
};

/** Squad norms per technique: speed ceiling (m/s), speed spread σ, aim spread (°). */
const SQUAD_NORMS: Record<SquadKey, { ceilingMs: Record<Technique, number>; offsetLogSd: number; sdAimDeg: number; spinScale: number }> = {
  // Adults: maximal instep kicks 26–35 m/s (Andersen & Dörge 2011); lofted, curled and chipped balls below that (common practice).
  first: { ceilingMs: { driven: 30, lofted: 29, curled: 27, chipped: 21 }, offsetLogSd: 0.04, sdAimDeg: 1.5, spinScale: 1 },
  // Mid-teens on a size-5 ball: about 90 % of adult speeds (common practice).
  u16: { ceilingMs: { driven: 27, lofted: 26, curled: 24.5, chipped: 19 }, offsetLogSd: 0.05, sdAimDeg: 1.9, spinScale: 0.9 },
  // Early teens on a size-4 ball: about 80 % (common practice).
  u14: { ceilingMs: { driven: 24, lofted: 23.5, curled: 22, chipped: 17 }, offsetLogSd: 0.062, sdAimDeg: 2.4, spinScale: 0.8 },
};

/**
 * Technique norms: mean elevation (the technique defaults of shared/flight), its kick-to-kick spread, and the
 * spin (backspin for driven, lofted and chipped balls; sidespin magnitude for curled ones), all common
 * practice. Free kicks measured at 8–17 rev/s (Barber & Carré 2010, Sports Engineering 13:47) bound the curl.
 */
const TECHNIQUE_NORMS: Record<Technique, { elevationDeg: number; sdElevationDeg: number; spinRps: number; sdSpinRps: number }> = {
  driven: { elevationDeg: 12, sdElevationDeg: 1.2, spinRps: 1.5, sdSpinRps: 1.2 },
  lofted: { elevationDeg: 32, sdElevationDeg: 2.2, spinRps: 5, sdSpinRps: 1.3 },
  chipped: { elevationDeg: 48, sdElevationDeg: 3, spinRps: 7, sdSpinRps: 1.5 },
  curled: { elevationDeg: 18, sdElevationDeg: 1.4, spinRps: 7, sdSpinRps: 1.2 },
};

/** Youth vary their launch more (common practice). */
const SQUAD_ELEVATION_SPREAD: Record<SquadKey, number> = { first: 1, u16: 1.15, u14: 1.3 };

/** The weaker foot: wider speed and aim, a lower ceiling (common practice). */
const WEAK_FOOT = { spread: 1.35, ceiling: 0.9, bias: -0.03 };

/** Draws one player's truth: squad norms, one talent factor, per-technique individuality, their progress profile. */
export function drawPlayerTruth(
  prng: Prng,
  playerKey: string,
  squad: SquadKey,
  progress: ProgressProfile,
  dominantFoot: 'left' | 'right',
): PlayerTruth {
  const ability = Math.max(-2, Math.min(2, prng.normal()));
  const norms = SQUAD_NORMS[squad];
  const youth = squad !== 'first';
  const improvementBase =
    progress === 'strong'
      ? prng.uniform(0.7, 0.8)
      : progress === 'regressing'
        ? prng.uniform(-0.6, -0.45)
        : youth
          ? prng.uniform(0.3, 0.45)
          : prng.uniform(0.2, 0.35);
  const ceilingGainBase =
    progress === 'strong' ? prng.uniform(0.05, 0.07) : progress === 'regressing' ? -0.03 : youth ? prng.uniform(0.01, 0.03) : 0.005;
  // A right-footer's inside-of-the-foot curl bends to the left (+), a left-footer's to the right.
  const curlSign = dominantFoot === 'right' ? 1 : -1;
  const techniques = {} as Record<Technique, TrueTechnique>;
  for (const technique of TECHNIQUES) {
    const t = TECHNIQUE_NORMS[technique];
    const taker = technique === 'curled' ? TAKER_CURL[playerKey] : undefined;
    const spread = (1 - 0.1 * ability) * prng.uniform(0.9, 1.1) * (taker?.spread ?? 1);
    const spinRps = t.spinRps * norms.spinScale * prng.uniform(0.85, 1.15);
    const elevationDeg = t.elevationDeg + prng.normal(0, 1) + (taker?.elevationDeg ?? 0);
    const start: TrueKicking = {
      offsetLogMean: prng.normal(-0.01, 0.015),
      offsetLogSd: norms.offsetLogSd * spread,
      ceilingMs: norms.ceilingMs[technique] * (1 + 0.04 * ability) * prng.uniform(0.96, 1.04) * (taker?.ceiling ?? 1),
      elevationDeg,
      sdElevationDeg: t.sdElevationDeg * SQUAD_ELEVATION_SPREAD[squad] * (taker ? Math.sqrt(taker.spread) : 1),
      backspinRps: technique === 'curled' ? prng.normal(1, 0.5) : spinRps,
      sdBackspinRps: technique === 'curled' ? 0.8 : t.sdSpinRps,
      sidespinRps: technique === 'curled' ? curlSign * spinRps : 0,
      sdSidespinRps: technique === 'curled' ? t.sdSpinRps : 0.5,
      aimBiasDeg: prng.normal(0, 0.5),
      sdAimDeg: norms.sdAimDeg * spread,
    };
    techniques[technique] = {
      start,
      improvement: improvementBase + prng.normal(0, 0.03),
      ceilingGain: ceilingGainBase + prng.normal(0, 0.005),
    };
  }
  return { playerKey, squad, dominantFoot, techniques };
}

/** The truth at `progress` (0 = start of week one, 1 = end of week eight), with the dominant or the weaker foot. */
export function kickingAt(truth: TrueTechnique, progress: number, weakFoot: boolean): TrueKicking {
  const s = truth.start;
  const learned = truth.improvement * progress;
  const foot = weakFoot ? WEAK_FOOT : { spread: 1, ceiling: 1, bias: 0 };
  return {
    ...s,
    offsetLogMean: s.offsetLogMean * (1 - learned) + foot.bias,
    offsetLogSd: s.offsetLogSd * (1 - 0.5 * learned) * foot.spread,
    ceilingMs: s.ceilingMs * (1 + truth.ceilingGain * progress) * foot.ceiling,
    sdElevationDeg: s.sdElevationDeg * (1 - 0.4 * learned),
    sdBackspinRps: s.sdBackspinRps * (1 - 0.4 * learned),
    sdSidespinRps: s.sdSidespinRps * (1 - 0.4 * learned),
    sdAimDeg: s.sdAimDeg * (1 - 0.5 * learned) * foot.spread,
    // The weaker foot's natural curl bends the other way.
    sidespinRps: weakFoot ? -s.sidespinRps : s.sidespinRps,
    aimBiasDeg: s.aimBiasDeg * (1 - learned),
  };
}

/** Whether a key names one of the demo players. */
function rosterEntry(playerKey: string) {
  const entry = PLAYERS.find((p) => p.key === playerKey);
  if (!entry) throw new Error(`No demo player ${playerKey}`);
  return entry;
}

/** Random stream of a player's truth (independent of the roster's other draws). */
export function truthStream(playerKey: string): Prng {
  return Prng.fromLabel(`truth:${playerKey}`);
}

/** The hidden truth of one demo player, as the scenario draws it (`dominantFoot` from the roster's draw). */
export function demoPlayerTruth(playerKey: string, dominantFoot: 'left' | 'right'): PlayerTruth {
  const entry = rosterEntry(playerKey);
  return drawPlayerTruth(truthStream(playerKey), playerKey, entry.squad, entry.progress, dominantFoot);
}
