import {
  fitProfile,
  reachEnvelope,
  setPieceCheck,
  simulateKick,
  solveLaunchFromTrack,
  type EnvelopeOptions,
  type Flight,
  type FlightConditions,
  type KickInput,
  type KickProfile,
  type LaunchTrackInput,
  type LaunchTrackResult,
  type LoggedKick,
  type ProfilePrior,
  type ReachEnvelope,
  type SetPieceInput,
  type SetPieceResult,
  type Technique,
} from '../../../shared/flight';
import { setPieceRank, type SetPieceRankEntry, type SetPieceRankInput } from './set-piece-rank';

/**
 * The jobs the flight worker runs: each job's arguments and result. Both the worker and the main-thread
 * fallback dispatch through `runFlightJob`, so a result is the same wherever it was computed.
 */
export interface FlightJobs {
  envelope: {
    args: [profile: KickProfile, conditions: FlightConditions, options: EnvelopeOptions];
    result: ReachEnvelope;
  };
  setPiece: { args: [input: SetPieceInput]; result: SetPieceResult };
  simulate: { args: [kick: KickInput]; result: Flight };
  /** Several kicks in one message (the sandbox's overlaid kicks), results in the same order. */
  simulateKicks: { args: [kicks: KickInput[]]; result: Flight[] };
  /** Every player's set-piece check, goal-mouth cloud and mean-launch flight at one spot. */
  setPieceRank: { args: [input: SetPieceRankInput]; result: SetPieceRankEntry[] };
  fitProfile: { args: [kicks: LoggedKick[], prior?: ProfilePrior & { technique?: Technique }]; result: KickProfile };
  /** A launch measured from taps on a side-on video (speed, elevation, backspin, or why not). */
  launchFromTrack: { args: [input: LaunchTrackInput]; result: LaunchTrackResult };
}

/** Name of a flight job. */
export type FlightJobKind = keyof FlightJobs;

/** A request posted to the worker; `id` correlates it with its response. */
export type FlightRequest = {
  [K in FlightJobKind]: { id: number; kind: K; args: FlightJobs[K]['args'] };
}[FlightJobKind];

/** The worker's answer to one request: the job's result, or the error it threw. */
export type FlightResponse =
  | { id: number; ok: true; result: FlightJobs[FlightJobKind]['result'] }
  | { id: number; ok: false; error: { name: string; message: string } };

const JOBS: { [K in FlightJobKind]: (...args: FlightJobs[K]['args']) => FlightJobs[K]['result'] } = {
  envelope: (profile, conditions, options) => reachEnvelope(profile, conditions, options),
  setPiece: (input) => setPieceCheck(input),
  simulate: (kick) => simulateKick(kick),
  simulateKicks: (kicks) => {
    if (!Array.isArray(kicks)) throw new RangeError('kicks must be an array');
    return kicks.map((kick) => simulateKick(kick));
  },
  setPieceRank: (input) => setPieceRank(input),
  fitProfile: (kicks, prior) => fitProfile(kicks, prior),
  launchFromTrack: (input) => solveLaunchFromTrack(input),
};

/** Whether `kind` names a flight job (messages from outside are checked before dispatch). */
export function isFlightJobKind(kind: unknown): kind is FlightJobKind {
  return typeof kind === 'string' && Object.prototype.hasOwnProperty.call(JOBS, kind);
}

/** Run one flight job synchronously; throws what the flight model throws (RangeError for bad input). */
export function runFlightJob<K extends FlightJobKind>(kind: K, args: FlightJobs[K]['args']): FlightJobs[K]['result'] {
  const job = JOBS[kind] as (...a: FlightJobs[K]['args']) => FlightJobs[K]['result'];
  return job(...args);
}

/** Answer a request: the job's result, or its error as a plain object that survives structured cloning. */
export function answerFlightRequest(request: FlightRequest): FlightResponse {
  try {
    if (!isFlightJobKind(request.kind)) throw new TypeError(`unknown flight job ${String(request.kind)}`);
    return { id: request.id, ok: true, result: runFlightJob(request.kind, request.args) };
  } catch (e) {
    const error = e instanceof Error ? { name: e.name, message: e.message } : { name: 'Error', message: String(e) };
    return { id: request.id, ok: false, error };
  }
}

/** Rebuild an error from a response so callers can still test `instanceof RangeError`. */
export function errorFromResponse(error: { name: string; message: string }): Error {
  if (error.name === 'RangeError') return new RangeError(error.message);
  if (error.name === 'TypeError') return new TypeError(error.message);
  const e = new Error(error.message);
  e.name = error.name;
  return e;
}
