import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/**
 * A refusal said plainly: what was refused, the reason in the server's (or the device's) own
 * words, and — when trying again can help — a button for it. Announced as an alert, since it
 * usually arrives while the coach's eyes are elsewhere after an upload.
 */
@Component({
  selector: 'll-refusal-note',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <mat-icon aria-hidden="true">{{ unreachable() ? 'wifi_off' : 'error' }}</mat-icon>
    <div class="refusal__body">
      <p class="refusal__what">{{ what() }}</p>
      <p class="refusal__why">{{ message() }}</p>
      @if (retryLabel(); as label) {
        <button mat-stroked-button type="button" (click)="retry.emit()">
          <mat-icon aria-hidden="true">refresh</mat-icon>
          {{ label }}
        </button>
      }
    </div>
  `,
  styles: `
    :host {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      margin: 12px 0;
      padding: 12px 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
      border-left: 4px solid var(--mat-sys-error);
    }
    mat-icon {
      flex: none;
    }
    .refusal__body {
      display: flex;
      flex-direction: column;
      align-items: flex-start;
      gap: 6px;
      min-width: 0;
    }
    p {
      margin: 0;
      overflow-wrap: anywhere;
    }
    .refusal__what {
      font: var(--mat-sys-title-small);
    }
    button {
      min-height: 48px;
    }
  `,
  host: { role: 'alert' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RefusalNote {
  /** What was refused, e.g. "The file was not imported." */
  readonly what = input.required<string>();
  /** Why. */
  readonly message = input.required<string>();
  /** Whether the server could not be reached (shows a no-signal icon). */
  readonly unreachable = input(false);
  /** The retry button's words; no button when null. */
  readonly retryLabel = input<string | null>(null);
  /** Emitted when the coach asks to try again. */
  readonly retry = output<void>();
}
