import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { AuthTokens } from '../../../shared/schemas/auth';
import { authInterceptor } from '../core/auth/auth-interceptor';
import { AuthSession } from '../core/auth/auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { AcceptInvite } from './accept-invite';

@Component({ template: '<p>home</p>' })
class Landing {}

const TOKEN = 'invite-token-0123456789abcdef';
const invite = { email: 'new.coach@example.org', displayName: 'Sam Okoro', role: 'assistant_coach' as const };
function tokens(n: number): AuthTokens {
  return {
    accessToken: `access-${n}`,
    refreshToken: `refresh-token-number-${n}`,
    user: { id: 'user-new', email: invite.email, displayName: invite.displayName, role: 'assistant_coach', clubId: 'club-1' },
  };
}

describe('AcceptInvite', () => {
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  async function open(url = `/accept-invite?token=${TOKEN}`): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: new MemoryStorage() },
        provideRouter(
          [
            { path: 'accept-invite', component: AcceptInvite },
            { path: 'home', component: Landing },
            { path: 'sign-in', component: Landing },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create(url);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  const text = (): string => (harness.routeNativeElement?.textContent ?? '').replace(/\s+/g, ' ');
  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const submit = () => loader.getHarness(MatButtonHarness.with({ text: /Set(ting)? (your )?password/ }));

  async function fill(password: string, confirm: string): Promise<void> {
    await (await (await field('New password')).getControl(MatInputHarness))?.setValue(password);
    await (await (await field('Repeat the new password')).getControl(MatInputHarness))?.setValue(confirm);
  }

  async function answerInvite(): Promise<void> {
    const lookup = backend.expectOne((request) => request.url === '/api/auth/invite');
    expect(lookup.request.params.get('token')).toBe(TOKEN);
    expect(lookup.request.headers.has('Authorization')).toBeFalse();
    lookup.flush(invite);
    await harness.fixture.whenStable();
  }

  afterEach(() => backend.verify());

  it('shows who the invitation is for before asking for a password', async () => {
    await open();
    await answerInvite();

    expect(text()).toContain('Sam Okoro');
    expect(text()).toContain('new.coach@example.org');
    expect(text()).toContain('Assistant coach');
  });

  it('asks for at least 10 characters, typed the same twice, before sending anything', async () => {
    await open();
    await answerInvite();
    await fill('short', 'short');
    await (await submit()).click();
    expect(await (await field('New password')).getTextErrors()).toEqual(['Use at least 10 characters']);

    await fill('long enough pass', 'long enough pasS');
    await (await submit()).click();
    expect(await (await field('Repeat the new password')).getTextErrors()).toEqual(['The two passwords are not the same']);
    backend.expectNone('/api/auth/accept-invite');
  });

  it('sets the password, signs in through AuthSession and goes home', async () => {
    await open();
    await answerInvite();
    await fill('kestrel lofted ball', 'kestrel lofted ball');
    await (await submit()).click();

    const accept = backend.expectOne('/api/auth/accept-invite');
    expect(accept.request.body).toEqual({ token: TOKEN, password: 'kestrel lofted ball' });
    accept.flush(tokens(1));
    await harness.fixture.whenStable();
    const login = backend.expectOne('/api/auth/login');
    expect(login.request.body).toEqual({ email: invite.email, password: 'kestrel lofted ball' });
    login.flush(tokens(2));
    await harness.fixture.whenStable();
    // The pair from the acceptance is not kept, so it is revoked rather than left valid.
    const logout = backend.expectOne('/api/auth/logout');
    expect(logout.request.body).toEqual({ refreshToken: 'refresh-token-number-1' });
    expect(logout.request.headers.get('Authorization')).toBe('Bearer access-1');
    logout.flush(null, { status: 204, statusText: 'No Content' });
    await harness.fixture.whenStable();

    const session = TestBed.inject(AuthSession);
    expect(session.isSignedIn()).toBeTrue();
    expect(session.accessToken()).toBe('access-2');
    expect(TestBed.inject(Router).url).toBe('/home');
  });

  it("puts the server's password complaint under the password field", async () => {
    await open();
    await answerInvite();
    await fill('aaaaaaaaaaaa', 'aaaaaaaaaaaa');
    await (await submit()).click();
    backend
      .expectOne('/api/auth/accept-invite')
      .flush(
        { error: { code: 'invalid', message: 'Check the password', fields: [{ field: 'password', message: 'password is too common' }] } },
        { status: 400, statusText: 'Bad Request' },
      );
    await harness.fixture.whenStable();

    expect(await (await field('New password')).getTextErrors()).toEqual(['password is too common']);
    expect(text()).toContain('Check the password');
    expect(TestBed.inject(AuthSession).isSignedIn()).toBeFalse();
  });

  it("says why an expired or used invitation cannot be accepted, in the server's words", async () => {
    await open();
    backend
      .expectOne((request) => request.url === '/api/auth/invite')
      .flush({ error: { code: 'invite_expired', message: 'This invitation has expired' } }, { status: 400, statusText: 'Bad Request' });
    await harness.fixture.whenStable();

    expect(text()).toContain('This invitation has expired');
    expect(text()).toContain('Ask your club administrator to send a new one.');
    expect(await loader.getAllHarnesses(MatFormFieldHarness)).toEqual([]);
  });

  it('says the link is incomplete when it has no token, without asking the server', async () => {
    await open('/accept-invite');

    expect(text()).toContain('This invitation link is incomplete.');
    backend.expectNone((request) => request.url === '/api/auth/invite');
  });

  it('tells the user to sign in by hand when the password is set but signing in fails', async () => {
    await open();
    await answerInvite();
    await fill('kestrel lofted ball', 'kestrel lofted ball');
    await (await submit()).click();
    backend.expectOne('/api/auth/accept-invite').flush(tokens(1));
    await harness.fixture.whenStable();
    backend.expectOne('/api/auth/login').error(new ProgressEvent('error'));
    await harness.fixture.whenStable();
    backend.expectOne('/api/auth/logout').flush(null, { status: 204, statusText: 'No Content' });

    expect(text()).toContain('Your password is set and your account is ready.');
    expect(TestBed.inject(Router).url).toContain('/accept-invite');
  });
});
