import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subscription } from 'rxjs';
import { AuthSession } from '../core/auth/auth-session';
import { LOADING, LoadState, toLoadState } from '../core/load-state';
import { LoadFailure } from '../ui/load-failure';
import { ChildSummaryCard } from './child-summary-card';
import { ConsentPanel } from './consent-panel';
import { type ConsentText, GuardianApi, type GuardianLinkView } from '../core/guardians/guardian-api';

/**
 * Guardian home (`/guardian`), the landing page of a guardian account: each linked child's
 * short training summary, and per child the consent record and the Family digest choice. It
 * says plainly what the digest contains and defers to the club's safeguarding policy and local
 * data-protection law — the product does not decide what a club may do with a child's data.
 */
@Component({
  selector: 'll-guardian-home',
  imports: [MatCardModule, MatIconModule, MatProgressBarModule, LoadFailure, ChildSummaryCard, ConsentPanel],
  templateUrl: './guardian-home.html',
  styleUrl: './guardian-home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GuardianHome {
  private readonly api = inject(GuardianApi);
  private readonly destroyRef = inject(DestroyRef);
  private linksRequest: Subscription | null = null;
  private textRequest: Subscription | null = null;

  private readonly session = inject(AuthSession);

  protected readonly displayName = computed(() => this.session.user()?.displayName ?? '');
  protected readonly links = signal<LoadState<GuardianLinkView[]>>(LOADING);
  protected readonly consentText = signal<LoadState<ConsentText>>(LOADING);
  /** The consent text once loaded; panels wait for it before offering "I consent". */
  protected readonly consentTextValue = computed(() => {
    const state = this.consentText();
    return state.status === 'ready' ? state.value : null;
  });

  constructor() {
    this.loadLinks();
    this.loadConsentText();
  }

  protected loadLinks(): void {
    this.linksRequest?.unsubscribe();
    this.linksRequest = this.api
      .listLinks()
      .pipe(toLoadState(), takeUntilDestroyed(this.destroyRef))
      .subscribe((state) => this.links.set(state));
  }

  protected loadConsentText(): void {
    this.textRequest?.unsubscribe();
    this.textRequest = this.api
      .consentText()
      .pipe(toLoadState(), takeUntilDestroyed(this.destroyRef))
      .subscribe((state) => {
        // Keep showing the text already loaded while a newer one is on its way.
        if (state.status !== 'loading' || this.consentText().status !== 'ready') {
          this.consentText.set(state);
        }
      });
  }

  /** Puts the server's updated link in place of the old one. */
  protected replaceLink(updated: GuardianLinkView): void {
    this.links.update((state) =>
      state.status === 'ready' ? { status: 'ready', value: state.value.map((link) => (link.id === updated.id ? updated : link)) } : state,
    );
  }
}
