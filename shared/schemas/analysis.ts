/**
 * Response shapes of the analysis endpoints (Player file, Squad week, planner), shared so the
 * client and the server cannot drift apart: one zod schema each, its TypeScript type inferred from it,
 * and the OpenAPI document references the same schemas by their `id` (the API specs parse real answers
 * with them). A launch profile keeps its one definition in the flight model (`KickProfile`); here it is
 * checked only as an object.
 */
import * as z from 'zod';
import { PROFILE_WARNINGS, type KickProfile, type ProfileWarning } from '../flight/profile-types';
import { FEET, MEASURED_SOURCES, OUTCOMES, TECHNIQUES } from '../vocabulary';

const technique = z.enum(TECHNIQUES);
const outcome = z.enum(OUTCOMES);
const count = z.number().int().min(0);
const share = z.number().min(0).max(1);
const metres = z.number();
const optionalMetres = z.number().nullable();

/** Which carry the figures use: as logged, or normalised to still air at ISA sea level, 15 °C. */
export const carryBasisSchema = z.enum(['logged', 'still-air']);
export type CarryBasis = z.infer<typeof carryBasisSchema>;

/** One week × technique row of a player's progress (`GET /api/players/:id/progress`). */
export const progressWeekSchema = z
  .object({
    weekStart: z.string().describe('Monday of the ISO week, YYYY-MM-DD'),
    technique,
    reps: count,
    hitRate: share.describe('Share of repetitions logged on_target'),
    outcomeShare: z.record(outcome, share).describe('Share of each outcome, every outcome present'),
    carryCount: count.describe('How many repetitions had a carry on the chosen basis'),
    medianCarryM: optionalMetres,
    carryP25M: optionalMetres.describe('Nearest-rank lower quartile of carry, metres'),
    carryP75M: optionalMetres.describe('Nearest-rank upper quartile of carry, metres'),
    carrySdM: optionalMetres.describe('Population standard deviation of carry, metres'),
  })
  .meta({ id: 'ProgressWeek' });
export type ProgressWeek = z.infer<typeof progressWeekSchema>;

/** `GET /api/players/:id/progress`. */
export const progressResponseSchema = z
  .object({ playerId: z.string(), carryBasis: carryBasisSchema, weeks: z.array(progressWeekSchema) })
  .meta({ id: 'Progress' });
export type ProgressResponse = z.infer<typeof progressResponseSchema>;

/** One kick in a player's recent-kicks table (`GET /api/players/:id/kicks`). */
export const playerKickSchema = z
  .object({
    id: z.string(),
    sessionId: z.string(),
    recordedAt: z.string(),
    technique,
    foot: z.enum(FEET),
    backspinStep: z.number().int(),
    sidespinStep: z.number().int(),
    targetDistanceM: metres,
    targetRadiusM: metres,
    outcome,
    carryM: optionalMetres,
    stillAirCarryM: optionalMetres.describe('The logged carry normalised to still air at ISA sea level, 15 °C (null without a carry)'),
    lateralM: optionalMetres,
    measuredSpeedMs: z.number().nullable(),
    launchAngleDeg: z.number().nullable(),
    measuredSpinRps: z.number().nullable(),
    measuredSource: z
      .enum(MEASURED_SOURCES)
      .nullable()
      .describe("Where the measured values came from ('device' import or phone 'video'); null when none were measured"),
    hangTimeS: z.number().nullable().describe('Pitchside stopwatch reading (contact to first bounce), s, uncorrected'),
  })
  .meta({ id: 'PlayerKick' });
export type PlayerKick = z.infer<typeof playerKickSchema>;

/** `GET /api/players/:id/kicks`. */
export const playerKicksResponseSchema = z
  .object({ playerId: z.string(), total: count, kicks: z.array(playerKickSchema) })
  .meta({ id: 'PlayerKicks' });
export type PlayerKicksResponse = z.infer<typeof playerKicksResponseSchema>;

/** A fitted launch profile (its fields are the flight model's `KickProfile`). */
const kickProfileSchema = z
  .custom<KickProfile>((v) => typeof v === 'object' && v !== null && !Array.isArray(v))
  .meta({ id: 'KickProfile', description: "A player's fitted launch distribution for one technique (the flight model's KickProfile)" });

/** A cached launch profile of one player and technique. */
export const profileEntrySchema = z
  .object({
    playerId: z.string(),
    technique,
    profile: kickProfileSchema.nullable().describe('Null while it has not been computed yet (pending) or when there are no repetitions'),
    repetitions: count,
    reliableReachM: optionalMetres.describe('Reliable reach at standard conditions for reachRadiusM (null: no distance reaches 60 %)'),
    reachRadiusM: metres,
    computedAt: z.string().nullable(),
    pending: z.boolean().describe('Whether newer kicks exist than the cached profile used (a background job is refreshing it)'),
    skippedKicks: count.describe('Stored kicks the fit left out because the flight model cannot use them'),
  })
  .meta({ id: 'ProfileEntry' });
export type ProfileEntry = z.infer<typeof profileEntrySchema>;

/** `GET /api/players/:id/profile?technique=`. */
export type ProfileResponse = ProfileEntry;

/** `GET /api/squads/:id/profiles?technique=`: every player's profile for the planner ranking. */
export const squadProfilesResponseSchema = z
  .object({
    squadId: z.string(),
    technique,
    players: z.array(profileEntrySchema.extend({ displayName: z.string(), shirtNumber: z.number().int().nullable() })),
  })
  .meta({ id: 'SquadProfiles' });
