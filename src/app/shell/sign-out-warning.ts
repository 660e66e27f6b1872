import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

/** What the warning needs to say. */
export interface SignOutWarningData {
  /** Changes on this phone the server has not acknowledged. */
  readonly unsynced: number;
  /** Whether the phone believes it is offline. */
  readonly offline: boolean;
}

/** The coach's answer: sign out anyway (the changes stay), or stay signed in. */
export type SignOutWarningChoice = 'sign_out' | 'stay';

/**
 * Asked before signing out while changes are still on their way: signing out never deletes
 * them, but the coach should know they will only be sent once they sign in on this phone again.
 */
@Component({
  selector: 'll-sign-out-warning',
  imports: [MatButtonModule, MatDialogModule],
  template: `
    <h2 mat-dialog-title>Changes not sent yet</h2>
    <mat-dialog-content>
      <p>
        {{ data.unsynced }} {{ data.unsynced === 1 ? 'change is' : 'changes are' }} saved on this phone but not on the server yet{{
          data.offline ? ' (the phone is offline)' : ''
        }}.
      </p>
      <p>Signing out keeps them here. They are sent the next time you sign in on this phone.</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="'sign_out'">Sign out, keep them</button>
      <button mat-flat-button type="button" [mat-dialog-close]="'stay'" cdkFocusInitial>Stay signed in</button>
    </mat-dialog-actions>
  `,
  styles: `
    button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignOutWarning {
  protected readonly data = inject<SignOutWarningData>(MAT_DIALOG_DATA);
}
