import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  ViewEncapsulation,
  afterRenderEffect,
  computed,
  inject,
  input,
  output,
  viewChild,
} from '@angular/core';
import { select, type Selection } from 'd3';
import { GOAL_WIDTH_M } from '../../../shared/flight';
import { injectChartWidth } from '../ui/charts/chart-width';
import { attackingHalfMarkings, viewBoxAttr, wallPlacement, type PitchPoint } from '../ui/pitch-markings';
import type { PlannerSpot } from './planner-rank';
import { describeSpot } from './planner-text';
import { ClubFormat } from '../core/club-format';

/** Drawn width of a wall of four to five players, m (common practice; the model treats the wall as wide enough). */
const WALL_DRAWN_WIDTH_M = 2.6;
/** Touch target around the ball, px: at least 48 px across (docs/design.md §9). */
const BALL_TARGET_RADIUS_PX = 26;
/** Keyboard steps, m. */
const STEP_M = 0.5;
const BIG_STEP_M = 2;

/**
 * Top view of the attacking half to scale (IFAB Laws of the Game, Law 1 markings from `pitch-markings.ts`),
 * with the ball, the line from the ball to the goal, the aim line and the wall 9.15 m from the ball on the
 * line to the goal (Law 13). The ball moves by dragging it (mouse, pen or finger: pointer events, with a
 * touch target of at least 48 px), by tapping the pitch, or with the arrow keys; every move is emitted in
 * metres and the owner decides where the ball may stand.
 */