export type SquadProfilesResponse = z.infer<typeof squadProfilesResponseSchema>;

/**
 * Predicted against observed hits of one player and technique over a week, out of sample: predicted by a
 * profile fitted on the repetitions before the week, each repetition in its own session's conditions.
 */
export const calibrationPointSchema = z
  .object({
    technique,
    reps: count,
    hits: count.describe('Repetitions logged on target'),
    predictedHits: z.number().min(0).describe("Sum of the repetitions' predicted hit probabilities (expected hits)"),
    predictedHitRate: share,
    observedHitRate: share,
  })
  .meta({ id: 'CalibrationPoint' });
export type CalibrationPoint = z.infer<typeof calibrationPointSchema>;

/** One player's line in Squad week (`GET /api/squads/:id/week`). */
export const squadWeekPlayerSchema = z
  .object({
    playerId: z.string(),
    displayName: z.string(),
    shirtNumber: z.number().int().nullable(),
    reps: count,
    hitRate: share.nullable(),
    previousReps: count,
    previousHitRate: share.nullable(),
    hitRateChange: z.number().nullable().describe("This week's hit rate minus last week's (null when either week has no repetitions)"),
    bestTechnique: technique.nullable().describe('Technique with the best hit rate this week among those with enough repetitions'),
    byTechnique: z.array(z.object({ technique, reps: count, hitRate: share, medianCarryM: optionalMetres })),
    reach: z
      .array(
        z.object({
          technique,
          reliableReachM: optionalMetres,
          reachRadiusM: metres,
          repetitions: count,
          pending: z.boolean(),
          warnings: z.array(z.enum(PROFILE_WARNINGS as readonly [ProfileWarning, ...ProfileWarning[]])),
        }),
      )
      .describe('Current reliable reach per technique (from the cached profile)'),
    calibration: z.array(calibrationPointSchema),
    calibrationPending: count.describe('Techniques whose held-out calibration the server is still computing'),
    loadFlags: z
      .array(z.object({ sessionId: z.string(), startedAt: z.string(), reps: count, limit: count }))
      .describe("Sessions this week in which the player passed the club's repetition limit"),
  })
  .meta({ id: 'SquadWeekPlayer' });
export type SquadWeekPlayer = z.infer<typeof squadWeekPlayerSchema>;

/** Hit rate of the squad's repetitions in one band of target distance. */
export const zoneHitRateSchema = z
  .object({ technique, bandStartM: metres, bandEndM: metres, reps: count, hitRate: share })
  .meta({ id: 'ZoneHitRate' });
export type ZoneHitRate = z.infer<typeof zoneHitRateSchema>;

/** `GET /api/squads/:id/week?start=`. */
export const squadWeekSchema = z
  .object({
    squadId: z.string(),
    squadName: z.string(),
    weekStart: z.string(),
    previousWeekStart: z.string(),
    carryBasis: carryBasisSchema,
    repLimitPerSession: count,
    players: z.array(squadWeekPlayerSchema),
    zones: z.array(zoneHitRateSchema),
  })
  .meta({ id: 'SquadWeek' });
export type SquadWeek = z.infer<typeof squadWeekSchema>;

/** Why a timed repetition gave no spin estimate. */
export const SPIN_ESTIMATE_SKIPS = ['no_carry', 'time_too_short', 'time_too_long', 'carry_out_of_reach', 'spread_unresolved'] as const;
export type SpinEstimateSkip = (typeof SPIN_ESTIMATE_SKIPS)[number];

/** Spin inferred from hang time for one technique of one player. */
export const techniqueSpinEstimateSchema = z
  .object({
    technique,
    timedCount: count.describe('Timed repetitions (a stopwatch reading attached)'),
    solvedCount: count.describe('Of those, the ones the estimate used'),
    skipped: z.record(z.enum(SPIN_ESTIMATE_SKIPS), count).describe('Timed repetitions left out, by reason'),
    backspinRps: z.number().nullable().describe('Inverse-variance weighted mean backspin, rev/s (negative = topspin)'),
    backspinUncertaintyRps: z.number().nullable().describe('One standard deviation of that mean, rev/s'),
    backspinScatterRps: z.number().nullable().describe('Scatter of the per-repetition estimates, rev/s (null below two)'),
    speedMs: z.number().nullable().describe('Weighted mean launch speed, m/s'),
    speedUncertaintyMs: z.number().nullable(),
    eyeBackspinRps: z.number().nullable().describe('Mean of the spin logged by eye on the solved repetitions, rev/s, for comparison'),
  })
  .meta({ id: 'TechniqueSpinEstimate' });
export type TechniqueSpinEstimate = z.infer<typeof techniqueSpinEstimateSchema>;

/** `GET /api/players/:id/spin-estimates`. */
export const spinEstimatesResponseSchema = z
  .object({
    playerId: z.string(),
    timing: z.object({ biasS: z.number(), sdS: z.number() }).describe('The club calibration used: reading − bias = flight time'),
    perTechniqueLimit: count.describe('Most recent timed repetitions read per technique'),
    techniques: z.array(techniqueSpinEstimateSchema),
  })
  .meta({ id: 'SpinEstimates' });
export type SpinEstimatesResponse = z.infer<typeof spinEstimatesResponseSchema>;
