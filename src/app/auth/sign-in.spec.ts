import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { AuthTokens } from '../../../shared/schemas/auth';
import { UNREACHABLE_MESSAGE } from '../core/api-error';
import { AuthSession } from '../core/auth/auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { SignIn } from './sign-in';

@Component({ template: '<p>landed</p>' })
class Landing {}

const answer: AuthTokens = {
  accessToken: 'access-1',
  refreshToken: 'refresh-token-number-1',
  user: { id: 'user-1', email: 'coach@example.org', displayName: 'Robin Coach', role: 'head_coach', clubId: 'club-1' },
};

describe('SignIn', () => {
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let session: AuthSession;

  async function open(url = '/sign-in'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: new MemoryStorage() },
        provideRouter(
          [
            { path: 'sign-in', component: SignIn },
            { path: 'home', component: Landing },
            { path: 'squads/:id', component: Landing },
          ],
          withComponentInputBinding(),
        ),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    session = TestBed.inject(AuthSession);
    harness = await RouterTestingHarness.create(url);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const submitButton = () => loader.getHarness(MatButtonHarness.with({ text: /Sign(ing)? in/ }));

  async function fill(email: string, password: string): Promise<void> {
    const emailField = await field('E-mail');
    const passwordField = await field('Password');
    const emailInput = await emailField.getControl(MatInputHarness);
    const passwordInput = await passwordField.getControl(MatInputHarness);
    await emailInput?.setValue(email);
    await passwordInput?.setValue(password);
  }

  function alertText(): string {
    return (harness.routeNativeElement?.querySelector('[role="alert"]')?.textContent ?? '').trim();
  }

  afterEach(() => backend.verify());

  it('shows what is missing when submitted empty, and sends nothing', async () => {
    await open();
    await (await submitButton()).click();

    expect(await (await field('E-mail')).getTextErrors()).toEqual(['Enter your e-mail address']);
    expect(await (await field('Password')).getTextErrors()).toEqual(['Enter your password']);
    backend.expectNone('/api/auth/login');
  });

  it('rejects a malformed e-mail address with the shared schema message', async () => {
    await open();
    const emailInput = await (await field('E-mail')).getControl(MatInputHarness);
    await emailInput?.setValue('coach@');
    await emailInput?.blur();

    expect(await (await field('E-mail')).getTextErrors()).toEqual(['Not a valid e-mail address']);
  });

  it('signs in through AuthSession, disabling the button while pending, then goes to the page asked for', async () => {
    await open('/sign-in?returnUrl=%2Fsquads%2Fu16');
    const signIn = spyOn(session, 'signIn').and.callThrough();
    await fill('  Coach@Example.org ', 'correct horse');
    await (await submitButton()).click();

    expect(signIn).toHaveBeenCalledOnceWith({ email: 'coach@example.org', password: 'correct horse' });
    expect(await (await submitButton()).isDisabled()).toBeTrue();

    backend.expectOne('/api/auth/login').flush(answer);
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/squads/u16');
    expect(session.isSignedIn()).toBeTrue();
  });

  it('goes home after sign-in when no page, or a foreign one, was asked for', async () => {
    await open('/sign-in?returnUrl=https:%2F%2Fevil.example%2F');
    await fill('coach@example.org', 'correct horse');
    await (await submitButton()).click();
    backend.expectOne('/api/auth/login').flush(answer);
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/home');
  });

  it("shows the server's message when the password is wrong, and lets the user try again", async () => {
    await open();
    await fill('coach@example.org', 'wrong');
    await (await submitButton()).click();

    backend
      .expectOne('/api/auth/login')
      .flush(
        { error: { code: 'invalid_credentials', message: 'E-mail or password is wrong' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    await harness.fixture.whenStable();

    expect(alertText()).toContain('E-mail or password is wrong');
    expect(session.isSignedIn()).toBeFalse();
    expect(await (await submitButton()).isDisabled()).toBeFalse();
    expect(TestBed.inject(Router).url).toBe('/sign-in');
  });

  it('says the server cannot be reached when the network is down', async () => {
    await open();
    await fill('coach@example.org', 'correct horse');
    await (await submitButton()).click();

    backend.expectOne('/api/auth/login').error(new ProgressEvent('error'));
    await harness.fixture.whenStable();

    expect(alertText()).toContain(UNREACHABLE_MESSAGE);
  });

  it("puts the server's field errors under the fields they concern", async () => {
    await open();
    await fill('coach@example.org', 'x');
    await (await submitButton()).click();

    backend.expectOne('/api/auth/login').flush(
      {
        error: {
          code: 'invalid',
          message: 'Check the highlighted fields',
          fields: [{ field: 'password', message: 'Password is too long' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await harness.fixture.whenStable();

    expect(await (await field('Password')).getTextErrors()).toEqual(['Password is too long']);
    expect(alertText()).toContain('Check the highlighted fields');
  });

  it('offers a way to reset a forgotten password', async () => {
    await open();
    const link = harness.routeNativeElement?.querySelector<HTMLAnchorElement>('a.sign-in__forgot');
    expect(link?.textContent?.trim()).toBe('Forgot your password?');
    expect(link?.getAttribute('href')).toBe('/forgot-password');
  });

  it('shows and hides the password on request', async () => {
    await open();
    const toggle = await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Show password"]' }));
    const passwordInput = await (await field('Password')).getControl(MatInputHarness);
    expect(await passwordInput?.getType()).toBe('password');
    await toggle.click();
    expect(await passwordInput?.getType()).toBe('text');
  });
});
