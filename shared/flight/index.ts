/**
 * Loftline flight model: plain TypeScript shared by the browser (in a Web Worker) and the server, so an
 * envelope or set-piece check computed in either place gives the same numbers.
 */

export {
  airDensity,
  isaAtmosphere,
  moistAirDensityCipm2007,
  resolveAir,
  saturationVapourPressurePa,
  sutherlandViscosityPaS,
} from './atmosphere';
export type { AirState, IsaState } from './atmosphere';
export {
  goffCarreCd,
  goffCarreNoSpinCd,
  goffCarreSpinCd,
  GOFF_CARRE_RE_CENTRE,
  GOFF_CARRE_RE_WIDTH,
  LIFT_ONSET_S,
  LIFT_ONSET_SLOPE,
  onsetLiftCl,
  powerLiftCl,
  saturatingLiftCl,
} from './aero';
export {
  BALL_SIZES,
  DEFAULT_ELEVATION_DEG,
  DEFAULT_SPIN_DECAY_TAU_S,
  FLIGHT_TIME_CAP_S,
  GOAL_HEIGHT_M,
  GOAL_WIDTH_M,
  PATH_SAMPLE_INTERVAL_S,
  SIDESPIN_STEP_RPS,
  SPIN_STEP_RPS,
  STANDARD_GRAVITY_MS2,
  TECHNIQUES,
  WALL_DISTANCE_M,
} from './constants';
export type { BallSize } from './constants';
export { CURVE_SAMPLES, hitProbability, reachEnvelope, reliableReachM, RELIABLE_REACH_PROBABILITY } from './envelope';
export { curveHitProbability, CURVE_RADII_M, reachCurve } from './reach-curve';
export type { CurveOptions, ReachCurve } from './reach-curve';
export type { AimedSpeedFit } from './aimed-speed';
export type { EnvelopeCloud, EnvelopeOptions, EnvelopeTarget, LandingEllipse, ReachEnvelope } from './envelope';
export type { DistributionSummary } from './stats';
export { DEFAULT_SOLVER_SETTINGS, TIGHT_SOLVER_SETTINGS } from './integrate';
export type { SolverSettings } from './integrate';
export { INVERSE_MAX_SPEED_MS, INVERSE_MIN_SPEED_MS, solveLaunchSpeed } from './inverse';
export type { LaunchSpeedQuery } from './inverse';
export { fitProfile } from './profile';
export {
  backspinLogSdRps,
  CEILINGS_BY_BALL_MS,
  ELEVATION_SD_PRIOR_DEG,
  LAUNCH_SPEED_CAP_MS,
  PRIORS_BY_BALL,
  sidespinLogSdRps,
} from './profile-priors';
export type { SquadBallSize } from './profile-priors';
export { fitWarnings, PROFILE_WARNING_TEXT, reachWarnings } from './profile-warnings';
export { PROFILE_WARNINGS } from './profile-types';
export type { ElevationSpreadSource, ProfileWarning } from './profile-types';
export { CEILING_PRIOR_LOG_SD, DEFAULT_CEILINGS_MS, DEFAULT_PRIORS } from './profile-types';
export type { FitOptions } from './profile-types';
export type { KickProfile, LoggedKick, ProfileObservationCounts, ProfilePrior } from './profile-types';
export { DEFAULT_WALL_HEIGHT_M, GOAL_CROSSING, setPieceCheck, setPieceCloud, setPieceGeometry } from './set-piece';
export { choiceRangeOf, TECHNIQUE_CHOICES } from './set-piece-aim';
export type { IntendedKick, KickChoiceRange } from './set-piece-aim';
export type { GoalCrossingKind, GoalMouthCloud, SetPieceCloudResult, SetPieceInput, SetPieceResult, SetPieceShares } from './set-piece';
export { simulateKick } from './simulate';
export {
  SPEED_SPIN_BACKSPIN_RANGE_RPS,
  SPEED_SPIN_DEFAULT_SAMPLES,
  solveSpeedAndSpin,
  TIMED_KICK_DEFAULT_SAMPLES,
  timedCarryOf,
  timedKickEvidence,
} from './speed-spin';
export type {
  SampledSpread,
  SpeedSpinEstimate,
  SpeedSpinEstimateQuery,
  SpeedSpinFailure,
  SpeedSpinNoSolution,
  SpeedSpinQuery,
  SpeedSpinResult,
  SpeedSpinUncertainty,
  TimedKickEvidence,
  TimedKickInput,
} from './speed-spin';
export type {
  AeroSpec,
  AirSpec,
  BackspinStep,
  BallSpec,
  DragModel,
  Flight,
  FlightConditions,
  KickInput,
  KickOutcome,
  LiftModel,
  PathPoint,
  PlaneCrossing,
  SidespinStep,
  Technique,
  WindSpec,
} from './types';
export { LIMITS } from './validate';
export {
  COACH_WIND_HEIGHT_M,
  GRASS_ROUGHNESS_LENGTH_M,
  WEATHER_WIND_HEIGHT_M,
  WIND_PROFILE_MIN_HEIGHT_M,
  windHeightFactor,
} from './wind-profile';
export { planeCamera } from './video-camera';
export type { GroundMark, ImagePoint, PlaneCamera, PlanePoint, TrackCalibration } from './video-camera';
export {
  MAX_CALIBRATION_TILT_DEG,
  MAX_TRACK_POINTS,
  MIN_CALIBRATION_M,
  MIN_CALIBRATION_PX,
  MIN_TRACK_POINTS,
  solveLaunchFromTrack,
  VIDEO_SPEED_RANGE_MS,
} from './video-track';
export type {
  LaunchTrackFailure,
  LaunchTrackFit,
  LaunchTrackInput,
  LaunchTrackRefusal,
  LaunchTrackResult,
  TrackPoint,
} from './video-track';
