import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { finalize } from 'rxjs';
import { describeApiError } from '../core/api-error';
import { dateLabel } from '../core/date-labels';
import { DigestApi, type DigestRunResult } from '../core/guardians/digest-api';

/**
 * "Send digests now": runs the weekly Family digest and Squad week summary job at once, for an
 * admin (or head coach) who fixed consent or links and does not want to wait for Monday. The
 * job skips what was already sent this week, so pressing twice sends nothing twice; the counts
 * say what happened. Standalone so the Squad week screen can place it for head coaches too.
 */
@Component({
  selector: 'll-digest-run',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="digest-run__head">
      <div>
        <h2 class="digest-run__title">Weekly digests</h2>
        <p class="digest-run__lead">
          Family digests go only to guardians with recorded consent who turned the digest on. Squad week summaries go to head coaches.
        </p>
      </div>
      <button mat-flat-button type="button" (click)="run()" [disabled]="pending()">
        <mat-icon aria-hidden="true">forward_to_inbox</mat-icon>
        {{ pending() ? 'Sending…' : 'Send digests now' }}
      </button>
    </div>
    @if (result(); as done) {
      <p class="digest-run__message digest-run__message--ok" role="status">
        Week of {{ weekOf(done) }}: {{ done.familySent }} Family {{ done.familySent === 1 ? 'digest' : 'digests' }} sent,
        {{ done.familySkipped }} skipped (no consent, digest off, or already sent this week); {{ done.squadWeekSent }} Squad week
        {{ done.squadWeekSent === 1 ? 'summary' : 'summaries' }} sent.
      </p>
    }
    @if (failure(); as message) {
      <p class="digest-run__message digest-run__message--failure" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host {
      display: block;
      padding: 16px;
      border-radius: var(--mat-sys-corner-medium);
      border: 1px solid var(--mat-sys-outline-variant);
      background: var(--mat-sys-surface-container-lowest);
    }
    .digest-run__head {
      display: flex;
      flex-wrap: wrap;
      gap: 12px 24px;
      align-items: center;
      justify-content: space-between;
    }
    .digest-run__title {
      margin: 0;
      font: var(--mat-sys-title-medium);
    }
    .digest-run__lead {
      margin: 4px 0 0;
      max-width: 60ch;
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    button {
      min-height: 48px;
    }
    .digest-run__message {
      margin: 12px 0 0;
      padding: 12px;
      border-radius: var(--mat-sys-corner-small);
      font: var(--mat-sys-body-large);
    }
    .digest-run__message--ok {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    .digest-run__message--failure {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DigestRun {
  private readonly api = inject(DigestApi);

  /** Emitted after a successful run, e.g. so the outbox reloads to show the new mail. */
  readonly ran = output<DigestRunResult>();

  protected readonly pending = signal(false);
  protected readonly result = signal<DigestRunResult | null>(null);
  protected readonly failure = signal<string | null>(null);

  protected weekOf(result: DigestRunResult): string {
    return dateLabel(result.weekStart);
  }

  protected run(): void {
    if (this.pending()) {
      return;
    }
    this.failure.set(null);
    this.pending.set(true);
    this.api
      .runNow()
      .pipe(finalize(() => this.pending.set(false)))
      .subscribe({
        next: (result) => {
          this.result.set(result);
          this.ran.emit(result);
        },
        error: (error: unknown) => {
          this.result.set(null);
          this.failure.set(describeApiError(error).message);
        },
      });
  }
}
