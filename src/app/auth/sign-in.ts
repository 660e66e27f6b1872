import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { loginRequestSchema } from '../../../shared/schemas/auth';
import { describeApiError } from '../core/api-error';
import { safeReturnUrl } from '../core/auth/auth-guard';
import { AuthSession } from '../core/auth/auth-session';
import { zodValidator } from '../core/zod-validator';
import { LoftlineMark } from '../ui/loftline-mark';

/** The form fields the server may name in a validation failure. */
const SERVER_CHECKED_FIELDS = ['email', 'password'] as const;

/**
 * The sign-in page (`/sign-in`). Coaches sign in once per phone and stay signed in, so the
 * page is plain: e-mail, password, one button, and errors worded so they can be acted on
 * ("E-mail or password is wrong" from the server, "cannot be reached" without signal).
 */
@Component({
  selector: 'll-sign-in',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressSpinnerModule,
    LoftlineMark,
  ],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);

  /** Where to go after signing in (`?returnUrl=`, bound by the router); home when absent or unsafe. */
  readonly returnUrl = input<string | undefined>(undefined);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, zodValidator(loginRequestSchema.shape.email)]],
    password: ['', [Validators.required, zodValidator(loginRequestSchema.shape.password)]],
  });
  /** Whether a sign-in request is on its way. */
  protected readonly pending = signal(false);
  /** The server's (or the network's) reason the last attempt failed. */
  protected readonly failure = signal<string | null>(null);
  /** Whether the password is shown in clear text. */
  protected readonly passwordVisible = signal(false);

  protected submit(): void {
    if (this.pending()) {
      return;
    }
    this.failure.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, password } = this.form.getRawValue();
    this.pending.set(true);
    this.session
      .signIn({ email: email.trim().toLowerCase(), password })
      .pipe(finalize(() => this.pending.set(false)))
      .subscribe({
        next: () => void this.router.navigateByUrl(safeReturnUrl(this.returnUrl())),
        error: (error: unknown) => this.showFailure(error),
      });
  }

  protected togglePasswordVisibility(): void {
    this.passwordVisible.update((visible) => !visible);
  }

  private showFailure(error: unknown): void {
    const problem = describeApiError(error);
    this.failure.set(problem.message);
    for (const field of SERVER_CHECKED_FIELDS) {
      const message = problem.fields[field];
      if (message) {
        const control = this.form.controls[field];
        control.setErrors({ ...control.errors, server: message });
        control.markAsTouched();
      }
    }
  }
}
