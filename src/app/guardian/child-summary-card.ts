import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subject, combineLatest, startWith, switchMap } from 'rxjs';
import { LOADING, toLoadState } from '../core/load-state';
import { LoadFailure } from '../ui/load-failure';
import { GuardianApi } from '../core/guardians/guardian-api';
import { WeeklyTrendChart } from './weekly-trend-chart';

/**
 * One linked child's short summary: weekly repetitions and hit-rate trend, and the week's
 * highlight. It loads on its own, so one child's failed summary does not hide the consent
 * panel or a sibling's summary.
 */
@Component({
  selector: 'll-child-summary-card',
  imports: [MatIconModule, MatProgressBarModule, LoadFailure, WeeklyTrendChart],
  template: `
    @let current = state();
    @switch (current.status) {
      @case ('loading') {
        <mat-progress-bar mode="indeterminate" [attr.aria-label]="'Loading the summary for ' + firstName()" />
      }
      @case ('error') {
        @if (current.status === 'error') {
          <ll-load-failure [what]="firstName() + '’s summary could not be loaded.'" [problem]="current.problem" (retry)="reload()" />
        }
      }
      @case ('ready') {
        @if (current.status === 'ready') {
          <h3 class="child-summary__title">Training, week by week</h3>
          <ll-weekly-trend-chart [weeks]="current.value.weeks" [firstName]="current.value.firstName" />
          <div class="child-summary__highlight">
            <mat-icon aria-hidden="true">star</mat-icon>
            <p>
              <span class="child-summary__label">Highlight</span>
              {{ current.value.highlight ?? 'No highlight this week yet.' }}
            </p>
          </div>
        }
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .child-summary__title {
      margin: 0 0 8px;
      font: var(--mat-sys-title-small);
    }
    .child-summary__highlight {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      margin-top: 12px;
      padding: 12px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .child-summary__highlight p {
      margin: 0;
      font: var(--mat-sys-body-large);
    }
    .child-summary__label {
      display: block;
      font: var(--mat-sys-label-large);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChildSummaryCard {
  private readonly api = inject(GuardianApi);
  private readonly reloads = new Subject<void>();

  /** The child's player id. */
  readonly playerId = input.required<string>();
  /** The child's first name (from the link), used before the summary arrives. */
  readonly firstName = input.required<string>();

  protected readonly state = toSignal(
    combineLatest([toObservable(this.playerId), this.reloads.pipe(startWith(undefined))]).pipe(
      switchMap(([playerId]) => this.api.childSummary(playerId).pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );

  protected reload(): void {
    this.reloads.next();
  }
}
