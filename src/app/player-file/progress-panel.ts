import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { CarryBasis, ProgressWeek } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import { formatValue, weekLabel } from '../ui/charts/chart-format';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { OutcomeMixChart } from '../ui/charts/outcome-mix-chart';
import { ProgressChart } from '../ui/charts/progress-chart';
import { type ProgressMetric, outcomeWeeks, progressPoints } from './player-file-view';

/**
 * Progress of one technique over the weeks: median carry with its middle half, or hit rate with
 * its 95 % interval, and the outcome mix below. Carries follow the screen's still-air toggle;
 * hit rates and outcomes come from the logged outcomes and do not depend on it.
 */
@Component({
  selector: 'll-progress-panel',
  imports: [MatButtonToggleModule, OutcomeMixChart, ProgressChart],
  template: `
    <mat-button-toggle-group
      aria-label="Progress measure"
      [value]="metric()"
      (change)="metric.set($event.value)"
      hideSingleSelectionIndicator
      class="progress-panel__metric"
    >
      <mat-button-toggle value="carry">{{ basis() === 'still-air' ? 'Still-air carry' : 'Carry' }}</mat-button-toggle>
      <mat-button-toggle value="hitRate">Hit rate</mat-button-toggle>
    </mat-button-toggle-group>
    @if (metric() === 'carry') {
      <ll-progress-chart
        [points]="points()"
        [valueLabel]="valueLabel()"
        bandLabel="Middle half (25th–75th percentile)"
        kind="metres"
        [summary]="summary()"
      />
    } @else {
      <ll-progress-chart
        [points]="points()"
        valueLabel="Hit rate"
        bandLabel="95 % interval"
        kind="share"
        [yDomain]="[0, 1]"
        [summary]="summary()"
      />
    }
    <h3 class="progress-panel__subtitle">Outcome mix</h3>
    <ll-outcome-mix-chart [weeks]="mix()" [summary]="mixSummary()" />
  `,
  styles: `
    :host {
      display: block;
    }
    .progress-panel__metric {
      margin-bottom: 8px;
    }
    .progress-panel__metric mat-button-toggle {
      min-height: 48px;
    }
    .progress-panel__subtitle {
      margin: 16px 0 4px;
      font: var(--mat-sys-title-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProgressPanel {
  /** Every week × technique row of the progress answer. */
  readonly weeks = input.required<readonly ProgressWeek[]>();
  /** The technique shown. */
  readonly technique = input.required<Technique>();
  /** Which carry the answer holds. */
  readonly basis = input<CarryBasis>('logged');

  protected readonly metric = signal<ProgressMetric>('carry');
  protected readonly points = computed(() => progressPoints(this.weeks(), this.technique(), this.metric()));
  protected readonly mix = computed(() => outcomeWeeks(this.weeks(), this.technique()));
  protected readonly valueLabel = computed(() => (this.basis() === 'still-air' ? 'Median still-air carry' : 'Median carry'));

  protected readonly summary = computed(() => {
    const points = this.points();
    const what = this.metric() === 'carry' ? this.valueLabel().toLowerCase() : 'hit rate';
    const technique = TECHNIQUE_LABELS[this.technique()].toLowerCase();
    if (points.length === 0) {
      return `No ${technique} weeks with a ${what} yet.`;
    }
    const kind = this.metric() === 'carry' ? 'metres' : 'share';
    const first = points[0]!;
    const last = points[points.length - 1]!;
    return `${TECHNIQUE_LABELS[this.technique()]} ${what} over ${points.length} weeks: ${formatValue(first.value, kind)} in the week of ${weekLabel(first.weekStart)}, ${formatValue(last.value, kind)} in the week of ${weekLabel(last.weekStart)}.`;
  });

  protected readonly mixSummary = computed(() => {
    const weeks = this.mix();
    if (weeks.length === 0) {
      return 'No outcomes logged yet.';
    }
    const last = weeks[weeks.length - 1]!;
    return `Outcome mix over ${weeks.length} weeks; in the week of ${weekLabel(last.weekStart)}, ${Math.round(last.share.on_target * 100)} % on target of ${last.reps} repetitions.`;
  });
}
