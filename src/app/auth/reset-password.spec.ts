import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { ResetPassword } from './reset-password';

const TOKEN = 'reset-token-0123456789abcdef';

describe('ResetPassword', () => {
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  async function open(url = `/reset-password?token=${TOKEN}`): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'reset-password', component: ResetPassword }], withComponentInputBinding()),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create(url);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  const text = (): string => (harness.routeNativeElement?.textContent ?? '').replace(/\s+/g, ' ');
  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const links = (): string[] =>
    Array.from(harness.routeNativeElement?.querySelectorAll('a') ?? []).map((a) => `${a.textContent?.trim()} → ${a.getAttribute('href')}`);

  async function save(password: string): Promise<void> {
    await (await (await field('New password')).getControl(MatInputHarness))?.setValue(password);
    await (await (await field('Repeat the new password')).getControl(MatInputHarness))?.setValue(password);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save new password' }))).click();
  }

  afterEach(() => backend.verify());

  it('saves the new password with the token, then offers sign-in', async () => {
    await open();
    await save('a brand new password');
    const request = backend.expectOne('/api/auth/reset-password');
    expect(request.request.body).toEqual({ token: TOKEN, password: 'a brand new password' });
    request.flush(null, { status: 204, statusText: 'No Content' });
    await harness.fixture.whenStable();

    expect(text()).toContain('Your password has been changed.');
    expect(links()).toContain('Go to sign in → /sign-in');
  });

  it('says a used link is spent and offers a new one', async () => {
    await open();
    await save('a brand new password');
    backend
      .expectOne('/api/auth/reset-password')
      .flush(
        { error: { code: 'reset_used', message: 'This reset link has already been used' } },
        { status: 400, statusText: 'Bad Request' },
      );
    await harness.fixture.whenStable();

    expect(text()).toContain('This reset link has already been used');
    expect(links()).toContain('Send me a new link → /forgot-password');
  });

  it("puts the server's password complaint under the password field", async () => {
    await open();
    await save('0123456789');
    backend.expectOne('/api/auth/reset-password').flush(
      {
        error: {
          code: 'invalid',
          message: 'Password reset is not valid',
          fields: [{ field: 'password', message: 'password must be at most 200 characters' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await harness.fixture.whenStable();

    expect(await (await field('New password')).getTextErrors()).toEqual(['password must be at most 200 characters']);
  });

  it('says the link is incomplete without a token', async () => {
    await open('/reset-password');
    expect(text()).toContain('This reset link is incomplete.');
    expect(await loader.getAllHarnesses(MatFormFieldHarness)).toEqual([]);
  });
});
