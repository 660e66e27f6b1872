import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { describeApiError } from '../core/api-error';
import { PublicPanel } from '../ui/public-panel';
import { DigestApi } from '../core/guardians/digest-api';

/**
 * The page behind the unsubscribe link in every Family digest (`/unsubscribe?token=`). It asks
 * for one click rather than acting on load, because mail scanners open links by themselves and
 * would otherwise unsubscribe guardians who never chose to. Needs no sign-in; repeating it is
 * harmless (the server answers the same for an already stopped digest).
 */
@Component({
  selector: 'll-unsubscribe',
  imports: [RouterLink, MatButtonModule, MatIconModule, PublicPanel],
  template: `
    <ll-public-panel heading="Stop the Family digest">
      @if (stoppedFor(); as firstName) {
        <div class="page__message page__message--ok" role="status">
          <mat-icon aria-hidden="true">unsubscribe</mat-icon>
          <p>Done. You will not receive the Family digest about {{ firstName }} any more.</p>
        </div>
        <p class="page__lead">
          Your consent record has not changed. To receive the digest again, or to withdraw consent as well, sign in and open Guardian home.
        </p>
        <p class="page__links"><a routerLink="/sign-in">Sign in</a></p>
      } @else if (!token()) {
        <div class="page__message page__message--failure" role="alert">
          <mat-icon aria-hidden="true">link_off</mat-icon>
          <p>
            This unsubscribe link is incomplete. Open it from the digest e-mail again, or sign in and turn the digest off in Guardian home.
          </p>
        </div>
        <p class="page__links"><a routerLink="/sign-in">Sign in</a></p>
      } @else {
        <p class="page__lead">
          This stops the weekly Family digest e-mail for the child this link was sent about. Nothing else changes: your consent record stays
          as it is, and you can turn the digest on again in Guardian home.
        </p>
        @if (failure(); as message) {
          <div class="page__message page__message--failure" role="alert">
            <mat-icon aria-hidden="true">error</mat-icon>
            <p>{{ message }}</p>
          </div>
        }
        <button mat-flat-button type="button" class="page__submit page__wide" (click)="unsubscribe()" [disabled]="pending()">
          {{ pending() ? 'Stopping…' : 'Stop the Family digest' }}
        </button>
      }
    </ll-public-panel>
  `,
  styleUrls: ['../auth/public-page.scss'],
  styles: `
    .page__wide {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Unsubscribe {
  private readonly api = inject(DigestApi);

  /** The signed unsubscribe token from the link (`?token=`, bound by the router). */
  readonly token = input<string | undefined>(undefined);

  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** The child's first name once the digest is stopped. */
  protected readonly stoppedFor = signal<string | null>(null);

  protected unsubscribe(): void {
    const token = this.token();
    if (this.pending() || !token) {
      return;
    }
    this.failure.set(null);
    this.pending.set(true);
    this.api
      .unsubscribe(token)
      .pipe(finalize(() => this.pending.set(false)))
      .subscribe({
        next: (result) => this.stoppedFor.set(result.firstName),
        error: (error: unknown) => this.failure.set(describeApiError(error).message),
      });
  }
}
