import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatChipListboxChange, MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Subscription } from 'rxjs';
import { LOADING, LoadState, toLoadState } from '../core/load-state';
import { dateTimeLabel } from '../core/date-labels';
import { LoadFailure } from '../ui/load-failure';
import { AdminApi, type OutboxMail, type OutboxStatus } from './admin-api';
import { DigestRun } from '../ui/digest-run';

/** Which mails the table shows. */
type OutboxFilter = OutboxStatus | 'all';

const STATUS_LABELS: Record<OutboxStatus, string> = { queued: 'Queued', sent: 'Sent', failed: 'Failed' };

/** Mail kinds as the server names them, worded for people. */
const KIND_LABELS: Record<OutboxMail['kind'], string> = {
  invite: 'Invitation',
  password_reset: 'Password reset',
  family_digest: 'Family digest',
  squad_week: 'Squad week summary',
};

function isOutboxFilter(value: unknown): value is OutboxFilter {
  return value === 'all' || value === 'queued' || value === 'sent' || value === 'failed';
}

/** The outbox row, worded once. */
interface OutboxRow {
  readonly mail: OutboxMail;
  readonly kind: string;
  readonly status: string;
  readonly attempts: string;
  readonly created: string;
  readonly sent: string | null;
}

/**
 * Club admin's outbox: every mail the server tried to send and whether it went. Failed mail
 * is why a guardian "never got the invitation", so failures sort to the eye with their last
 * error and attempt count, and a filter shows them alone.
 */
@Component({
  selector: 'll-outbox-view',
  imports: [MatButtonModule, MatChipsModule, MatIconModule, MatProgressBarModule, MatTableModule, LoadFailure, DigestRun],
  templateUrl: './outbox-view.html',
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxView {
  private readonly api = inject(AdminApi);
  private readonly destroyRef = inject(DestroyRef);
  private request: Subscription | null = null;

  protected readonly columns = ['mail', 'status', 'error', 'when'];
  protected readonly outbox = signal<LoadState<OutboxMail[]>>(LOADING);
  protected readonly filter = signal<OutboxFilter>('all');
  protected readonly counts = computed(() => {
    const state = this.outbox();
    const mails = state.status === 'ready' ? state.value : [];
    return {
      all: mails.length,
      queued: mails.filter((mail) => mail.status === 'queued').length,
      sent: mails.filter((mail) => mail.status === 'sent').length,
      failed: mails.filter((mail) => mail.status === 'failed').length,
    };
  });
  protected readonly rows = computed<OutboxRow[]>(() => {
    const state = this.outbox();
    const shown = this.filter();
    return (state.status === 'ready' ? state.value : [])
      .filter((mail) => shown === 'all' || mail.status === shown)
      .map((mail) => ({
        mail,
        kind: KIND_LABELS[mail.kind] ?? mail.kind,
        status: STATUS_LABELS[mail.status],
        attempts: mail.attempts === 1 ? '1 attempt' : `${mail.attempts} attempts`,
        created: dateTimeLabel(mail.createdAt),
        sent: mail.sentAt === null ? null : dateTimeLabel(mail.sentAt),
      }));
  });

  constructor() {
    this.load();
  }

  protected load(): void {
    this.request?.unsubscribe();
    this.request = this.api
      .listOutbox()
      .pipe(toLoadState(), takeUntilDestroyed(this.destroyRef))
      .subscribe((state) => {
        // Keep the table on screen while a refresh is on its way.
        if (state.status !== 'loading' || this.outbox().status !== 'ready') {
          this.outbox.set(state);
        }
      });
  }

  protected showOnly(change: MatChipListboxChange): void {
    const value: unknown = change.value;
    // A second tap on the selected chip deselects it: fall back to everything.
    this.filter.set(isOutboxFilter(value) ? value : 'all');
  }
}
