import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideZonelessChangeDetection, type Provider } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { ActivatedRoute, Router, convertToParamMap, provideRouter } from '@angular/router';
import { simulateKick } from '../../../shared/flight';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { SliderFieldHarness } from '../ui/slider-field-harness';
import { Sandbox } from './sandbox';
import { DEFAULT_GOAL_DISTANCE_M, DEFAULT_KICK, encodeState, flightFigures, toKickInput, type SandboxKick } from './sandbox-kick';

async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 5000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

/** The carry the table should show for a kick, straight from the flight model. */
function expectedCarry(kick: SandboxKick, goalM = DEFAULT_GOAL_DISTANCE_M): string {
  return `${flightFigures(simulateKick(toKickInput(kick, goalM)), kick, goalM).carryM.toFixed(1)} m`;
}

describe('Sandbox (Flight sandbox)', () => {
  let fixture: ComponentFixture<Sandbox>;
  let loader: HarnessLoader;

  function open(query: Record<string, string | string[]> = {}, providers: Provider[] = []): void {
    TestBed.configureTestingModule({
      providers: [
        ...providers,
        provideZonelessChangeDetection(),
        provideRouter([]),
        { provide: ActivatedRoute, useValue: { snapshot: { queryParamMap: convertToParamMap(query) } } },
      ],
    });
    fixture = TestBed.createComponent(Sandbox);
    loader = TestbedHarnessEnvironment.loader(fixture);
  }

  /** The results table as { figure: [kick A, kick B, …] }. */
  async function figures(): Promise<Record<string, string[]>> {
    const table = await loader.getHarness(MatTableHarness);
    const out: Record<string, string[]> = {};
    for (const row of await table.getRows()) {
      const [figure, ...values] = await row.getCellTextByIndex();
      out[figure!] = values;
    }
    return out;
  }

  async function carries(): Promise<string[]> {
    return (await figures())['Carry'] ?? [];
  }

  function marks(selector: string): number {
    return (fixture.nativeElement as HTMLElement).querySelectorAll(selector).length;
  }

  afterEach(() => TestBed.resetTestingModule());

  it('computes the default kick and recomputes when a number is typed or a slider moved', async () => {
    open();
    await until('the first flight', async () => (await carries())[0] === expectedCarry(DEFAULT_KICK));

    const speed = await loader.getHarness(SliderFieldHarness.with({ label: 'Speed' }));
    await speed.type('30');
    await until('the flight at 30 m/s', async () => (await carries())[0] === expectedCarry({ ...DEFAULT_KICK, speedMs: 30 }));
    expect(await speed.getSliderValue()).toBe(30);

    const elevation = await loader.getHarness(SliderFieldHarness.with({ label: 'Elevation' }));
    await elevation.slide(40);
    const kick = { ...DEFAULT_KICK, speedMs: 30, elevationDeg: 40 };
    await until('the flight at 40°', async () => (await carries())[0] === expectedCarry(kick));
    expect(await elevation.getTypedValue()).toBe('40');
    const f = flightFigures(simulateKick(toKickInput(kick, DEFAULT_GOAL_DISTANCE_M)), kick, DEFAULT_GOAL_DISTANCE_M);
    expect((await figures())['Apex']).toEqual([`${f.apexM.toFixed(2)} m`]);
  });

  it('refuses a typed value out of range and keeps the last flight', async () => {
    open();
    await until('the first flight', async () => (await carries())[0] === expectedCarry(DEFAULT_KICK));
    const speed = await loader.getHarness(SliderFieldHarness.with({ label: 'Speed' }));
    await speed.type('75');
    expect(await speed.getError()).toBe('1 to 60 m/s');
    await new Promise((r) => setTimeout(r, 100));
    expect((await carries())[0]).toBe(expectedCarry(DEFAULT_KICK));
  });

  it('overlays a second kick and draws one path and one landing mark per kick in each view', async () => {
    open();
    await until('the first flight', () => marks('path.ll-trajectory__trace') === 2);
    expect(marks('circle.ll-trajectory__landing')).toBe(2);

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Add a kick to compare"]' }))).click();
    const sidespin = await loader.getHarness(SliderFieldHarness.with({ label: 'Sidespin' }));
    await sidespin.type('8');
    const curled = { ...DEFAULT_KICK, sidespinRps: 8 };
    await until('two kicks', async () => {
      const c = await carries();
      return c.length === 2 && c[1] === expectedCarry(curled);
    });
    expect((await carries())[0]).toBe(expectedCarry(DEFAULT_KICK));
    // Two views × two kicks.
    expect(marks('ll-trajectory-chart path.ll-trajectory__trace')).toBe(4);
    expect(marks('ll-trajectory-chart circle.ll-trajectory__landing')).toBe(4);
    expect(marks('ll-trajectory-chart .ll-trajectory__trace--emphasised')).toBe(2);
    // One wall and one goal in each view.
    expect(marks('rect.ll-trajectory__wall')).toBe(2);
    expect(marks('path.ll-trajectory__goal')).toBe(2);

    const kickA = await loader.getHarness(MatButtonToggleHarness.with({ text: 'Kick A' }));
    await kickA.check();
    expect(await sidespin.getTypedValue()).toBe('0');
  });

  it('opens the kicks a permalink carries and writes edits back into the URL', async () => {
    const b: SandboxKick = { ...DEFAULT_KICK, speedMs: 21, elevationDeg: 18, windSpeedMs: 5, windFromDeg: 180, ballSize: 4 };
    open(encodeState({ kicks: [DEFAULT_KICK, b], selected: 1, goalDistanceM: 20 }));
    await until('both kicks', async () => {
      const c = await carries();
      return c.length === 2 && c[1] === expectedCarry(b, 20);
    });
    expect(await (await loader.getHarness(SliderFieldHarness.with({ label: 'Wind' }))).getTypedValue()).toBe('5');
    expect(await (await loader.getHarness(SliderFieldHarness.with({ label: 'Goal line at' }))).getTypedValue()).toBe('20');

    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    await (await loader.getHarness(SliderFieldHarness.with({ label: 'Speed' }))).type('24');
    await until('the URL update', () => navigate.calls.count() > 0);
    const extras = navigate.calls.mostRecent().args[1];
    expect(extras?.replaceUrl).toBeTrue();
    expect(extras?.queryParams).toEqual(encodeState({ kicks: [DEFAULT_KICK, { ...b, speedMs: 24 }], selected: 1, goalDistanceM: 20 }));
  });

  it("slides the goal line and draws ground distances in a yards club's unit, while the kick flies to the line in metres", async () => {
    // A device that last saw a yards club (ClubSettingsStore caches the settings for a pitch without signal).
    const storage = new MemoryStorage();
    storage.setItem('loftline.clubSettings', JSON.stringify({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'yd', locale: 'en-GB' }));
    open({}, [{ provide: BROWSER_STORAGE, useValue: storage }]);
    await until('the default kick', async () => (await carries()).length === 1);
    const goal = await loader.getHarness(SliderFieldHarness.with({ label: 'Goal line at' }));
    // 25 m is 27.34 yd: 1 yd = 0.9144 m exactly (international yard and pound agreement, 1959).
    expect(await goal.getTypedValue()).toBe('27.34');
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Distance, yd');
    expect(text).toContain('Left +, yd');
    expect(text).toContain('Height, m');

    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    await goal.type('30');
    await until('the URL update', () => navigate.calls.count() > 0);
    // 30 yd = 27.432 m: the state and the flight stay in metres.
    expect(navigate.calls.mostRecent().args[1]?.queryParams).toEqual(
      encodeState({ kicks: [DEFAULT_KICK], selected: 0, goalDistanceM: 27.432 }),
    );
    // Typed beyond the metre range (100 m = 109.36 yd) the field says so in yards.
    await goal.type('110');
    expect(await goal.getError()).toBe('11 to 109 yd');
  });
});
