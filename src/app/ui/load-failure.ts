import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { ApiProblem } from '../core/api-error';

/**
 * A failed load, said plainly with a way to try again. One component so every screen shows
 * "the server cannot be reached" the same way, with the same retry button in the same place.
 */
@Component({
  selector: 'll-load-failure',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <mat-icon aria-hidden="true">{{ problem().unreachable ? 'wifi_off' : 'error' }}</mat-icon>
    <div class="load-failure__body">
      <p class="load-failure__what">{{ what() }}</p>
      <p class="load-failure__why">{{ problem().message }}</p>
      <button mat-stroked-button type="button" (click)="retry.emit()">
        <mat-icon aria-hidden="true">refresh</mat-icon>
        Try again
      </button>
    </div>
  `,
  styles: `
    :host {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
      border-left: 4px solid var(--mat-sys-error);
    }
    .load-failure__body {
      display: flex;
      flex-direction: column;
      align-items: flex-start;
      gap: 8px;
    }
    p {
      margin: 0;
    }
    .load-failure__what {
      font: var(--mat-sys-title-medium);
    }
    button {
      min-height: 48px;
    }
  `,
  host: { role: 'alert' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadFailure {
  /** What could not be loaded, e.g. "Your squads could not be loaded." */
  readonly what = input.required<string>();
  /** Why, from {@link describeApiError}. */
  readonly problem = input.required<ApiProblem>();
  /** Emitted when the user asks to try again. */
  readonly retry = output<void>();
}
