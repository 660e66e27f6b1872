import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { ConsentPanel } from './consent-panel';
import type { ConsentText, GuardianLinkView } from '../core/guardians/guardian-api';
import { SPEC_CONSENT_TEXT, specConsentedLink, specLink } from '../core/guardians/spec-fixtures';

/** Plays Guardian home's part: holds the link and takes the panel's updates. */
@Component({
  imports: [ConsentPanel],
  template: `<ll-consent-panel
    [link]="link()"
    [consentText]="text()"
    (changed)="link.set($event)"
    (textOutdated)="outdatedCount.set(outdatedCount() + 1)"
  />`,
})
class Host {
  readonly link = signal<GuardianLinkView>(specLink());
  readonly text = signal<ConsentText | null>(SPEC_CONSENT_TEXT);
  readonly outdatedCount = signal(0);
}

describe('ConsentPanel', () => {
  let fixture: ComponentFixture<Host>;
  let loader: HarnessLoader;
  let overlay: HarnessLoader;
  let backend: HttpTestingController;

  async function open(link: GuardianLinkView, text: ConsentText | null = SPEC_CONSENT_TEXT): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Host);
    fixture.componentInstance.link.set(link);
    fixture.componentInstance.text.set(text);
    loader = TestbedHarnessEnvironment.loader(fixture);
    overlay = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await fixture.whenStable();
  }

  const text = (): string => (fixture.nativeElement as HTMLElement).textContent?.replace(/\s+/g, ' ') ?? '';
  const button = (label: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text: label }));
  const digestToggle = () => loader.getHarness(MatSlideToggleHarness);
  const link = () => fixture.componentInstance.link();
  const consentUrl = `/api/guardians/links/${specLink().id}/consent`;
  const digestUrl = `/api/guardians/links/${specLink().id}/digest`;

  afterEach(() => backend.verify());

  it('shows the consent text with its version, and keeps the digest off limits until consent is recorded', async () => {
    await open(specLink());

    expect(text()).toContain('No consent recorded.');
    expect(text()).toContain(`Consent text, version ${SPEC_CONSENT_TEXT.version}`);
    expect(text()).toContain(SPEC_CONSENT_TEXT.text);
    const toggle = await digestToggle();
    expect(await toggle.isDisabled()).toBeTrue();
    expect(await toggle.isChecked()).toBeFalse();
    expect(text()).toContain('The digest can only be turned on once your consent is recorded');
  });

  it('asks to confirm having read the text before recording anything', async () => {
    await open(specLink());
    await (await button(/I consent/)).click();

    expect(text()).toContain('Tick the box to confirm you have read the text.');
    backend.expectNone(consentUrl);
  });

  it('records consent with the version shown, then says who recorded it and when, and frees the digest toggle', async () => {
    await open(specLink());
    await (await loader.getHarness(MatCheckboxHarness)).check();
    await (await button(/I consent/)).click();

    const request = backend.expectOne(consentUrl);
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ consent: true, textVersion: SPEC_CONSENT_TEXT.version });
    expect(await (await button(/Recording/)).isDisabled()).toBeTrue();
    request.flush({ link: specConsentedLink() });
    await fixture.whenStable();

    expect(text()).toContain('Consent recorded on 20 Nov 2026');
    expect(text()).toContain('by Morgan Reyes (consent text version 2026-12-01)');
    expect(await (await digestToggle()).isDisabled()).toBeFalse();
    expect(text()).toContain('Consent alone sends nothing');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /I consent/ }))).toEqual([]);
  });

  it('withdraws consent only after confirmation, and not when the guardian keeps it', async () => {
    await open(specConsentedLink({ digestOptIn: true }));

    await (await button('Withdraw consent')).click();
    const keep = await overlay.getHarness(MatDialogHarness);
    expect(await keep.getTitleText()).toBe('Withdraw consent?');
    expect(await keep.getContentText()).toContain('stop sending you the Family digest about Nia');
    await (await keep.getHarness(MatButtonHarness.with({ text: 'Keep it' }))).click();
    await fixture.whenStable();
    backend.expectNone(consentUrl);

    await (await button('Withdraw consent')).click();
    const confirm = await overlay.getHarness(MatDialogHarness);
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Withdraw consent' }))).click();
    await fixture.whenStable();
    const request = backend.expectOne(consentUrl);
    expect(request.request.body).toEqual({ consent: false });
    request.flush({ link: specConsentedLink({ consentAt: null, consentWithdrawnAt: '2026-11-27T12:00:00.000Z', digestOptIn: false }) });
    await fixture.whenStable();

    expect(text()).toContain('Consent withdrawn on 27 Nov 2026');
    const toggle = await digestToggle();
    expect(await toggle.isDisabled()).toBeTrue();
    expect(await toggle.isChecked()).toBeFalse();
  });

  it('turns the digest on and off through the server', async () => {
    await open(specConsentedLink());
    await (await digestToggle()).toggle();

    const on = backend.expectOne(digestUrl);
    expect(on.request.method).toBe('PUT');
    expect(on.request.body).toEqual({ optIn: true });
    on.flush({ link: specConsentedLink({ digestOptIn: true }) });
    await fixture.whenStable();
    expect(link().digestOptIn).toBeTrue();
    expect(await (await digestToggle()).isChecked()).toBeTrue();

    await (await digestToggle()).toggle();
    const off = backend.expectOne(digestUrl);
    expect(off.request.body).toEqual({ optIn: false });
    off.flush({ link: specConsentedLink({ digestOptIn: false }) });
    await fixture.whenStable();
    expect(await (await digestToggle()).isChecked()).toBeFalse();
  });

  it("puts the toggle back and shows the server's reason when the digest cannot be turned on", async () => {
    await open(specConsentedLink());
    await (await digestToggle()).toggle();

    backend
      .expectOne(digestUrl)
      .flush(
        { error: { code: 'consent_required', message: 'Give consent first: the digest is only sent with recorded consent' } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();

    expect(await (await digestToggle()).isChecked()).toBeFalse();
    expect(text()).toContain('Give consent first: the digest is only sent with recorded consent');
    expect(link().digestOptIn).toBeFalse();
  });

  it('asks for consent again when the text has a newer version than the one agreed to', async () => {
    await open(specConsentedLink({ consentTextVersion: '2025-01-15' }));

    expect(text()).toContain('The consent text has changed since you agreed to it');
    expect(await (await button(/I consent/)).isDisabled()).toBeFalse();
    expect(await (await button('Withdraw consent')).isDisabled()).toBeFalse();
  });

  it('asks the page for the current text when the server says the one shown is outdated', async () => {
    await open(specLink());
    await (await loader.getHarness(MatCheckboxHarness)).check();
    await (await button(/I consent/)).click();

    backend.expectOne(consentUrl).flush(
      {
        error: {
          code: 'invalid',
          message: 'The consent text has changed; read the current text and consent again',
          fields: [{ field: 'textVersion', message: 'Current version is 2027-01-01' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(text()).toContain('The consent text has changed; read the current text and consent again');
    expect(fixture.componentInstance.outdatedCount()).toBe(1);
    expect(link().consentAt).toBeNull();
  });

  it('does not offer consent while the text could not be loaded', async () => {
    await open(specLink(), null);

    expect(text()).toContain('The consent text could not be loaded, so consent cannot be recorded right now.');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /I consent/ }))).toEqual([]);
  });
});
