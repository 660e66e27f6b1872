import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { SpinEstimateSkip, SpinEstimatesResponse, TechniqueSpinEstimate } from '../../../shared/schemas/analysis';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';

const SKIP_WORDS: Record<SpinEstimateSkip, string> = {
  no_carry: 'no carry logged (and not on target)',
  time_too_short: 'time too short for the carry',
  time_too_long: 'time too long for the carry',
  carry_out_of_reach: 'carry out of the model’s reach',
  spread_unresolved: 'at the edge of what is possible',
};

/**
 * "Spin from hang time" on the Player file: per technique, the backspin the flight model infers from the
 * timed repetitions (carry plus time in the air), with one standard deviation, beside the spin logged by
 * eye, and how many repetitions were timed and used. A table, so it reads the same to a screen reader.
 */
@Component({
  selector: 'll-hang-time-spin',
  template: `
    @if (estimates().techniques.length === 0) {
      <p class="spin__empty">
        No timed repetitions yet. Turn on the stopwatch for a drill on Pitchside and tap at foot contact and at the first bounce.
      </p>
    } @else {
      <div class="spin__scroll">
        <table class="spin__table">
          <caption class="spin__caption">
            Backspin inferred from carry and hang time (negative = topspin), ± one standard deviation
          </caption>
          <thead>
            <tr>
              <th scope="col">Technique</th>
              <th scope="col">Timed</th>
              <th scope="col">Used</th>
              <th scope="col">From hang time</th>
              <th scope="col">By eye</th>
              <th scope="col">Launch speed</th>
            </tr>
          </thead>
          <tbody>
            @for (row of estimates().techniques; track row.technique) {
              <tr [attr.data-technique]="row.technique">
                <th scope="row">{{ labels[row.technique] }}</th>
                <td>{{ row.timedCount }}</td>
                <td>{{ row.solvedCount }}</td>
                <td data-testid="spin-estimate">{{ spinText(row) }}</td>
                <td>{{ row.eyeBackspinRps === null ? '—' : row.eyeBackspinRps.toFixed(1) + ' rev/s' }}</td>
                <td>{{ speedText(row) }}</td>
              </tr>
              @if (skippedText(row); as skipped) {
                <tr class="spin__skipped">
                  <td colspan="6">Left out: {{ skipped }}</td>
                </tr>
              }
            }
          </tbody>
        </table>
      </div>
    }
    <p class="spin__note">{{ note() }}</p>
  `,
  styles: `
    :host {
      display: block;
    }
    .spin__scroll {
      overflow-x: auto;
    }
    .spin__table {
      width: 100%;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    .spin__caption {
      text-align: left;
      padding-bottom: 8px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    th,
    td {
      padding: 8px;
      text-align: left;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .spin__skipped td {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .spin__empty,
    .spin__note {
      margin: 8px 0 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HangTimeSpin {
  /** The server's estimates for one player. */
  readonly estimates = input.required<SpinEstimatesResponse>();

  protected readonly labels = TECHNIQUE_LABELS;
  protected readonly note = computed(() => {
    const { biasS, sdS } = this.estimates().timing;
    return (
      `Each reading is corrected by the club’s timing bias (${biasS.toFixed(2)} s) and carries its spread (${sdS.toFixed(2)} s); ` +
      `one hand-timed kick pins spin down only to a rev/s or two, and an error in the bias shifts every estimate alike, ` +
      `so calibrate it from video in Club admin. Uses the ${this.estimates().perTechniqueLimit} most recent timed repetitions per technique, ` +
      `at the technique’s usual launch angle unless one was measured.`
    );
  });

  protected spinText(row: TechniqueSpinEstimate): string {
    if (row.backspinRps === null || row.backspinUncertaintyRps === null) return 'no estimate';
    return `${row.backspinRps.toFixed(1)} ± ${row.backspinUncertaintyRps.toFixed(1)} rev/s`;
  }

  protected speedText(row: TechniqueSpinEstimate): string {
    if (row.speedMs === null || row.speedUncertaintyMs === null) return '—';
    return `${row.speedMs.toFixed(1)} ± ${row.speedUncertaintyMs.toFixed(1)} m/s`;
  }

  protected skippedText(row: TechniqueSpinEstimate): string | null {
    const parts = (Object.entries(row.skipped) as [SpinEstimateSkip, number][])
      .filter(([, n]) => n > 0)
      .map(([why, n]) => `${n} ${SKIP_WORDS[why]}`);
    return parts.length ? parts.join('; ') : null;
  }
}
