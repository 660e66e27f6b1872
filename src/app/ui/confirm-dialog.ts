import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';

/** What a confirmation asks. */
export interface ConfirmDialogData {
  readonly title: string;
  readonly message: string;
  /** Label of the button that goes ahead, e.g. "Withdraw consent". */
  readonly confirmLabel: string;
}

/**
 * A plain "are you sure" for actions that change what the club may do with a child's data
 * (withdrawing consent, removing a guardian link). Closes with `true` only when confirmed, so
 * Escape, a click outside and "Keep it" all leave things as they were.
 */
@Component({
  selector: 'll-confirm-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      <p>{{ data.message }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep it</button>
      <button mat-flat-button type="button" class="confirm-dialog__go" [mat-dialog-close]="true">{{ data.confirmLabel }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    p {
      margin: 0;
      font: var(--mat-sys-body-large);
    }
    button {
      min-height: 48px;
    }
    .confirm-dialog__go {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmDialogData>(MAT_DIALOG_DATA);
}