@Component({
  selector: 'll-set-piece-pitch',
  template: `<svg #svg class="ll-pitch__svg" role="group" [attr.aria-label]="'Attacking half, to scale. ' + description()"></svg>`,
  styles: `
    ll-set-piece-pitch {
      display: block;
      --ll-pitch-board: light-dark(#1b2a41, #0f1a2b);
      --ll-pitch-chalk: #f7f5f0;
      --ll-pitch-ball: #f0a202;
      --ll-pitch-wall: #e58a77;
    }
    .ll-pitch__svg {
      display: block;
      width: 100%;
      height: auto;
      border-radius: var(--mat-sys-corner-medium);
      user-select: none;
      -webkit-user-select: none;
    }
    .ll-pitch__board {
      fill: var(--ll-pitch-board);
    }
    .ll-pitch__line {
      fill: none;
      stroke: var(--ll-pitch-chalk);
      stroke-opacity: 0.85;
      stroke-width: 1.5px;
      vector-effect: non-scaling-stroke;
    }
    .ll-pitch__goal {
      fill: color-mix(in srgb, var(--ll-pitch-chalk) 15%, transparent);
      stroke: var(--ll-pitch-chalk);
      stroke-width: 3px;
      vector-effect: non-scaling-stroke;
    }
    .ll-pitch__spot {
      fill: var(--ll-pitch-chalk);
    }
    .ll-pitch__to-goal {
      stroke: var(--ll-pitch-chalk);
      stroke-opacity: 0.6;
      stroke-width: 1.5px;
      stroke-dasharray: 4 4;
      vector-effect: non-scaling-stroke;
    }
    .ll-pitch__aim {
      stroke: var(--ll-pitch-ball);
      stroke-width: 2px;
      stroke-dasharray: 8 4;
      vector-effect: non-scaling-stroke;
    }
    .ll-pitch__wall {
      stroke: var(--ll-pitch-wall);
      stroke-width: 7px;
      stroke-linecap: round;
      vector-effect: non-scaling-stroke;
    }
    .ll-pitch__ball {
      cursor: grab;
      touch-action: none;
      outline: none;
    }
    .ll-pitch__ball:active {
      cursor: grabbing;
    }
    .ll-pitch__ball-target {
      fill: transparent;
    }
    .ll-pitch__ball-mark {
      fill: var(--ll-pitch-ball);
      stroke: #1b2a41;
      stroke-width: 2px;
      vector-effect: non-scaling-stroke;
    }
    .ll-pitch__ball:focus-visible .ll-pitch__ball-target {
      fill: none;
      stroke: var(--ll-pitch-ball);
      stroke-width: 3px;
      vector-effect: non-scaling-stroke;
    }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetPiecePitch {
  /** Ball, wall height and aim being planned. */
  readonly spot = input.required<PlannerSpot>();
  /** Emitted with the new ball position in metres (pitch frame) whenever the user moves it. */
  readonly ballMove = output<PitchPoint>();

  private readonly svgRef = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly fmt = inject(ClubFormat).format;
  private readonly width = injectChartWidth();
  private readonly markings = attackingHalfMarkings();
  private dragPointer: number | null = null;
  /** Where the last keyboard move put the ball, until the owner's new spot arrives (keys repeat faster). */
  private nudged: PitchPoint | null = null;
  private dragged = false;
  protected readonly description = computed(() => describeSpot(this.spot(), this.fmt()));

  constructor() {
    afterRenderEffect(() => this.draw());
  }

  private draw(): void {
    const spot = this.spot();
    const m = this.markings;
    const svgEl = this.svgRef().nativeElement;
    const widthPx = this.width() || svgEl.getBoundingClientRect().width || 360;
    const pxPerM = widthPx / m.viewBox.width;
    const svg = select(svgEl).attr('viewBox', viewBoxAttr(m.viewBox));
    if (svg.select('g.ll-pitch__static').empty()) this.drawStatic(svg);

    const ball = spot.ball;
    this.nudged = null;
    const wall = wallPlacement(ball);
    const aimX = spot.aimXM;
    const half = WALL_DRAWN_WIDTH_M / 2;
    const dynamic = svg.selectAll<SVGGElement, null>('g.ll-pitch__dynamic').data([null]).join('g').attr('class', 'll-pitch__dynamic');
    dynamic
      .selectAll<SVGLineElement, null>('line.ll-pitch__to-goal')
      .data([null])
      .join('line')
      .attr('class', 'll-pitch__to-goal')
      .attr('x1', ball.x)
      .attr('y1', ball.y)
      .attr('x2', 0)
      .attr('y2', 0);
    dynamic
      .selectAll<SVGLineElement, null>('line.ll-pitch__aim')
      .data([null])
      .join('line')
      .attr('class', 'll-pitch__aim')
      .attr('x1', ball.x)
      .attr('y1', ball.y)
      .attr('x2', Math.max(-GOAL_WIDTH_M / 2, Math.min(GOAL_WIDTH_M / 2, aimX)))
      .attr('y2', 0);
    dynamic
      .selectAll<SVGLineElement, null>('line.ll-pitch__wall')
      .data([null])
      .join('line')
      .attr('class', 'll-pitch__wall')
      .attr('x1', wall.centre.x - wall.along.x * half)
      .attr('y1', wall.centre.y - wall.along.y * half)
      .attr('x2', wall.centre.x + wall.along.x * half)
      .attr('y2', wall.centre.y + wall.along.y * half);

    const ballG = dynamic
      .selectAll<SVGGElement, null>('g.ll-pitch__ball')
      .data([null])
      .join((enter) => this.enterBall(enter.append('g')))
      .attr('transform', `translate(${ball.x},${ball.y})`)
      .attr('aria-label', `Ball: ${this.description()} Drag it, tap the pitch, or use the arrow keys to move it.`);
    ballG.select('circle.ll-pitch__ball-target').attr('r', BALL_TARGET_RADIUS_PX / pxPerM);
    ballG.select('circle.ll-pitch__ball-mark').attr('r', Math.max(0.5, 8 / pxPerM));
  }

  private drawStatic(svg: Selection<SVGSVGElement, unknown, null, undefined>): void {
    const m = this.markings;
    const g = svg.append('g').attr('class', 'll-pitch__static').attr('aria-hidden', 'true');
    g.append('rect')
      .attr('class', 'll-pitch__board')
      .attr('x', m.viewBox.minX)
      .attr('y', m.viewBox.minY)
      .attr('width', m.viewBox.width)
      .attr('height', m.viewBox.height);
    g.selectAll('path.ll-pitch__line')
      .data(m.paths)
      .join('path')
      .attr('class', 'll-pitch__line')
      .attr('d', (d) => d);
    g.append('path').attr('class', 'll-pitch__goal').attr('d', m.goal);
    g.selectAll('circle.ll-pitch__spot')
      .data(m.spots)
      .join('circle')
      .attr('class', 'll-pitch__spot')
      .attr('cx', (s) => s.x)
      .attr('cy', (s) => s.y)
      .attr('r', (s) => s.r * 2);
    svg.on('click', (event: MouseEvent) => {
      if (this.dragged) {
        this.dragged = false;
        return;
      }
      this.ballMove.emit(this.toMetres(event));
    });
  }

  private enterBall(g: Selection<SVGGElement, null, SVGGElement, null>): Selection<SVGGElement, null, SVGGElement, null> {
    g.attr('class', 'll-pitch__ball').attr('tabindex', 0).attr('role', 'button').attr('data-testid', 'planner-ball');
    g.append('circle').attr('class', 'll-pitch__ball-target');
    g.append('circle').attr('class', 'll-pitch__ball-mark');
    g.on('pointerdown', (event: PointerEvent) => {
      event.preventDefault();
      event.stopPropagation();
      (event.currentTarget as Element).setPointerCapture(event.pointerId);
      this.dragPointer = event.pointerId;
      this.dragged = false;
    })
      .on('pointermove', (event: PointerEvent) => {
        if (this.dragPointer !== event.pointerId) return;
        this.dragged = true;
        this.ballMove.emit(this.toMetres(event));
      })
      .on('pointerup pointercancel', (event: PointerEvent) => {
        if (this.dragPointer !== event.pointerId) return;
        this.dragPointer = null;
        (event.currentTarget as Element).releasePointerCapture(event.pointerId);
      })
      .on('click', (event: MouseEvent) => {
        // A tap on the ball itself is not a move; a drag's trailing click neither.
        event.stopPropagation();
        this.dragged = false;
      })
      .on('keydown', (event: KeyboardEvent) => this.nudge(event));
    return g;
  }

  private nudge(event: KeyboardEvent): void {
    const step = event.shiftKey ? BIG_STEP_M : STEP_M;
    const moves: Record<string, [number, number]> = {
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
    };
    const move = moves[event.key];
    if (!move) return;
    event.preventDefault();
    const ball = this.nudged ?? this.spot().ball;
    this.nudged = { x: ball.x + move[0], y: ball.y + move[1] };
    this.ballMove.emit(this.nudged);
  }

  private toMetres(event: MouseEvent): PitchPoint {
    const svg = this.svgRef().nativeElement;
    const ctm = svg.getScreenCTM();
    if (!ctm) return this.spot().ball;
    const p = new DOMPoint(event.clientX, event.clientY).matrixTransform(ctm.inverse());
    return { x: p.x, y: p.y };
  }
}
