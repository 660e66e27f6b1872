import { Type, provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { DEFAULT_PRIORS, fitProfile, reachEnvelope } from '../../../../shared/flight';
import type { Outcome } from '../../../../shared/schemas/sync';
import { CalibrationChart } from './calibration-chart';
import { OutcomeMixChart } from './outcome-mix-chart';
import { ProgressChart } from './progress-chart';
import { ReachDiagram } from './reach-diagram';
import { ZoneRateChart } from './zone-rate-chart';

function shares(set: Partial<Record<Outcome, number>>): Record<Outcome, number> {
  return { on_target: 0, short: 0, long: 0, left: 0, right: 0, blocked: 0, over: 0, ...set };
}

async function render<T>(component: Type<T>, inputs: Record<string, unknown>, widthPx = 360): Promise<ComponentFixture<T>> {
  TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
  const fixture = TestBed.createComponent(component);
  const host = fixture.nativeElement as HTMLElement;
  host.style.display = 'block';
  host.style.width = `${widthPx}px`;
  document.body.appendChild(host);
  for (const [name, value] of Object.entries(inputs)) {
    fixture.componentRef.setInput(name, value);
  }
  await fixture.whenStable();
  return fixture;
}

function count(fixture: ComponentFixture<unknown>, selector: string): number {
  return (fixture.nativeElement as HTMLElement).querySelectorAll(selector).length;
}

describe('charts', () => {
  afterEach(() => {
    for (const el of Array.from(
      document.body.querySelectorAll('ll-progress-chart, ll-outcome-mix-chart, ll-reach-diagram, ll-zone-rate-chart, ll-calibration-chart'),
    )) {
      el.remove();
    }
  });

  it('ProgressChart draws one point per week, the line and the band, and lists every week', async () => {
    const points = [
      { weekStart: '2025-02-17', value: 26, low: 24, high: 28, reps: 12 },
      { weekStart: '2025-02-24', value: 27.5, low: 25, high: 30, reps: 20 },
      { weekStart: '2025-03-03', value: 29, low: null, high: null, reps: 3 },
    ];
    const f = await render(ProgressChart, { points, valueLabel: 'Median carry', bandLabel: 'Middle half', summary: 'Progress' });
    expect(count(f, 'svg circle.ll-progress__point')).toBe(3);
    expect(count(f, 'svg path.ll-progress__line')).toBe(1);
    expect(count(f, 'svg path.ll-progress__band')).toBe(1);
    expect(count(f, 'details tbody tr')).toBe(3);
    const svg = (f.nativeElement as HTMLElement).querySelector('svg')!;
    expect(svg.getAttribute('width')).toBe('360');
    expect(svg.getAttribute('aria-label')).toBe('Progress');
  });

  it('ProgressChart says when there is nothing to draw', async () => {
    const f = await render(ProgressChart, { points: [], valueLabel: 'Hit rate', bandLabel: '95 %', summary: 'x' });
    expect(count(f, 'svg circle.ll-progress__point')).toBe(0);
    expect((f.nativeElement as HTMLElement).querySelector('svg text.ll-chart__empty')?.textContent).toContain('No weeks');
  });

  it('ProgressChart redraws to its new width', async () => {
    const f = await render(
      ProgressChart,
      {
        points: [{ weekStart: '2025-03-03', value: 0.5, low: 0.3, high: 0.7, reps: 10 }],
        valueLabel: 'Hit rate',
        bandLabel: '95 %',
        kind: 'share',
        summary: 'x',
      },
      360,
    );
    (f.nativeElement as HTMLElement).style.width = '720px';
    await new Promise((resolve) => setTimeout(resolve, 50));
    await f.whenStable();
    expect((f.nativeElement as HTMLElement).querySelector('svg')!.getAttribute('width')).toBe('720');
  });

  it('OutcomeMixChart draws a segment for each outcome that happened in each week', async () => {
    const weeks = [
      { weekStart: '2025-02-24', reps: 10, share: shares({ on_target: 0.5, short: 0.3, left: 0.2 }) },
      { weekStart: '2025-03-03', reps: 4, share: shares({ on_target: 0.25, long: 0.25, blocked: 0.25, over: 0.25 }) },
    ];
    const f = await render(OutcomeMixChart, { weeks, summary: 'Mix' });
    expect(count(f, 'svg rect.ll-outcome__segment')).toBe(7);
    expect(count(f, 'svg rect.ll-outcome__segment--blocked')).toBe(1);
    expect(count(f, 'details tbody tr')).toBe(2);
  });

  it('ReachDiagram draws every landing, the ellipse, the targets and the reliable-reach ring', async () => {
    const base = fitProfile([], { ...DEFAULT_PRIORS.lofted, technique: 'lofted' });
    const envelope = reachEnvelope({ ...base, meanSpeedMs: 21, sdSpeedMs: 1.2 }, {}, { samples: 150, seed: 3, reliableReachRadiusM: 3 });
    const targets = [
      { distanceM: 30, radiusM: 3, kind: 'drill', reps: 12, probability: 0.4 },
      { distanceM: 35, radiusM: 3, kind: 'drill', reps: 4, probability: 0.2 },
      { distanceM: 31.5, radiusM: 3, kind: 'next', reps: null, probability: 0.55 },
    ];
    const f = await render(ReachDiagram, { picture: envelope, targets, reliableReachM: 28.4, summary: 'Reach' });
    expect(count(f, 'svg circle.ll-reach__landing')).toBe(150);
    expect(count(f, 'svg path.ll-reach__ellipse')).toBe(1);
    expect(count(f, 'svg circle.ll-reach__target--drill')).toBe(2);
    expect(count(f, 'svg circle.ll-reach__target--next')).toBe(1);
    expect(count(f, 'svg circle.ll-reach__reliable')).toBe(1);
    expect((f.nativeElement as HTMLElement).querySelector('details')?.textContent).toContain('Next target 31.5 m, radius 3 m');
  });

  it('ReachDiagram is drawn to scale: one metre is as long across as along', async () => {
    const base = fitProfile([], { ...DEFAULT_PRIORS.lofted, technique: 'lofted' });
    const envelope = reachEnvelope({ ...base, meanSpeedMs: 21 }, {}, { samples: 50, seed: 1 });
    const f = await render(ReachDiagram, {
      picture: envelope,
      targets: [{ distanceM: 20, radiusM: 4, kind: 'drill', reps: 1, probability: null }],
      summary: 'Reach',
    });
    const ring = (f.nativeElement as HTMLElement).querySelectorAll<SVGCircleElement>('svg circle.ll-reach__ring');
    const target = (f.nativeElement as HTMLElement).querySelector<SVGCircleElement>('svg circle.ll-reach__target')!;
    const spotY = Number(ring[0]!.getAttribute('cy'));
    const pxPerM = (spotY - Number(target.getAttribute('cy'))) / 20;
    expect(Number(target.getAttribute('r'))).toBeCloseTo(4 * pxPerM, 6);
  });

  it('ZoneRateChart draws one bar per distance band', async () => {
    const zones = [
      { bandStartM: 20, bandEndM: 25, reps: 20, hitRate: 0.7 },
      { bandStartM: 25, bandEndM: 30, reps: 34, hitRate: 0.5 },
      { bandStartM: 30, bandEndM: 35, reps: 2, hitRate: 0 },
    ];
    const f = await render(ZoneRateChart, { zones, summary: 'Zones' });
    expect(count(f, 'svg rect.ll-zone__bar')).toBe(3);
    expect(count(f, 'details tbody tr')).toBe(3);
  });

  it('ZoneRateChart leaves a gap for a band nobody trained at', async () => {
    const zones = [
      { bandStartM: 40, bandEndM: 45, reps: 114, hitRate: 0.42 },
      { bandStartM: 50, bandEndM: 55, reps: 87, hitRate: 0.36 },
    ];
    const f = await render(ZoneRateChart, { zones, summary: 'Zones' });
    expect(count(f, 'svg rect.ll-zone__bar')).toBe(2);
    const ticks = Array.from((f.nativeElement as HTMLElement).querySelectorAll('svg .ll-chart__axis .tick text')).map((t) => t.textContent);
    expect(ticks).toContain('45–50 m');
  });

  it('CalibrationChart draws one dot per player and the diagonal', async () => {
    const marks = [
      { id: 'a', label: '7 Ada', reps: 30, predicted: 0.5, observed: 0.6 },
      { id: 'b', label: '9 Bo', reps: 44, predicted: 0.45, observed: 0.4 },
    ];
    const f = await render(CalibrationChart, { marks, summary: 'Calibration' });
    expect(count(f, 'svg circle.ll-calibration__point')).toBe(2);
    expect(count(f, 'svg line.ll-calibration__diagonal')).toBe(1);
    const big = (f.nativeElement as HTMLElement).querySelectorAll<SVGCircleElement>('svg circle.ll-calibration__point');
    expect(Number(big[1]!.getAttribute('r'))).toBeGreaterThan(Number(big[0]!.getAttribute('r')));
  });
});
