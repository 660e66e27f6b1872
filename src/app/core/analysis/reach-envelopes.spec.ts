import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { reachEnvelope } from '../../../../shared/flight';
import { BROWSER_STORAGE } from '../browser-storage';
import { signedInStorage } from '../spec-support';
import { FLIGHT_WORKER_FACTORY, FlightEngine } from '../../flight/flight-engine';
import { FIXTURE_IDS, fixtureProfile, fixtureUser, profileEntry } from './spec-fixtures';
import { ANSWER_STORE, MemoryAnswerStore } from '../offline-cache';
import { ENVELOPE_SAMPLES, ENVELOPE_SEED, ReachEnvelopes, standardConditions } from './reach-envelopes';

describe('ReachEnvelopes', () => {
  let envelopes: ReachEnvelopes;
  let engine: FlightEngine;
  let store: MemoryAnswerStore;

  beforeEach(() => {
    store = new MemoryAnswerStore();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(fixtureUser('head_coach')) },
        { provide: ANSWER_STORE, useValue: store },
        // On the calling thread, so the spy sees every envelope asked for.
        { provide: FLIGHT_WORKER_FACTORY, useValue: () => null },
      ],
    });
    envelopes = TestBed.inject(ReachEnvelopes);
    engine = TestBed.inject(FlightEngine);
  });

  it('has nothing to analyse without a profile', async () => {
    expect(await firstValueFrom(envelopes.analyse(profileEntry(FIXTURE_IDS.playerAda, 'lofted', null), 5, true))).toBeNull();
  });

  it('computes the standard-conditions envelope the server uses, with reliable reach and its range', async () => {
    const entry = profileEntry(FIXTURE_IDS.playerAda, 'lofted', fixtureProfile());
    const analysis = (await firstValueFrom(envelopes.analyse(entry, 5, true)))!;
    const direct = reachEnvelope(entry.profile!, standardConditions(5), {
      samples: ENVELOPE_SAMPLES,
      seed: ENVELOPE_SEED,
      reliableReachRadiusM: 3,
    });
    expect(analysis.envelope).toEqual(direct);
    expect(analysis.reliableReachM).toBe(direct.reliableReach.distanceM);
    expect(analysis.reliableReachM).not.toBeNull();
    // The range is taken over the central and the two shifted fits, so it brackets the central value.
    expect(analysis.reliableReachLowM!).toBeLessThanOrEqual(analysis.reliableReachM!);
    expect(analysis.reliableReachHighM!).toBeGreaterThanOrEqual(analysis.reliableReachM!);
    expect(analysis.reliableReachHighM! - analysis.reliableReachLowM!).toBeGreaterThan(0);
  });

  it('uses the youth ball of a size-4 squad', () => {
    // Common practice (no standard): size 4 is 63.5–66 cm and 350–390 g; the defaults are the midpoints.
    const ball = standardConditions(4).ball!;
    expect(ball.massKg).toBeCloseTo(0.37, 6);
    expect(ball.radiusM).toBeCloseTo(0.6475 / (2 * Math.PI), 6);
    expect(standardConditions(4).air).toEqual({ altitudeM: 0, temperatureC: 15 });
  });

  it('keeps envelopes on the device and recomputes only for a refreshed profile', async () => {
    const spy = spyOn(engine, 'envelope').and.callThrough();
    const entry = profileEntry(FIXTURE_IDS.playerAda, 'lofted', fixtureProfile());
    await firstValueFrom(envelopes.analyse(entry, 5, true));
    expect(spy).toHaveBeenCalledTimes(3);
    expect(store.count('envelope')).toBe(3);
    const again = await firstValueFrom(envelopes.analyse(entry, 5, true));
    expect(spy).toHaveBeenCalledTimes(3);
    expect(again!.envelope.samples).toBe(ENVELOPE_SAMPLES);
    await firstValueFrom(envelopes.analyse({ ...entry, computedAt: '2025-03-16T20:00:00.000Z' }, 5, false));
    expect(spy).toHaveBeenCalledTimes(4);
  });
});
