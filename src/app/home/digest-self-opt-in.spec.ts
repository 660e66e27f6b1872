import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { DigestSelfOptIn } from './digest-self-opt-in';

describe('DigestSelfOptIn', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('shows the stored choice and records a change', async () => {
    const fixture = TestBed.createComponent(DigestSelfOptIn);
    http.expectOne('/api/me/digest-opt-in').flush({ optIn: false });
    const toggle = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSlideToggleHarness);
    expect(await toggle.isChecked()).toBeFalse();
    await toggle.toggle();
    const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/me/digest-opt-in');
    expect(put.request.body).toEqual({ optIn: true });
    put.flush({ optIn: true });
    await fixture.whenStable();
    expect(await toggle.isChecked()).toBeTrue();
  });

  it('puts the toggle back and says why when the server refuses', async () => {
    const fixture = TestBed.createComponent(DigestSelfOptIn);
    http.expectOne('/api/me/digest-opt-in').flush({ optIn: false });
    const toggle = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSlideToggleHarness);
    await toggle.toggle();
    http
      .expectOne((r) => r.method === 'PUT')
      .flush({ error: { code: 'forbidden', message: 'Your role does not allow this' } }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(await toggle.isChecked()).toBeFalse();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Your role does not allow this');
  });
});
