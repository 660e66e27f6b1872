import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { AppUpdate } from '../core/app-update';

/**
 * The "new version ready" offer under the bar: reload now, or later (the next start loads it anyway). While a
 * repetition is half entered only a quiet note says a version waits, so nothing moves under the coach's thumb.
 */
@Component({
  selector: 'll-update-banner',
  imports: [MatButtonModule, MatIconModule],
  template: `
    @if (update.offer()) {
      <div class="update" role="status">
        <mat-icon aria-hidden="true">system_update</mat-icon>
        <span class="update__text">A new version of Loftline is ready. Logged repetitions stay on this device and keep syncing.</span>
        <button mat-button type="button" (click)="update.dismiss()">Later</button>
        <button mat-flat-button type="button" (click)="update.reload()">Reload now</button>
      </div>
    } @else if (update.held()) {
      <p class="update update--held" role="status">
        <mat-icon aria-hidden="true">schedule</mat-icon>
        A new version of Loftline is ready; it will be offered once this repetition is saved.
      </p>
    }
  `,
  styles: `
    .update {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 12px;
      padding: 8px 16px;
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .update--held {
      margin: 0;
      padding-block: 4px;
      font: var(--mat-sys-body-small);
    }
    .update__text {
      flex: 1 1 220px;
    }
    .update button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UpdateBanner {
  protected readonly update = inject(AppUpdate);
}
