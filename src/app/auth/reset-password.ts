import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { describeApiError } from '../core/api-error';
import { AccountApi } from './account-api';
import { NewPasswordFields, newPasswordGroup } from './new-password-fields';
import { PublicPanel } from '../ui/public-panel';

/** Error codes that mean the reset link itself is spent or wrong: only a new link helps. */
const DEAD_RESET_CODES = ['reset_expired', 'reset_used', 'reset_invalid'];

/**
 * Choosing a new password from a reset link (`/reset-password?token=`). The token is checked
 * when the form is sent (there is no look-up call), so an expired or used link says so then and
 * offers to send a new one. Success does not sign in: the user signs in with the new password,
 * which also proves they remember it.
 */
@Component({
  selector: 'll-reset-password',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatIconModule, NewPasswordFields, PublicPanel],
  templateUrl: './reset-password.html',
  styleUrl: './public-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPassword {
  private readonly api = inject(AccountApi);

  /** The reset token from the link (`?token=`, bound by the router). */
  readonly token = input<string | undefined>(undefined);

  protected readonly form = newPasswordGroup(inject(NonNullableFormBuilder));
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** Whether the failure means the link is spent, so the page offers a new one. */
  protected readonly linkDead = signal(false);
  protected readonly done = signal(false);

  protected submit(): void {
    const token = this.token();
    if (this.pending() || !token) {
      return;
    }
    this.failure.set(null);
    this.linkDead.set(false);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.pending.set(true);
    this.api
      .resetPassword(token, this.form.controls.password.value)
      .pipe(finalize(() => this.pending.set(false)))
      .subscribe({
        next: () => this.done.set(true),
        error: (error: unknown) => {
          const problem = describeApiError(error);
          this.failure.set(problem.message);
          this.linkDead.set(DEAD_RESET_CODES.includes(problem.code ?? '') || problem.fields['token'] !== undefined);
          const message = problem.fields['password'];
          if (message) {
            const control = this.form.controls.password;
            control.setErrors({ ...control.errors, server: message });
            control.markAsTouched();
          }
        },
      });
  }
}
