import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSelectHarness } from '@angular/material/select/testing';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { ClubFormat } from '../core/club-format';
import { until } from '../core/spec-support';
import { UnitsLocale } from './units-locale';

describe('UnitsLocale (Club admin)', () => {
  let fixture: ComponentFixture<UnitsLocale>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

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
    fixture = TestBed.createComponent(UnitsLocale);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend
      .expectOne({ method: 'GET', url: '/api/club/settings' })
      .flush({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'm', locale: 'en-GB' });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  it('previews yards and a decimal comma before saving, then saves them with the calibration unchanged', async () => {
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Yards' }))).check();
    const select = await loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: /\(de-DE\)/ });
    // 31.4 m = 34.34 yd (1 yd = 0.9144 m); German writes a decimal comma.
    await until('the preview', () => text().includes('34,3 yd'));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save units and locale' }))).click();
    const put = backend.expectOne({ method: 'PUT', url: '/api/club/settings' });
    expect(put.request.body).toEqual({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'yd', locale: 'de-DE' });
    put.flush({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'yd', locale: 'de-DE' });
    await until('the saved message', () => text().includes('Saved.'));
    expect(TestBed.inject(ClubFormat).format().distance(27.432)).toBe('30,0 yd');
  });
});
