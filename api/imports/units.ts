/** Device-export units: the conversions live once in `shared/units.ts`; re-exported for the import service. */
export { distanceToM, METRES_PER_YARD, MS_PER_MPH, speedToMs, spinToRps } from '../../shared/units';
export type { DistanceUnit, SpeedUnit, SpinUnit } from '../../shared/units';
