import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatInputHarness } from '@angular/material/input/testing';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { ClubSettingsStore } from '../core/club-settings-store';
import { until } from '../core/spec-support';
import { StopwatchTiming } from './stopwatch-timing';

describe('StopwatchTiming (Club admin)', () => {
  let fixture: ComponentFixture<StopwatchTiming>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: new MemoryStorage() },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(StopwatchTiming);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend
      .expectOne({ method: 'GET', url: '/api/club/settings' })
      .flush({ timingBiasS: 0.18, timingSdS: 0.07, distanceUnit: 'm', locale: 'en-GB' });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const input = (label: RegExp) => loader.getHarness(MatInputHarness.with({ selector: `input[formControlName="${label.source}"]` }));
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('shows the club’s calibration with the common-practice and calibrate-from-video wording', async () => {
    expect(await (await input(/timingBiasS/)).getValue()).toBe('0.18');
    expect(await (await input(/timingSdS/)).getValue()).toBe('0.07');
    expect(text()).toContain('common practice');
    expect(text()).toContain('video');
  });

  it('saves new values and keeps them on the device for Pitchside', async () => {
    await (await input(/timingBiasS/)).setValue('0.15');
    await (await input(/timingSdS/)).setValue('0.05');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save timing' }))).click();
    const put = backend.expectOne({ method: 'PUT', url: '/api/club/settings' });
    expect(put.request.body).toEqual({ timingBiasS: 0.15, timingSdS: 0.05 });
    put.flush({ timingBiasS: 0.15, timingSdS: 0.05, distanceUnit: 'm', locale: 'en-GB' });
    await until('the saved message', () => text().includes('Saved.'));
    expect(TestBed.inject(ClubSettingsStore).settings()).toEqual({
      timingBiasS: 0.15,
      timingSdS: 0.05,
      distanceUnit: 'm',
      locale: 'en-GB',
    });
  });

  it('refuses a spread outside the bounds before sending, and shows the server’s field error', async () => {
    await (await input(/timingSdS/)).setValue('0.9');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save timing' }))).click();
    await fixture.whenStable();
    expect(text()).toContain('timingSdS must be at most 0.5 s');
    backend.expectNone({ method: 'PUT', url: '/api/club/settings' });

    await (await input(/timingSdS/)).setValue('0.1');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save timing' }))).click();
    backend.expectOne({ method: 'PUT', url: '/api/club/settings' }).flush(
      {
        error: {
          code: 'invalid',
          message: 'Club settings is not valid',
          fields: [{ field: 'timingBiasS', message: 'timingBiasS must be at most 1 s' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await until('the server’s field error', () => text().includes('timingBiasS must be at most 1 s'));
    expect(text()).toContain('Club settings is not valid');
  });
});
