/**
 * Wind at the ball's height. A weather service reports wind 10 m above open ground and a coach feels it
 * at head height, but a driven ball spends its flight within a few metres of the grass, where the wind is
 * weaker. In the surface layer of a neutral atmosphere the mean wind grows with the logarithm of height:
 *
 *   u(z) = u_ref · ln(z / z₀) / ln(z_ref / z₀)
 *
 * (the logarithmic wind profile; e.g. Stull 1988, An Introduction to Boundary Layer Meteorology, §9.7).
 * Near the grass the law diverges, so below a blend height z_b the height is floored smoothly: z is
 * replaced by (z⁴ + z_b⁴)^¼. That is the log law itself to within 1.1 % of the wind from 0.5 m up and
 * 0.1 % from 1 m up, and levels off to the law's value at z_b on the grass. The floor is analytic (no
 * kink in the air for the extrapolation integrator to trip on); a blend that is exactly the log law down
 * to z_b and a polynomial below costs the integrator about four times the carry error for the same work
 * (measured on the benchmark's 2,000 kicks when this floor was chosen). Stability (sun-warmed or
 * night-cooled ground) bends the profile; a neutral one is the usual assumption for a windy afternoon
 * (common practice).
 */

/**
 * Roughness length of a grass pitch, m: the "open" class (flat terrain, grass, few isolated obstacles) of
 * the Davenport classification as revised by Wieringa (WMO Guide to Meteorological Instruments, WMO-No. 8,
 * Annex on roughness; tabulated in Stull's Meteorology for Scientists and Engineers), z₀ = 0.03 m.
 */
export const GRASS_ROUGHNESS_LENGTH_M = 0.03;

/**
 * Blend height, m: ten roughness lengths, below which the log law no longer describes the flow among the
 * grass and the ball's own wake (common practice). The profile levels off below it.
 */
export const WIND_PROFILE_MIN_HEIGHT_M = 10 * GRASS_ROUGHNESS_LENGTH_M;

/** Anemometer height of a weather-service wind, m (WMO-No. 8: standard exposure 10 m above open ground). */
export const WEATHER_WIND_HEIGHT_M = 10;

/** Height at which a coach's wind estimate applies, m: felt at head height (common practice). */
export const COACH_WIND_HEIGHT_M = 1.8;

const LN_Z0 = Math.log(GRASS_ROUGHNESS_LENGTH_M);
const MIN_HEIGHT_FOURTH = WIND_PROFILE_MIN_HEIGHT_M ** 4;

/**
 * ln of the floored height over z₀: ¼ ln(z⁴ + z_b⁴) − ln z₀, with z taken as 0 below the grass. The
 * integrator's last step overshoots the ground; without the clamp the wind would grow again with depth
 * there and spoil the dense output the landing is found on (z⁴ keeps the clamp smooth to third order).
 * One logarithm: this runs inside the right-hand side.
 */
export function logHeightRatio(heightM: number): number {
  const h = heightM > 0 ? heightM : 0;
  const h2 = h * h;
  return 0.25 * Math.log(h2 * h2 + MIN_HEIGHT_FOURTH) - LN_Z0;
}

/**
 * Factor by which the wind at `referenceHeightM` is multiplied at `heightM` above the grass (1 at the
 * reference height itself).
 */
export function windHeightFactor(heightM: number, referenceHeightM: number): number {
  return logHeightRatio(heightM) / logHeightRatio(referenceHeightM);
}
