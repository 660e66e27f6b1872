import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { Ground } from '../core/ground-api';
import { compassPoint, GroundList } from './ground-list';

const longmere: Ground = {
  id: '3c9f1a7e-2b4d-4e6f-8a1b-5c7d9e0f1a31',
  name: 'Longmere Lane',
  latitude: 52.7713,
  longitude: -1.5528,
  altitudeM: 88,
  kickingBearingDeg: 205,
};

describe('GroundList (Club admin)', () => {
  let fixture: ComponentFixture<GroundList>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(GroundList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/grounds').flush({ grounds: [longmere] });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const input = async (label: string) =>
    (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness);
  const text = (): string => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');

  it('lists the grounds with the kicking direction as a compass point', async () => {
    const rows = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(rows['name']?.text).toEqual(['Longmere Lane']);
    expect(rows['bearing']?.text).toEqual(['205° (SSW)']);
    // The 16-point compass rose: 22.5° per point, 0° north (common practice).
    expect([0, 90, 180, 270, 349, 11.2, 11.3].map(compassPoint)).toEqual(['N', 'E', 'S', 'W', 'N', 'N', 'NNE']);
  });

  it('adds a ground and checks the fields before sending', async () => {
    await (await input('Name'))?.setValue('Hollin Moor');
    await (await input('Latitude (°)'))?.setValue('95');
    await (await input('Longitude (°)'))?.setValue('-2.1');
    await (await input('Altitude (m above sea level)'))?.setValue('240');
    await (await input('Kicking direction (° from north)'))?.setValue('90');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add the ground/ }))).click();
    backend.expectNone('/api/grounds');
    expect(text()).toContain('latitude must be at most 90°');

    await (await input('Latitude (°)'))?.setValue('53.5');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add the ground/ }))).click();
    const request = backend.expectOne({ method: 'POST', url: '/api/grounds' });
    expect(request.request.body).toEqual({ name: 'Hollin Moor', latitude: 53.5, longitude: -2.1, altitudeM: 240, kickingBearingDeg: 90 });
    request.flush({ id: '3c9f1a7e-2b4d-4e6f-8a1b-5c7d9e0f1a32', ...request.request.body });
    await fixture.whenStable();
    expect(text()).toContain('Hollin Moor is added.');
    backend.expectOne('/api/grounds').flush({ grounds: [longmere] });
  });

  it('corrects a ground and shows the server’s reason under the field', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Correct' }))).click();
    expect(await (await input('Kicking direction (° from north)'))?.getValue()).toBe('205');
    await (await input('Kicking direction (° from north)'))?.setValue('200');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save the correction/ }))).click();
    const request = backend.expectOne({ method: 'PUT', url: `/api/grounds/${longmere.id}` });
    request.flush(
      {
        error: {
          code: 'invalid',
          message: 'Training ground is invalid — name: name is required',
          fields: [{ field: 'name', message: 'name is required' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(text()).toContain('Training ground is invalid — name: name is required');
  });
});
