/**
 * Club-wide settings that the server keeps and every device reads: the Pitchside stopwatch's calibration,
 * and how the club reads distances and dates (its distance unit and BCP 47 locale; storage stays SI). A hand-timed flight is late or early by the timekeeper's reactions; the club records how
 * much (bias) and how consistently (spread), so the flight model can correct a reading and say how far to
 * trust it.
 */
import * as z from 'zod';
import { canonicalLocale, DEFAULT_LOCALE } from '../quantity-format';
import { DISTANCE_UNITS, type DistanceUnit } from '../units';

/** Bounds of the timing bias, s. A human reaction is ~0.2 s; more than 1 s is not a calibration. */
export const TIMING_BIAS_RANGE_S: readonly [number, number] = [0, 1];
/** Bounds of the timing spread (one standard deviation), s. */
export const TIMING_SD_RANGE_S: readonly [number, number] = [0.01, 0.5];

/**
 * Product defaults (common practice, no source): the second tap, at the first bounce, lags by about a
 * reaction time while the first, at a foot contact the timekeeper sees coming, barely does; so a reading
 * runs ~0.2 s long, give or take ~0.08 s. A club should calibrate both by timing a few kicks on video.
 */
export const DEFAULT_TIMING = { biasS: 0.2, sdS: 0.08 } as const;

/**
 * Repetitions per player per session above which Pitchside shows the kicking-load caution, for a club
 * that has not set its own (docs/design.md §10: repeated maximal kicking strains hips and groin; the
 * figure is common practice, not a medical limit — the club's medical staff set the real one).
 */
export const DEFAULT_REP_LIMIT_PER_SESSION = 40;

const seconds = (name: string, [min, max]: readonly [number, number]) =>
  z
    .number({ error: `${name} must be a number of seconds` })
    .min(min, { error: `${name} must be at least ${min} s` })
    .max(max, { error: `${name} must be at most ${max} s` });

/**
 * Bounds of the ball's drag-crisis Reynolds number (centre of the drop). Asai et al. 2007 (Sports
 * Engineering 10:101) report critical Reynolds numbers of 2.2–3.0 × 10⁵ for footballs, where the drop is
 * nearly complete; the centre sits ~20 % lower, so 1.5–3.0 × 10⁵ covers the balls measured with room.
 */
export const DRAG_CRISIS_RE_RANGE: readonly [number, number] = [1.5e5, 3.0e5];

/**
 * Default drag-crisis Reynolds number: the centre of the Goff & Carré 2010 (Eur. J. Phys. 31:775)
 * non-spinning fit, 12.19 m/s on a 0.69 m ball in ISA sea-level air (shared/flight's GOFF_CARRE_RE_CENTRE,
 * repeated here so the schema needs no flight-model import; a spec keeps them equal).
 */
export const DEFAULT_DRAG_CRISIS_RE = 183_289;

/** The ball's drag-crisis Reynolds number, within the range footballs have been measured at. */
const dragCrisisReSchema = z
  .number({ error: 'dragCrisisRe must be a Reynolds number' })
  .min(DRAG_CRISIS_RE_RANGE[0], { error: `dragCrisisRe must be at least ${DRAG_CRISIS_RE_RANGE[0]}` })
  .max(DRAG_CRISIS_RE_RANGE[1], { error: `dragCrisisRe must be at most ${DRAG_CRISIS_RE_RANGE[1]}` });

/** How a club reads numbers until its admin says otherwise (the demo's too): metres, British English. */
export const DEFAULT_DISPLAY = { distanceUnit: 'm', locale: DEFAULT_LOCALE } as const satisfies {
  distanceUnit: DistanceUnit;
  locale: string;
};

/** The distance unit the club's screens, charts, exports and mail show. */
export const distanceUnitSchema = z.enum(DISTANCE_UNITS, { error: `distanceUnit must be one of ${DISTANCE_UNITS.join(', ')}` });

/** A BCP 47 language tag the runtime can format with (e.g. `de-DE`); stored in its canonical form. */
export const localeSchema = z
  .string({ error: 'locale must be a BCP 47 language tag such as en-GB or de-DE' })
  .max(35, { error: 'locale must be at most 35 characters' })
  .transform((tag, ctx) => {
    const canonical = canonicalLocale(tag);
    if (canonical === null) {
      ctx.addIssue({ code: 'custom', message: 'locale must be a BCP 47 language tag such as en-GB or de-DE' });
      return z.NEVER;
    }
    return canonical;
  });

/** Answer of `GET /api/club/settings` (and of the `PUT`); `dragCrisisRe` is always answered. */
export const clubSettingsSchema = z.strictObject({
  timingBiasS: seconds('timingBiasS', TIMING_BIAS_RANGE_S),
  timingSdS: seconds('timingSdS', TIMING_SD_RANGE_S),
  dragCrisisRe: dragCrisisReSchema.optional(),
  distanceUnit: distanceUnitSchema,
  locale: z.string(),
  /** The club's kicking-load limit (repetitions per player per session); read-only here. */
  repLimitPerSession: z.number().int().positive().optional(),
});
export type ClubSettings = z.infer<typeof clubSettingsSchema>;

/**
 * Body of `PUT /api/club/settings`: the stopwatch calibration, and optionally the ball's drag crisis, the
 * distance unit and the locale (left out, they stay as they are, so a client that only knows the calibration changes nothing else).
 */
export const clubSettingsUpdateSchema = z.strictObject({
  timingBiasS: seconds('timingBiasS', TIMING_BIAS_RANGE_S),
  timingSdS: seconds('timingSdS', TIMING_SD_RANGE_S),
  dragCrisisRe: dragCrisisReSchema.optional(),
  distanceUnit: distanceUnitSchema.optional(),
  locale: localeSchema.optional(),
});
export type ClubSettingsUpdate = z.infer<typeof clubSettingsUpdateSchema>;
