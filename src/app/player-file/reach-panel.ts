import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { curveHitProbability, PROFILE_WARNING_TEXT, reachWarnings } from '../../../shared/flight';
import type { PlayerKick } from '../../../shared/schemas/analysis';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { ReachDiagram, type ReachTarget } from '../ui/charts/reach-diagram';
import { drillTargets } from './player-file-view';
import { type TechniqueReach, reachHeadline, reachUncertainty } from './technique-reach';

/**
 * One technique's reach envelope with its headline numbers: reliable reach (with repetitions
 * and uncertainty) above a to-scale top view of the predicted landings, the drill targets the
 * player trained at (with their predicted hit rates) and the suggested next target.
 */
@Component({
  selector: 'll-reach-panel',
  imports: [MatProgressBarModule, ReachDiagram],
  template: `
    @let r = reach();
    @if (r === null || r.status === 'loading') {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the reach envelope" />
    } @else if (r.status === 'error') {
      <p class="reach-panel__note" role="alert">{{ r.message }}</p>
    } @else if (r.status === 'empty') {
      <p class="reach-panel__note">
        {{
          r.entry.pending
            ? 'The envelope is being fitted from the newest kicks; look again in a minute.'
            : 'No ' + label() + ' repetitions logged yet, so there is no envelope.'
        }}
      </p>
    } @else {
      <div class="reach-panel__headline">
        <span class="reach-panel__label">Reliable reach</span>
        <span class="reach-panel__number">{{ headline() }}</span>
        <span class="reach-panel__detail">
          {{ r.entry.repetitions }} {{ r.entry.repetitions === 1 ? 'repetition' : 'repetitions' }} ·
          {{ r.status === 'ready' ? r.analysis.radiusM : r.entry.reachRadiusM }} m target
          @if (r.entry.pending) {
            · updating with the newest kicks
          }
        </span>
        @if (uncertainty()) {
          <span class="reach-panel__detail">{{ uncertainty() }}</span>
        }
      </div>
      @if (warnings().length) {
        <ul class="reach-panel__warnings" aria-label="Before trusting these figures">
          @for (warning of warnings(); track warning) {
            <li>{{ warning }}</li>
          }
        </ul>
      }
      @if (r.status === 'computing') {
        <mat-progress-bar mode="indeterminate" aria-label="Computing the reach envelope" />
        <p class="reach-panel__note">Computing the envelope…</p>
      } @else {
        <ll-reach-diagram
          [picture]="r.analysis.envelope"
          [targets]="targets()"
          [reliableReachM]="r.analysis.reliableReachM"
          [summary]="summary()"
        />
        <p class="reach-panel__note">
          Predicted landings of {{ r.analysis.envelope.samples }} simulated kicks aimed at {{ r.analysis.envelope.aimDistanceM }} m (the
          usual drill distance) at standard conditions: ISA sea level, 15 °C, still air, size {{ r.analysis.ballSize }} ball. Hit rates at
          other distances come from kicks aimed at each of them.
        </p>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .reach-panel__headline {
      display: flex;
      flex-direction: column;
      margin-bottom: 8px;
    }
    .reach-panel__label {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .reach-panel__number {
      font: var(--mat-sys-display-small);
      color: var(--mat-sys-primary);
    }
    .reach-panel__detail,
    .reach-panel__note {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .reach-panel__note {
      margin: 8px 0 0;
    }
    .reach-panel__warnings {
      margin: 0 0 8px;
      padding-left: 20px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReachPanel {
  /** The technique's reach (null while nothing is known). */
  readonly reach = input.required<TechniqueReach | null>();
  /** The player's recent kicks, for the drill targets. */
  readonly kicks = input<readonly PlayerKick[]>([]);

  protected readonly label = computed(() => {
    const r = this.reach();
    return r ? TECHNIQUE_LABELS[r.technique].toLowerCase() : '';
  });
  protected readonly headline = computed(() => {
    const r = this.reach();
    return r ? reachHeadline(r) : '–';
  });
  /**
   * The profile's warnings in plain words; reach beyond the distances drilled is judged against the reach
   * shown (computed here for the chosen radius), so it cannot disagree with the headline.
   */
  protected readonly warnings = computed<string[]>(() => {
    const r = this.reach();
    if (r === null || r.status === 'loading' || r.status === 'error' || r.status === 'empty') {
      return [];
    }
    const profile = r.entry.profile;
    if (!profile) {
      return [];
    }
    const codes = r.status === 'ready' ? reachWarnings(profile, r.analysis.reliableReachM) : (profile.warnings ?? []);
    return codes.map((c) => PROFILE_WARNING_TEXT[c]);
  });
  protected readonly uncertainty = computed(() => {
    const r = this.reach();
    return r?.status === 'ready' ? reachUncertainty(r.analysis) : '';
  });

  /** Drill targets with their predicted hit rates, and the next target. */
  protected readonly targets = computed<ReachTarget[]>(() => {
    const r = this.reach();
    if (r?.status !== 'ready') {
      return [];
    }
    const curve = r.analysis.curve;
    const targets: ReachTarget[] = drillTargets(this.kicks(), r.technique).map((t) => ({
      distanceM: t.distanceM,
      radiusM: t.radiusM,
      kind: 'drill',
      reps: t.reps,
      probability: curveHitProbability(curve, t.distanceM, t.radiusM),
    }));
    const next = r.analysis.nextTarget;
    if (next.kind === 'target') {
      targets.push({ distanceM: next.distanceM, radiusM: next.radiusM, kind: 'next', reps: null, probability: next.probability });
    }
    return targets;
  });

  protected readonly summary = computed(() => {
    const r = this.reach();
    if (r?.status !== 'ready') {
      return '';
    }
    const e = r.analysis.envelope;
    return (
      `${TECHNIQUE_LABELS[r.technique]} reach envelope: median carry ${e.carryM.p50.toFixed(1)} m, 80 % of kicks between ` +
      `${e.carryM.p10.toFixed(1)} and ${e.carryM.p90.toFixed(1)} m; reliable reach ${this.headline()}. ` +
      `${this.targets().length} targets drawn.`
    );
  });
}
