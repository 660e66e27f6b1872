import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, Injectable, inject, signal } from '@angular/core';
import { MatSlideToggleModule, type MatSlideToggleChange } from '@angular/material/slide-toggle';
import { Observable, map } from 'rxjs';
import { describeApiError } from '../core/api-error';

/** `GET/PUT /api/me/digest-opt-in`: an adult player's own choice about Family digests. */
@Injectable({ providedIn: 'root' })
export class DigestSelfOptInApi {
  private readonly http = inject(HttpClient);

  /** Whether the player has opted in. */
  get(): Observable<boolean> {
    return this.http.get<{ optIn: boolean }>('/api/me/digest-opt-in').pipe(map((b) => b.optIn));
  }

  /** Records the player's choice. */
  set(optIn: boolean): Observable<boolean> {
    return this.http.put<{ optIn: boolean }>('/api/me/digest-opt-in', { optIn }).pipe(map((b) => b.optIn));
  }
}

/**
 * For a player aged 18 or over: whether their linked guardians may receive the Family digest
 * about them. Off by default — an adult decides for themselves (docs/design.md §10).
 */
@Component({
  selector: 'll-digest-self-opt-in',
  imports: [MatSlideToggleModule],
  template: `
    <mat-slide-toggle [checked]="optIn()" [disabled]="busy()" (change)="choose($event)"
      >Let my guardians receive the weekly Family digest about me</mat-slide-toggle
    >
    <p class="opt-in__hint">
      You are 18 or over, so no digest about you is sent unless you switch this on. You can switch it off at any time.
    </p>
    @if (problem(); as message) {
      <p class="opt-in__problem" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host {
      display: block;
      margin-top: 12px;
    }
    .opt-in__hint {
      margin: 4px 0 0;
      font-size: 0.9rem;
    }
    .opt-in__problem {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DigestSelfOptIn {
  private readonly api = inject(DigestSelfOptInApi);
  protected readonly optIn = signal(false);
  protected readonly busy = signal(true);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    this.api.get().subscribe({
      next: (v) => {
        this.optIn.set(v);
        this.busy.set(false);
      },
      error: (e: unknown) => {
        this.problem.set(describeApiError(e).message);
        this.busy.set(false);
      },
    });
  }

  protected choose(change: MatSlideToggleChange): void {
    this.busy.set(true);
    this.problem.set(null);
    this.api.set(change.checked).subscribe({
      next: (v) => {
        this.optIn.set(v);
        this.busy.set(false);
      },
      error: (e: unknown) => {
        change.source.checked = this.optIn();
        this.problem.set(describeApiError(e).message);
        this.busy.set(false);
      },
    });
  }
}
