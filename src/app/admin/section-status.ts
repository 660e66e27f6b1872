import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { WriteAction } from '../core/action-state';

/**
 * What became of a Club admin section's last write: the failure (an alert) or the confirmation (a
 * status line, worded by the section to say what the change sets in motion).
 */
@Component({
  selector: 'll-section-status',
  imports: [MatIconModule],
  template: `
    @if (action().failure(); as message) {
      <p class="section__message section__message--failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
    }
    @if (action().done()) {
      <p class="section__message section__message--ok" role="status">
        <mat-icon aria-hidden="true">check_circle</mat-icon>{{ doneText() }}
      </p>
    }
  `,
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SectionStatus {
  /** The write to report on. */
  readonly action = input.required<WriteAction>();
  /** The confirmation after a successful write. */
  readonly doneText = input.required<string>();
}
