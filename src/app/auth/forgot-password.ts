import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { loginRequestSchema } from '../../../shared/schemas/auth';
import { describeApiError } from '../core/api-error';
import { zodValidator } from '../core/zod-validator';
import { AccountApi } from './account-api';
import { PublicPanel } from '../ui/public-panel';

/**
 * The one message shown after asking for a reset link, whatever the server knows about the
 * address: a different wording for unknown addresses would tell anyone which e-mails have a
 * Loftline account.
 */
export const RESET_REQUESTED_MESSAGE =
  'If an account exists for that address, a link to choose a new password is on its way. ' +
  'The link works once, for one hour. Check your spam folder if it does not arrive within a few minutes.';

/**
 * Asking for a password reset (`/forgot-password`): one field, one button, and always the same
 * neutral answer. Only failures that say nothing about the account (no connection, too many
 * attempts, a malformed address) are shown as errors.
 */
@Component({
  selector: 'll-forgot-password',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, PublicPanel],
  templateUrl: './forgot-password.html',
  styleUrl: './public-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPassword {
  private readonly api = inject(AccountApi);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, zodValidator(loginRequestSchema.shape.email)]],
  });
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** Whether the request was accepted (the neutral message is showing). */
  protected readonly requested = signal(false);
  protected readonly requestedMessage = RESET_REQUESTED_MESSAGE;

  protected submit(): void {
    if (this.pending()) {
      return;
    }
    this.failure.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.pending.set(true);
    this.api
      .forgotPassword(this.form.controls.email.value.trim().toLowerCase())
      .pipe(finalize(() => this.pending.set(false)))
      .subscribe({
        next: () => this.requested.set(true),
        error: (error: unknown) => {
          const problem = describeApiError(error);
          this.failure.set(problem.message);
          const message = problem.fields['email'];
          if (message) {
            const control = this.form.controls.email;
            control.setErrors({ ...control.errors, server: message });
            control.markAsTouched();
          }
        },
      });
  }

  /** Back to the form, e.g. after a typo in the address. */
  protected askAgain(): void {
    this.requested.set(false);
  }
}
