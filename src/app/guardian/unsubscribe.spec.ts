import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { authInterceptor } from '../core/auth/auth-interceptor';
import { AuthSession } from '../core/auth/auth-session';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { SPEC_COACH, signedInStorage } from '../core/spec-support';
import { Unsubscribe } from './unsubscribe';

const TOKEN = 'signed.unsubscribe.token-0123456789';

describe('Unsubscribe', () => {
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  async function open(url = `/unsubscribe?token=${TOKEN}`): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        // Someone is signed in on this device: the public call must still go without their token.
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        provideRouter([{ path: 'unsubscribe', component: Unsubscribe }], withComponentInputBinding()),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create(url);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  const text = (): string => (harness.routeNativeElement?.textContent ?? '').replace(/\s+/g, ' ');
  const stop = () => loader.getHarness(MatButtonHarness.with({ text: 'Stop the Family digest' }));
  const isUnsubscribe = (request: { url: string }) => request.url === '/api/digests/unsubscribe';

  afterEach(() => backend.verify());

  it('explains first and does nothing until the button is pressed', async () => {
    await open();
    expect(text()).toContain('This stops the weekly Family digest e-mail');
    expect(text()).toContain('your consent record stays as it is');
    backend.expectNone(isUnsubscribe);
  });

  it('stops the digest with the token from the link, without a bearer, and names the child', async () => {
    await open();
    await (await stop()).click();

    const request = backend.expectOne(isUnsubscribe);
    expect(request.request.method).toBe('POST');
    expect(request.request.params.get('token')).toBe(TOKEN);
    expect(request.request.headers.has('Authorization')).toBeFalse();
    request.flush({ unsubscribed: true, firstName: 'Nia' });
    await harness.fixture.whenStable();

    expect(text()).toContain('Done. You will not receive the Family digest about Nia any more.');
  });

  it("shows the server's reason for a bad link and never tries to refresh anyone's session", async () => {
    await open();
    await (await stop()).click();
    backend
      .expectOne(isUnsubscribe)
      .flush(
        { error: { code: 'unsubscribe_invalid', message: 'This unsubscribe link is not valid or has expired' } },
        { status: 400, statusText: 'Bad Request' },
      );
    await harness.fixture.whenStable();
    expect(text()).toContain('This unsubscribe link is not valid or has expired');

    await (await stop()).click();
    backend.expectOne(isUnsubscribe).flush({ error: { code: 'unauthorized', message: 'No' } }, { status: 401, statusText: 'Unauthorized' });
    await harness.fixture.whenStable();
    backend.expectNone('/api/auth/refresh');
    expect(TestBed.inject(AuthSession).isSignedIn()).toBeTrue();
  });

  it('says the link is incomplete without a token', async () => {
    await open('/unsubscribe');
    expect(text()).toContain('This unsubscribe link is incomplete.');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Stop the Family digest' }))).toEqual([]);
  });
});
