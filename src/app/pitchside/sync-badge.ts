import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { SyncQueue } from '../core/sync/sync-queue';

/**
 * The always-visible sync state on Pitchside: online or offline, and how many entries the
 * server does not have yet. A coach must be able to tell at a glance whether the phone is the
 * only copy of today's session. Tapping it opens the sync details.
 */
@Component({
  selector: 'll-sync-badge',
  imports: [MatIconModule],
  template: `
    <button
      type="button"
      class="badge"
      [class.badge--offline]="offline()"
      [class.badge--attention]="attention() > 0"
      [attr.aria-expanded]="expanded()"
      data-testid="sync-badge"
      (click)="toggled.emit()"
    >
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <span>{{ text() }}</span>
    </button>
  `,
  styles: `
    .badge {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      min-height: 48px;
      padding: 0 12px;
      border: 2px solid currentColor;
      border-radius: var(--mat-sys-corner-full);
      background: var(--mat-sys-surface);
      color: var(--mat-sys-on-surface);
      font: var(--mat-sys-label-large);
      cursor: pointer;
      white-space: nowrap;
    }
    .badge--offline {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .badge--attention {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    mat-icon {
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SyncBadge {
  private readonly queue = inject(SyncQueue);

  /** Whether the sync details it opens are shown. */
  readonly expanded = input(false);
  /** Emits when the coach taps the badge. */
  readonly toggled = output<void>();

  protected readonly offline = computed(() => this.queue.phase() === 'offline');
  protected readonly attention = computed(() => this.queue.rejected() + this.queue.conflicts());
  protected readonly icon = computed(() => {
    switch (this.queue.phase()) {
      case 'offline':
        return 'cloud_off';
      case 'syncing':
        return 'sync';
      case 'waiting':
        return 'schedule';
      default:
        return this.queue.unsynced() === 0 ? 'cloud_done' : 'cloud_upload';
    }
  });
  protected readonly text = computed(() => {
    const unsynced = this.queue.unsynced();
    const parts: string[] = [];
    const phase = this.queue.phase();
    if (phase === 'offline') parts.push('Offline');
    else if (phase === 'syncing') parts.push('Syncing');
    else if (phase === 'waiting') parts.push('Retrying');
    if (unsynced > 0) parts.push(`${unsynced} unsynced`);
    else if (phase !== 'syncing') parts.push('all synced');
    const attention = this.attention();
    if (attention > 0) parts.push(`${attention} to check`);
    const text = parts.join(' · ');
    return text.charAt(0).toUpperCase() + text.slice(1);
  });
}
