import { DestroyRef, Injectable, InjectionToken, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  EnvelopeOptions,
  Flight,
  FlightConditions,
  KickInput,
  KickProfile,
  LaunchTrackInput,
  LaunchTrackResult,
  LoggedKick,
  ProfilePrior,
  ReachEnvelope,
  SetPieceInput,
  SetPieceResult,
  Technique,
} from '../../../shared/flight';
import {
  errorFromResponse,
  runFlightJob,
  type FlightJobKind,
  type FlightJobs,
  type FlightRequest,
  type FlightResponse,
} from './flight-protocol';
import type { SetPieceRankEntry, SetPieceRankInput } from './set-piece-rank';

/**
 * Creates the flight worker, or returns null where Web Workers do not exist (server-side rendering,
 * old test environments); FlightEngine then computes on the calling thread. A token so tests can
 * choose either path.
 */
export const FLIGHT_WORKER_FACTORY = new InjectionToken<() => Worker | null>('FLIGHT_WORKER_FACTORY', {
  providedIn: 'root',
  factory: () => () => (typeof Worker === 'undefined' ? null : new Worker(new URL('./flight.worker', import.meta.url), { type: 'module' })),
});

/**
 * Runs the flight model's heavy calls (reach envelopes, set-piece checks, profile fits) in a Web Worker
 * and hands results back as Observables, so 2,000-trajectory envelopes never block a screen. Requests are
 * correlated by id; each Observable posts its request on subscription and emits once. Without a worker
 * (or after the worker failed) the same code runs directly, with identical results.
 */
@Injectable({ providedIn: 'root' })
export class FlightEngine {
  private readonly createWorker = inject(FLIGHT_WORKER_FACTORY);
  private worker: Worker | null | undefined;
  private nextId = 1;
  private readonly pending = new Map<number, (response: FlightResponse) => void>();

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      this.worker?.terminate();
      this.worker = null;
      this.pending.clear();
    });
  }

  /** Whether requests currently go to a Web Worker (false = computed on the calling thread). */
  get runsInWorker(): boolean {
    return this.ensureWorker() !== null;
  }

  /** Reach envelope of a fitted profile under given conditions (seeded Monte Carlo). */
  envelope(profile: KickProfile, conditions: FlightConditions, options: EnvelopeOptions): Observable<ReachEnvelope> {
    return this.run('envelope', [profile, conditions, options]);
  }

  /** Share of a player's envelope that clears the wall and goes in under the bar. */
  setPiece(input: SetPieceInput): Observable<SetPieceResult> {
    return this.run('setPiece', [input]);
  }

  /** One trajectory, e.g. for the flight sandbox. */
  simulate(kick: KickInput): Observable<Flight> {
    return this.run('simulate', [kick]);
  }

  /**
   * Several trajectories in one worker message (the sandbox's overlaid kicks), so a slider move costs one
   * round trip however many kicks are compared. Results come in the order of `kicks`.
   */
  simulateKicks(kicks: KickInput[]): Observable<Flight[]> {
    return this.run('simulateKicks', [kicks]);
  }

  /**
   * The planner's squad check at one spot: each player's set-piece shares, goal-mouth cloud and
   * mean-launch flight, in the order given (rank them with `rankSetPiece`).
   */
  setPieceRank(input: SetPieceRankInput): Observable<SetPieceRankEntry[]> {
    return this.run('setPieceRank', [input]);
  }

  /** Fit a player's profile from logged repetitions of one technique. */
  fitProfile(kicks: LoggedKick[], prior?: ProfilePrior & { technique?: Technique }): Observable<KickProfile> {
    return this.run('fitProfile', prior === undefined ? [kicks] : [kicks, prior]);
  }

  /** Fit the flight model to a tapped video track (tens of flights: off the main thread). */
  launchFromTrack(input: LaunchTrackInput): Observable<LaunchTrackResult> {
    return this.run('launchFromTrack', [input]);
  }

  private run<K extends FlightJobKind>(kind: K, args: FlightJobs[K]['args']): Observable<FlightJobs[K]['result']> {
    return new Observable<FlightJobs[K]['result']>((subscriber) => {
      const worker = this.ensureWorker();
      if (worker === null) {
        try {
          subscriber.next(runFlightJob(kind, args));
          subscriber.complete();
        } catch (e) {
          subscriber.error(e);
        }
        return undefined;
      }
      const id = this.nextId++;
      this.pending.set(id, (response) => {
        if (response.ok) {
          subscriber.next(response.result as FlightJobs[K]['result']);
          subscriber.complete();
        } else {
          subscriber.error(errorFromResponse(response.error));
        }
      });
      worker.postMessage({ id, kind, args } as FlightRequest);
      return () => {
        this.pending.delete(id);
      };
    });
  }

  private ensureWorker(): Worker | null {
    if (this.worker !== undefined) return this.worker;
    let worker: Worker | null = null;
    try {
      worker = this.createWorker();
    } catch {
      worker = null;
    }
    if (worker) {
      worker.addEventListener('message', (event: MessageEvent<FlightResponse>) => {
        const settle = this.pending.get(event.data.id);
        this.pending.delete(event.data.id);
        settle?.(event.data);
      });
      worker.addEventListener('error', (event: ErrorEvent) => {
        // A worker that fails (e.g. its script did not load) fails what it held; later calls run directly.
        const failure = { name: 'Error', message: `flight worker failed: ${event.message || 'unknown error'}` };
        for (const [id, settle] of this.pending) settle({ id, ok: false, error: failure });
        this.pending.clear();
        worker?.terminate();
        this.worker = null;
      });
    }
    this.worker = worker;
    return worker;
  }
}
