import { TestBed } from '@angular/core/testing';
import { firstValueFrom, forkJoin } from 'rxjs';
import { DEFAULT_PRIORS, fitProfile, reachEnvelope, setPieceCheck, simulateKick, type KickProfile } from '../../../shared/flight';
import { FLIGHT_WORKER_FACTORY, FlightEngine } from './flight-engine';
import { setPieceRank } from './set-piece-rank';

function profile(): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS.lofted, technique: 'lofted' });
  return {
    ...base,
    meanSpeedMs: 24,
    sdSpeedMs: 2,
    meanSpeedSeMs: 0.2,
    meanAzimuthDeg: 0.5,
    sdAzimuthDeg: 2,
    backspinRps: 6,
    sdBackspinRps: 1,
  };
}

describe('FlightEngine', () => {
  const conditions = { air: { temperatureC: 12 }, wind: { speedMs: 3, fromDeg: 30 } };
  const options = { samples: 300, seed: 7, target: { distanceM: 40, radiusM: 3 } };

  describe('with a Web Worker', () => {
    let engine: FlightEngine;
    beforeEach(() => {
      TestBed.configureTestingModule({});
      engine = TestBed.inject(FlightEngine);
    });

    it('runs an envelope in the worker with the same result as the direct call', async () => {
      expect(engine.runsInWorker).toBeTrue();
      const fromWorker = await firstValueFrom(engine.envelope(profile(), conditions, options));
      expect(fromWorker).toEqual(reachEnvelope(profile(), conditions, options));
    });

    it('runs a set-piece check in the worker with the same result as the direct call', async () => {
      const input = {
        ballX: 22,
        ballY: 3,
        profile: { ...profile(), technique: 'curled' as const, elevationDeg: 20 },
        conditions: {},
        samples: 200,
        seed: 3,
      };
      expect(await firstValueFrom(engine.setPiece(input))).toEqual(setPieceCheck(input));
    });

    it('runs several kicks in one message, in order, as the direct calls do', async () => {
      const kicks = [
        { speed: 25, elevationDeg: 30, backspinRps: 6, path: true, planes: [9.15, 30] },
        { speed: 20, elevationDeg: 18, sidespinRps: 8, wind: { speedMs: 4, fromDeg: 90 }, path: true },
      ];
      const flights = await firstValueFrom(engine.simulateKicks(kicks));
      expect(flights).toEqual(kicks.map((k) => simulateKick(k)));
    });

    it('ranks a squad at a spot in the worker with the same result as the direct call', async () => {
      const input = {
        ballX: 23,
        ballY: -4,
        wallHeightM: 2.1,
        conditions: {},
        samples: 100,
        seed: 9,
        players: [
          { id: 'a', profile: { ...profile(), technique: 'curled' as const, elevationDeg: 20 } },
          { id: 'b', profile: { ...profile(), technique: 'curled' as const, elevationDeg: 24, meanSpeedMs: 21 } },
        ],
      };
      expect(await firstValueFrom(engine.setPieceRank(input))).toEqual(setPieceRank(input));
    });

    it('correlates concurrent requests by id', async () => {
      const [a, b] = await firstValueFrom(
        forkJoin([
          engine.envelope(profile(), conditions, { ...options, seed: 1 }),
          engine.envelope(profile(), conditions, { ...options, seed: 2 }),
        ]),
      );
      expect(a).toEqual(reachEnvelope(profile(), conditions, { ...options, seed: 1 }));
      expect(b).toEqual(reachEnvelope(profile(), conditions, { ...options, seed: 2 }));
    });

    it('passes a RangeError naming the field back from the worker', async () => {
      await expectAsync(firstValueFrom(engine.simulate({ speed: -1, elevationDeg: 30 }))).toBeRejectedWithError(RangeError, /^speed/);
    });
  });

  describe('without a Web Worker', () => {
    it('computes on the calling thread with the same result', async () => {
      TestBed.configureTestingModule({ providers: [{ provide: FLIGHT_WORKER_FACTORY, useValue: () => null }] });
      const engine = TestBed.inject(FlightEngine);
      expect(engine.runsInWorker).toBeFalse();
      expect(await firstValueFrom(engine.envelope(profile(), conditions, options))).toEqual(reachEnvelope(profile(), conditions, options));
      await expectAsync(firstValueFrom(engine.simulate({ speed: 20, elevationDeg: 95 }))).toBeRejectedWithError(
        RangeError,
        /^elevationDeg/,
      );
    });
  });
});
