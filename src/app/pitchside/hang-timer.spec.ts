import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { FormControl } from '@angular/forms';
import { MatButtonHarness } from '@angular/material/button/testing';
import { HANG_TIMER_CLOCK, HangTimer } from './hang-timer';

describe('HangTimer (Pitchside stopwatch)', () => {
  let fixture: ComponentFixture<HangTimer>;
  let loader: HarnessLoader;
  let control: FormControl<string>;
  let clockMs = 0;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), { provide: HANG_TIMER_CLOCK, useValue: () => clockMs }],
    });
    control = new FormControl('', { nonNullable: true });
    fixture = TestBed.createComponent(HangTimer);
    fixture.componentRef.setInput('control', control);
    fixture.componentRef.setInput('biasS', 0.2);
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  const tap = () => loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="hang-timer-tap"]' }));
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('times from the tap at contact to the tap at the first bounce', async () => {
    clockMs = 1_000;
    await (await tap()).click();
    expect(await (await tap()).getText()).toContain('Bounce');
    expect(text()).toContain('tap again at the first bounce');
    clockMs = 3_137;
    await (await tap()).click();
    expect(control.value).toBe('2.14');
    expect(await (await tap()).getText()).toContain('Contact');
    expect(text()).toContain('about 1.94 s in the air');
  });

  it('counts a pointer tap once, though the browser follows it with a click', async () => {
    clockMs = 0;
    await (await tap()).click();
    clockMs = 500;
    // A keyboard press has no pointer-down: its click alone is the second tap.
    await (await (await tap()).host()).dispatchEvent('click');
    expect(control.value).toBe('0.50');
  });

  it('starts over on a new contact tap and discards a reading', async () => {
    clockMs = 0;
    await (await tap()).click();
    clockMs = 1_800;
    await (await tap()).click();
    expect(control.value).toBe('1.80');
    clockMs = 5_000;
    await (await tap()).click();
    expect(control.value).toBe('');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Discard time"]' }))).click();
    expect(await (await tap()).getText()).toContain('Contact');
    expect(control.value).toBe('');
  });
});
