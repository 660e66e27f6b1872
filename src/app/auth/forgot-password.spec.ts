import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import { UNREACHABLE_MESSAGE } from '../core/api-error';
import { ForgotPassword, RESET_REQUESTED_MESSAGE } from './forgot-password';

describe('ForgotPassword', () => {
  let fixture: ComponentFixture<ForgotPassword>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ForgotPassword);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const text = (): string => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
  const emailField = () => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }));

  async function ask(email: string): Promise<void> {
    await (await (await emailField()).getControl(MatInputHarness))?.setValue(email);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send me a link' }))).click();
  }

  it('sends the address and shows the neutral message, ignoring what the server says about it', async () => {
    await ask(' Coach@Example.org ');
    const request = backend.expectOne('/api/auth/forgot-password');
    expect(request.request.body).toEqual({ email: 'coach@example.org' });
    request.flush({ message: 'Something that differs per account' }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();

    expect(text()).toContain(RESET_REQUESTED_MESSAGE);
    expect(text()).not.toContain('Something that differs per account');
  });

  it('rejects a malformed address without asking the server', async () => {
    await ask('coach@');
    expect(await (await emailField()).getTextErrors()).toEqual(['Not a valid e-mail address']);
    backend.expectNone('/api/auth/forgot-password');
  });

  it('shows failures that say nothing about the account, such as no connection', async () => {
    await ask('coach@example.org');
    backend.expectOne('/api/auth/forgot-password').error(new ProgressEvent('error'));
    await fixture.whenStable();

    expect(text()).toContain(UNREACHABLE_MESSAGE);
    expect(text()).not.toContain(RESET_REQUESTED_MESSAGE);
  });
});
