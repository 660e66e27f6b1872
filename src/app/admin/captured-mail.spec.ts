import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatNavListHarness } from '@angular/material/list/testing';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { dateTimeLabel } from '../core/date-labels';
import { CapturedMail } from './captured-mail';
import type { CapturedMailMessage, CapturedMailSummary } from './captured-mail-api';

const inviteSummary: CapturedMailSummary = {
  id: '5f1d8c2e-0a51-4d6c-8f7e-1b2c3d4e5f01',
  from: 'Loftline <no-reply@loftline.test>',
  to: ['new.coach@example.org'],
  subject: 'You are invited to Loftline',
  receivedAt: '2026-11-30T12:05:00.000Z',
};
const digestSummary: CapturedMailSummary = {
  id: '5f1d8c2e-0a51-4d6c-8f7e-1b2c3d4e5f02',
  from: 'Loftline <no-reply@loftline.test>',
  to: ['guardian@example.org'],
  subject: 'Family digest: Nia’s week',
  receivedAt: '2026-11-30T12:00:00.000Z',
};
const inviteMessage: CapturedMailMessage = {
  ...inviteSummary,
  text: 'Set your password here: http://localhost:4300/accept-invite?token=abc123. The link works for 7 days.',
  html: '<p style="color:#1b2a41">Set your password <a href="http://localhost:4300/accept-invite?token=abc123">here</a>.</p><script>parent.document.title = "pwned"</script>',
  headers: { 'message-id': '<invite-1@loftline.test>', 'content-type': 'multipart/alternative' },
};

describe('CapturedMail', () => {
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  async function open(url: string): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'admin/mail', component: CapturedMail }], withComponentInputBinding()),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create(url);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  const root = (): HTMLElement => harness.routeNativeElement as HTMLElement;
  const text = (): string => root().textContent?.replace(/\s+/g, ' ') ?? '';
  /** The reader's envelope and header lines as "name: value". */
  const envelope = (): string[] =>
    Array.from(root().querySelectorAll('ll-mail-reader dl div')).map(
      (row) => `${row.querySelector('dt')?.textContent?.trim()}: ${row.querySelector('dd')?.textContent?.trim()}`,
    );

  afterEach(() => backend.verify());

  it('lists captured messages newest first with subject, recipients and time', async () => {
    await open('/admin/mail');
    backend.expectOne('/api/dev/mail').flush({ messages: [inviteSummary, digestSummary] });
    await harness.fixture.whenStable();

    const list = await loader.getHarness(MatNavListHarness);
    const items = await list.getItems();
    expect(await Promise.all(items.map((item) => item.getTitle()))).toEqual(['You are invited to Loftline', 'Family digest: Nia’s week']);
    expect(await items[0]?.getSecondaryText()).toBe('To new.coach@example.org');
    expect(await items[0]?.getHref()).toBe(`/admin/mail?message=${inviteSummary.id}`);
    expect(text()).toContain('Captured mail (2)');
    expect(text()).toContain('Choose a message to read it.');
  });

  it('opens a message with its headers, its text with clickable links, and its HTML in a sandboxed frame', async () => {
    await open('/admin/mail');
    backend.expectOne('/api/dev/mail').flush({ messages: [inviteSummary, digestSummary] });
    await harness.fixture.whenStable();
    await (await (await loader.getHarness(MatNavListHarness)).getItems())[0]?.click();
    await harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe(`/admin/mail?message=${inviteSummary.id}`);
    backend.expectOne(`/api/dev/mail/${inviteSummary.id}`).flush({ message: inviteMessage });
    await harness.fixture.whenStable();

    expect(envelope()).toEqual([
      'From: Loftline <no-reply@loftline.test>',
      'To: new.coach@example.org',
      `Received: ${dateTimeLabel(inviteSummary.receivedAt)}`,
      'message-id: <invite-1@loftline.test>',
      'content-type: multipart/alternative',
    ]);
    expect(text()).toContain('All headers (2)');

    const frame = root().querySelector('iframe');
    expect(frame).not.toBeNull();
    // Every sandbox permission withheld: no scripts, no same-origin access, no forms, no pop-ups.
    expect(frame?.getAttribute('sandbox')).toBe('');
    expect(frame?.sandbox.length).toBe(0);
    const srcdoc = frame?.getAttribute('srcdoc') ?? '';
    expect(srcdoc).toContain('<p style="color:#1b2a41">Set your password');
    expect(srcdoc).toContain("default-src 'none'");
    // Give the frame time to load and run its script, if the sandbox let it.
    await new Promise<void>((done) => {
      frame?.addEventListener('load', () => done(), { once: true });
      setTimeout(done, 1000);
    });
    expect(document.title).not.toBe('pwned');

    const tabs = await loader.getHarness(MatTabGroupHarness);
    expect(await Promise.all((await tabs.getTabs()).map((tab) => tab.getLabel()))).toEqual(['HTML', 'Text']);
    await tabs.selectTab({ label: 'Text' });
    await harness.fixture.whenStable();
    const link = root().querySelector<HTMLAnchorElement>('.reader__text a');
    expect(link?.href).toBe('http://localhost:4300/accept-invite?token=abc123');
    expect(link?.rel).toBe('noopener noreferrer');
    expect(root().querySelector('.reader__text')?.textContent).toContain('The link works for 7 days.');
  });

  it('shows a text-only message without a frame', async () => {
    await open(`/admin/mail?message=${digestSummary.id}`);
    backend.expectOne('/api/dev/mail').flush({ messages: [inviteSummary, digestSummary] });
    await harness.fixture.whenStable();
    backend
      .expectOne(`/api/dev/mail/${digestSummary.id}`)
      .flush({ message: { ...digestSummary, text: 'Nia logged 40 reps.', html: null, headers: {} } });
    await harness.fixture.whenStable();

    expect(root().querySelector('iframe')).toBeNull();
    expect(text()).toContain('This message has no HTML part.');
    expect(text()).toContain('Nia logged 40 reps.');
  });

  it('explains, instead of failing, when the server runs without the fake mail server', async () => {
    await open('/admin/mail');
    backend
      .expectOne('/api/dev/mail')
      .flush({ error: { code: 'not_found', message: 'No such API route' } }, { status: 404, statusText: 'Not Found' });
    await harness.fixture.whenStable();

    expect(text()).toContain('The fake mail server is not active');
    expect(text()).toContain('This server sends real mail');
    expect(text()).not.toContain('No such API route');
    expect(root().querySelector('[role="alert"]')).toBeNull();
  });

  it('says a message is gone when the server no longer has it, and shows other failures with a retry', async () => {
    await open(`/admin/mail?message=${inviteSummary.id}`);
    backend.expectOne('/api/dev/mail').flush({ messages: [] });
    await harness.fixture.whenStable();
    backend
      .expectOne(`/api/dev/mail/${inviteSummary.id}`)
      .flush({ error: { code: 'not_found', message: 'No such captured message' } }, { status: 404, statusText: 'Not Found' });
    await harness.fixture.whenStable();
    expect(text()).toContain('This message is no longer captured.');

    await harness.navigateByUrl(`/admin/mail?message=${digestSummary.id}`);
    backend
      .expectOne(`/api/dev/mail/${digestSummary.id}`)
      .flush({ error: { code: 'internal', message: 'Database is locked' } }, { status: 500, statusText: 'Server Error' });
    await harness.fixture.whenStable();
    expect(text()).toContain('The message could not be loaded.');
    expect(text()).toContain('Database is locked');
  });
});
