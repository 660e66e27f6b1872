import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatChipListboxHarness } from '@angular/material/chips/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { OutboxMail } from './admin-api';
import { OutboxView } from './outbox-view';

const sent: OutboxMail = {
  id: 'm-1',
  kind: 'invite',
  toAddress: 'sam@example.org',
  subject: 'You are invited to Loftline',
  status: 'sent',
  attempts: 1,
  lastError: null,
  createdAt: '2026-11-30T12:00:00.000Z',
  sentAt: '2026-11-30T12:00:05.000Z',
};
const failed: OutboxMail = {
  id: 'm-2',
  kind: 'family_digest',
  toAddress: 'kim@example.org',
  subject: 'Family digest: Ada’s week',
  status: 'failed',
  attempts: 3,
  lastError: '550 mailbox unavailable',
  createdAt: '2026-11-30T12:01:00.000Z',
  sentAt: null,
};

describe('OutboxView', () => {
  let fixture: ComponentFixture<OutboxView>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(OutboxView);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/admin/outbox').flush({ mails: [failed, sent] });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const text = (): string => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
  const cells = async () => (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();

  it('shows each mail with its status, attempts and last error', async () => {
    const rows = await cells();
    expect(rows['mail']?.text).toEqual([
      'Family digest: Ada’s weekFamily digest · to kim@example.org',
      'You are invited to LoftlineInvitation · to sam@example.org',
    ]);
    expect(rows['status']?.text).toEqual(['Failed3 attempts', 'Sent1 attempt']);
    expect(rows['error']?.text).toEqual(['550 mailbox unavailable', '–']);
  });

  it('shows only failed mail on request', async () => {
    const chips = await (await loader.getHarness(MatChipListboxHarness)).getChips();
    expect(await Promise.all(chips.map((chip) => chip.getText()))).toEqual(['All (2)', 'Failed (1)', 'Queued (0)', 'Sent (1)']);
    await chips[1]?.select();
    expect((await cells())['mail']?.text).toEqual(['Family digest: Ada’s weekFamily digest · to kim@example.org']);
    await chips[2]?.select();
    expect(text()).toContain('No mail with this status.');
    await chips[2]?.deselect();
    expect((await cells())['mail']?.text.length).toBe(2);
  });

  it('sends the digests now, shows the counts and reloads the outbox', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Send digests now/ }))).click();
    const run = backend.expectOne('/api/digests/run');
    expect(run.request.method).toBe('POST');
    expect(run.request.body).toEqual({});
    run.flush({ weekStart: '2026-11-23', familySent: 12, familySkipped: 7, squadWeekSent: 2 });
    await fixture.whenStable();

    expect(text()).toContain('Week of 23 Nov 2026: 12 Family digests sent, 7 skipped');
    expect(text()).toContain('2 Squad week summaries sent.');
    backend.expectOne('/api/admin/outbox').flush({ mails: [failed, sent] });
  });

  it("shows the server's reason when the digests cannot be sent", async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Send digests now/ }))).click();
    backend
      .expectOne('/api/digests/run')
      .flush(
        { error: { code: 'forbidden', message: 'Only admins and head coaches can send digests' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();
    expect(text()).toContain('Only admins and head coaches can send digests');
  });
});
