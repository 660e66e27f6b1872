import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { Subject, finalize, of, startWith, switchMap, tap } from 'rxjs';
import { ROLE_LABELS } from '../../../shared/roles';
import type { AuthTokens } from '../../../shared/schemas/auth';
import { ApiProblem, describeApiError } from '../core/api-error';
import { AuthSession } from '../core/auth/auth-session';
import { LOADING, LoadState, toLoadState } from '../core/load-state';
import { LoadFailure } from '../ui/load-failure';
import { AccountApi, type InviteView } from './account-api';
import { NewPasswordFields, newPasswordGroup } from './new-password-fields';
import { PublicPanel } from '../ui/public-panel';

/** Error codes that mean the invitation link itself cannot be used (no retry helps). */
const DEAD_INVITE_CODES = ['invite_expired', 'invite_used', 'invite_invalid'];

const NO_TOKEN: LoadState<InviteView> = {
  status: 'error',
  problem: {
    message: 'This invitation link is incomplete. Open the link from the e-mail again, or ask for a new invitation.',
    unreachable: false,
    code: 'invite_invalid',
    fields: {},
  },
};

/** Whether a failure means the link itself is unusable: a dead-invite code, or a malformed token. */
function isDeadLink(problem: ApiProblem): boolean {
  return DEAD_INVITE_CODES.includes(problem.code ?? '') || problem.fields['token'] !== undefined;
}

/**
 * Accepting an invitation (`/accept-invite?token=`), reached from the invitation e-mail without
 * an account yet. It first shows who the invitation is for, so someone who got a forwarded mail
 * sees it is not theirs, then sets the password and signs the new account in.
 */
@Component({
  selector: 'll-accept-invite',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    LoadFailure,
    NewPasswordFields,
    PublicPanel,
  ],
  templateUrl: './accept-invite.html',
  styleUrl: './public-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvite {
  private readonly api = inject(AccountApi);
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  private readonly reloads = new Subject<void>();

  /** The invitation token from the link (`?token=`, bound by the router). */
  readonly token = input<string | undefined>(undefined);

  protected readonly invite = toSignal(
    toObservable(this.token).pipe(
      switchMap((token) =>
        this.reloads.pipe(
          startWith(undefined),
          switchMap(() => (token ? this.api.invite(token).pipe(toLoadState()) : of(NO_TOKEN))),
        ),
      ),
    ),
    { initialValue: LOADING },
  );
  /** The invitation problem when the link is dead (expired, used, unknown) rather than unreachable. */
  protected readonly deadInvite = computed<ApiProblem | null>(() => {
    const state = this.invite();
    return state.status === 'error' && isDeadLink(state.problem) ? state.problem : null;
  });
  /** Someone else's session on this device, which accepting will replace. */
  protected readonly otherAccount = computed(() => {
    const state = this.invite();
    const user = this.session.user();
    return state.status === 'ready' && user !== null && user.email !== state.value.email ? user : null;
  });
  protected readonly roleLabels = ROLE_LABELS;

  protected readonly form = newPasswordGroup(inject(NonNullableFormBuilder));
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** Set once the password is saved but signing in afterwards failed: the account works, sign in by hand. */
  protected readonly acceptedButSignedOut = signal(false);

  protected retry(): void {
    this.reloads.next();
  }

  protected submit(): void {
    const token = this.token();
    if (this.pending() || !token) {
      return;
    }
    this.failure.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const password = this.form.controls.password.value;
    this.pending.set(true);
    let accepted: AuthTokens | null = null;
    this.api
      .acceptInvite(token, password)
      .pipe(
        tap((tokens) => (accepted = tokens)),
        switchMap((tokens) => this.session.signIn({ email: tokens.user.email, password })),
        finalize(() => {
          this.pending.set(false);
          if (accepted !== null) {
            this.api.discardTokens(accepted);
          }
        }),
      )
      .subscribe({
        next: () => void this.router.navigateByUrl('/home'),
        error: (error: unknown) => (accepted === null ? this.showFailure(error) : this.acceptedButSignedOut.set(true)),
      });
  }

  private showFailure(error: unknown): void {
    const problem = describeApiError(error);
    this.failure.set(problem.message);
    const message = problem.fields['password'];
    if (message) {
      const control = this.form.controls.password;
      control.setErrors({ ...control.errors, server: message });
      control.markAsTouched();
    }
  }
}
