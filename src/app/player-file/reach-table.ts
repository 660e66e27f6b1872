import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { describeNextTarget, drillLink } from '../core/analysis/next-target';
import { type TechniqueReach, reachHeadline, reachUncertainty } from './technique-reach';

/** One row as the table shows it. */
interface ReachRow {
  readonly technique: string;
  readonly reps: string;
  readonly reach: string;
  readonly uncertainty: string;
  readonly next: string;
  readonly link: ReturnType<typeof drillLink> | null;
  readonly nextLabel: string;
}

/**
 * Reliable reach and next week's target for every technique: the number with its repetitions and
 * uncertainty, the target where the player is predicted to hit about 55 % of the time, and (for
 * staff) one tap to set that drill up in Pitchside.
 */
@Component({
  selector: 'll-reach-table',
  imports: [MatButtonModule, MatIconModule, MatTableModule, RouterLink],
  template: `
    <div class="reach-table__scroll">
      <table mat-table [dataSource]="rows()" class="reach-table">
        <ng-container matColumnDef="technique">
          <th mat-header-cell *matHeaderCellDef>Technique</th>
          <td mat-cell *matCellDef="let row">{{ row.technique }}</td>
        </ng-container>
        <ng-container matColumnDef="reach">
          <th mat-header-cell *matHeaderCellDef>Reliable reach</th>
          <td mat-cell *matCellDef="let row">
            <span class="reach-table__number">{{ row.reach }}</span>
            <span class="reach-table__detail">{{ row.reps }}</span>
            @if (row.uncertainty) {
              <span class="reach-table__detail">{{ row.uncertainty }}</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="next">
          <th mat-header-cell *matHeaderCellDef>Next target</th>
          <td mat-cell *matCellDef="let row">
            <span class="reach-table__next">{{ row.next }}</span>
            @if (canAddDrill() && row.link; as link) {
              <a mat-stroked-button [routerLink]="link.path" [queryParams]="link.queryParams" [attr.aria-label]="row.nextLabel">
                <mat-icon aria-hidden="true">add_location_alt</mat-icon>
                Add as drill
              </a>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
    </div>
  `,
  styles: `
    .reach-table__scroll {
      overflow-x: auto;
    }
    .reach-table td {
      vertical-align: top;
      padding-block: 8px;
      padding-inline: 8px;
    }
    .reach-table th {
      padding-inline: 8px;
    }
    .reach-table__number {
      display: block;
      font: var(--mat-sys-title-medium);
    }
    .reach-table__detail {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .reach-table__next {
      display: block;
      margin-bottom: 4px;
      max-width: 260px;
    }
    a[mat-stroked-button] {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReachTable {
  /** Each technique's reach, in display order. */
  readonly reaches = input.required<readonly TechniqueReach[]>();
  /** Whether to offer "Add as drill" (staff: Pitchside is theirs). */
  readonly canAddDrill = input(false);

  protected readonly columns = ['technique', 'reach', 'next'];

  protected readonly rows = computed(() => this.reaches().map((r) => this.row(r)));

  private row(reach: TechniqueReach): ReachRow {
    const technique = TECHNIQUE_LABELS[reach.technique];
    const base = { technique, uncertainty: '', link: null, nextLabel: '' };
    switch (reach.status) {
      case 'loading':
        return { ...base, reps: '', reach: '…', next: 'Loading…' };
      case 'error':
        return { ...base, reps: '', reach: '–', next: reach.message };
      case 'empty':
        return {
          ...base,
          reps: reach.entry.pending ? 'Being fitted from the newest kicks' : 'No repetitions yet',
          reach: reachHeadline(reach),
          next: reach.entry.pending ? 'Waiting for the fit' : 'Log some repetitions first',
        };
      case 'computing':
        return {
          ...base,
          reps: this.reps(reach.entry.repetitions, reach.entry.reachRadiusM),
          reach: reachHeadline(reach),
          next: 'Computing the envelope…',
        };
      case 'ready': {
        const next = reach.analysis.nextTarget;
        const link = next.kind === 'target' ? drillLink(reach.technique, next.distanceM, next.radiusM) : null;
        return {
          technique,
          reps: this.reps(reach.entry.repetitions, reach.analysis.radiusM) + (reach.entry.pending ? ' · updating' : ''),
          reach: reachHeadline(reach),
          uncertainty: reachUncertainty(reach.analysis),
          next: describeNextTarget(next),
          link,
          nextLabel:
            next.kind === 'target'
              ? `Add ${technique.toLowerCase()} drill at ${next.distanceM} m, radius ${next.radiusM} m, in Pitchside`
              : '',
        };
      }
    }
  }

  private reps(repetitions: number, radiusM: number): string {
    return `${repetitions} ${repetitions === 1 ? 'repetition' : 'repetitions'} · ${radiusM} m target`;
  }
}
