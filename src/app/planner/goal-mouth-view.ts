import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  ViewEncapsulation,
  afterRenderEffect,
  computed,
  input,
  viewChild,
} from '@angular/core';
import { select, symbol, symbolCross, symbolTriangle } from 'd3';
import { GOAL_CROSSING, type GoalCrossingKind, type SetPieceCloudResult } from '../flight/set-piece-rank';
import { goalMouthMarkings, viewBoxAttr } from '../ui/pitch-markings';

/** One drawn kick: goal-mouth frame (x across, + right as the kicker faces the goal; SVG y = −height). */
interface CloudMark {
  readonly i: number;
  readonly x: number;
  readonly y: number;
  readonly kind: GoalCrossingKind;
  /** Whether the kick crossed outside the drawn area and is pinned to its edge. */
  readonly pinned: boolean;
}

const KIND_CLASS: Record<GoalCrossingKind, string> = {
  [GOAL_CROSSING.in]: 'in',
  [GOAL_CROSSING.over]: 'over',
  [GOAL_CROSSING.wide]: 'wide',
};

/** Legend rows: the mark's class, its words. */
const LEGEND: readonly { kind: string; label: string }[] = [
  { kind: 'in', label: 'in, under the bar' },
  { kind: 'over', label: 'over the bar' },
  { kind: 'wide', label: 'wide' },
];

/**
 * The goal seen from the field, to scale (7.32 × 2.44 m, IFAB Laws of the Game, Law 1), with where each
 * simulated kick that cleared the wall crossed the goal line: a landing cloud in the goal mouth. Kicks in
 * are dots, over the bar triangles, wide crosses (shape as well as colour, for colour-blind readers);
 * kicks beyond the drawing are pinned to its edge, drawn fainter. `summary` is the accessible name; the planner's table
 * carries the same shares.
 */
@Component({
  selector: 'll-goal-mouth-view',
  template: `
    <svg #svg class="ll-goal-mouth__svg" role="img" [attr.aria-label]="summary()"></svg>
    <ul class="ll-goal-mouth__legend" aria-hidden="true">
      @for (row of legend; track row.kind) {
        <li>
          <svg width="14" height="14" viewBox="-7 -7 14 14">
            <path [attr.d]="legendPath(row.kind)" [attr.class]="'ll-goal-mouth__mark ll-goal-mouth__mark--' + row.kind" />
          </svg>
          {{ row.label }}
        </li>
      }
    </ul>
  `,
  styles: `
    ll-goal-mouth-view {
      display: block;
      --ll-cloud-in: light-dark(#006a60, #5fd6c4);
      --ll-cloud-over: light-dark(#8a5700, #f0a202);
      --ll-cloud-wide: light-dark(#5d5f66, #b9bcc6);
    }
    .ll-goal-mouth__svg {
      display: block;
      width: 100%;
      height: auto;
      background: var(--mat-sys-surface-container-low);
      border-radius: var(--mat-sys-corner-medium);
    }
    .ll-goal-mouth__ground {
      stroke: var(--mat-sys-on-surface-variant);
      stroke-width: 1.5px;
      vector-effect: non-scaling-stroke;
    }
    .ll-goal-mouth__frame {
      fill: var(--mat-sys-on-surface);
    }
    .ll-goal-mouth__mark {
      stroke-width: 1px;
      vector-effect: non-scaling-stroke;
    }
    .ll-goal-mouth__mark--in {
      fill: color-mix(in srgb, var(--ll-cloud-in) 70%, transparent);
      stroke: var(--ll-cloud-in);
    }
    .ll-goal-mouth__mark--over {
      fill: color-mix(in srgb, var(--ll-cloud-over) 70%, transparent);
      stroke: var(--ll-cloud-over);
    }
    .ll-goal-mouth__mark--wide {
      fill: color-mix(in srgb, var(--ll-cloud-wide) 70%, transparent);
      stroke: var(--ll-cloud-wide);
    }
    .ll-goal-mouth__mark--pinned {
      opacity: 0.45;
    }
    .ll-goal-mouth__legend {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 16px;
      margin: 6px 0 0;
      padding: 0;
      list-style: none;
      font: var(--mat-sys-label-medium);
    }
    .ll-goal-mouth__legend li {
      display: inline-flex;
      align-items: center;
      gap: 6px;
    }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GoalMouthView {
  /** The selected player's set-piece result with its cloud, or null while there is none. */
  readonly result = input.required<SetPieceCloudResult | null>();
  /** The chart's accessible name: the shares in words. */
  readonly summary = input.required<string>();

  private readonly svgRef = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly markings = goalMouthMarkings(3.5, 1.6);
  protected readonly legend = LEGEND;

  /** The kicks to draw, in goal-mouth coordinates, pinned inside the drawing. */
  private readonly marks = computed<CloudMark[]>(() => {
    const r = this.result();
    if (!r) return [];
    const box = this.markings.viewBox;
    const pad = 0.15;
    return r.cloud.kind.map((kind, i) => {
      // Goal frame y is + to the left; the drawing's x is + to the right.
      const rawX = -r.cloud.yM[i]!;
      const rawY = -r.cloud.zM[i]!;
      const x = Math.min(box.minX + box.width - pad, Math.max(box.minX + pad, rawX));
      const y = Math.min(-pad, Math.max(box.minY + pad, rawY));
      return { i, x, y, kind, pinned: x !== rawX || y !== rawY };
    });
  });

  constructor() {
    afterRenderEffect(() => this.draw());
  }

  protected legendPath(kind: string): string {
    return this.shape(kind === 'in' ? GOAL_CROSSING.in : kind === 'over' ? GOAL_CROSSING.over : GOAL_CROSSING.wide, 40);
  }

  private shape(kind: GoalCrossingKind, size: number): string {
    if (kind === GOAL_CROSSING.in) return symbol().size(size)() ?? '';
    return (
      symbol()
        .type(kind === GOAL_CROSSING.over ? symbolTriangle : symbolCross)
        .size(size)() ?? ''
    );
  }

  private draw(): void {
    const m = this.markings;
    const svg = select(this.svgRef().nativeElement).attr('viewBox', viewBoxAttr(m.viewBox));
    if (svg.select('g.ll-goal-mouth__static').empty()) {
      const g = svg.append('g').attr('class', 'll-goal-mouth__static').attr('aria-hidden', 'true');
      g.selectAll('path.ll-goal-mouth__ground')
        .data(m.paths)
        .join('path')
        .attr('class', 'll-goal-mouth__ground')
        .attr('d', (d) => d);
      g.append('path').attr('class', 'll-goal-mouth__frame').attr('d', m.goal);
    }
    // Marks sized in metres: a dot of about the ball's own size (radius ~0.11 m, IFAB Laws of the Game, Law 2).
    const area = 0.05;
    svg
      .selectAll<SVGGElement, null>('g.ll-goal-mouth__cloud')
      .data([null])
      .join('g')
      .attr('class', 'll-goal-mouth__cloud')
      .selectAll<SVGPathElement, CloudMark>('path.ll-goal-mouth__mark')
      .data(this.marks(), (d) => d.i)
      .join('path')
      .attr(
        'class',
        (d) => `ll-goal-mouth__mark ll-goal-mouth__mark--${KIND_CLASS[d.kind]}${d.pinned ? ' ll-goal-mouth__mark--pinned' : ''}`,
      )
      .attr('d', (d) => this.shape(d.kind, area))
      .attr('transform', (d) => `translate(${d.x},${d.y})`);
  }
}
