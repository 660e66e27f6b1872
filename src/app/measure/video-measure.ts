import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  input,
  signal,
  viewChild,
  type ElementRef,
} from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MIN_TRACK_POINTS, type LaunchTrackResult, type TrackPoint } from '../../../shared/flight';
import { videoTrackSchema, type VideoTrack } from '../../../shared/schemas/sync';
import { KickStore } from '../core/kick-store';
import { SessionStore } from '../core/session-store';
import { FlightEngine } from '../flight/flight-engine';
import { ROUGH_SPIN_SD_RPS, sessionConditions, spinWords, suggestedStepFrames, videoPixelAt } from './frame-geometry';

/** What a tap on the frame marks. */
type TapTarget = 'ball' | 'spot' | 'mark';

/** A ground mark as tapped: its pixel in the video's frame. */
interface MarkPixel {
  xPx: number;
  yPx: number;
}

/** Crosshair steps for the keyboard, video pixels (Shift: the larger). */
const KEY_STEP_PX = 2;
const KEY_BIG_STEP_PX = 20;

/**
 * Measure from video (`/measure/:kickId`): the coach opens a side-on clip of a logged repetition, marks
 * the kick spot and a second ground point at known distances, taps the ball in frames across the flight,
 * and the flight model — fitted in the flight worker — gives the launch speed, angle and backspin with
 * their spread, drawn back over the frame. The clip stays on the phone (an object URL, never uploaded);
 * only the taps and the result are saved to the kick, offline first like every Pitchside change.
 */
@Component({
  selector: 'll-video-measure',
  imports: [FormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, RouterLink],
  templateUrl: './video-measure.html',
  styleUrl: './video-measure.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VideoMeasure {
  private readonly kicks = inject(KickStore);
  private readonly sessions = inject(SessionStore);
  private readonly engine = inject(FlightEngine);

  /** The kick to measure, from the route (`:kickId`). */
  readonly kickId = input<string | undefined>(undefined);

  private readonly id = computed(() => this.kickId() ?? null);
  protected readonly kick = this.kicks.liveKick(this.id);
  private readonly sessionId = computed(() => this.kick()?.sessionId ?? null);
  protected readonly session = this.sessions.liveSession(this.sessionId);
  private readonly drills = this.sessions.liveDrills(this.sessionId);
  private readonly drill = computed(() => this.drills()?.find((d) => d.id === this.kick()?.drillId) ?? null);

  private readonly video = viewChild<ElementRef<HTMLVideoElement>>('video');
  protected readonly videoUrl = signal<string | null>(null);
  protected readonly fileName = signal('');
  protected readonly frameWidthPx = signal(0);
  protected readonly frameHeightPx = signal(0);
  protected readonly durationS = signal(0);
  /** Frame rate the clip was filmed at (the coach can correct it). */
  protected readonly framesPerSecond = signal(30);
  protected readonly frameIndex = signal(0);
  protected readonly lastFrame = computed(() => Math.max(0, Math.floor(this.durationS() * this.framesPerSecond()) - 1));
  protected readonly frameTimeS = computed(() => this.frameIndex() / this.framesPerSecond());
  protected readonly zoom = signal(1);
  protected readonly target = signal<TapTarget>('spot');
  protected readonly spot = signal<MarkPixel | null>(null);
  protected readonly mark = signal<MarkPixel | null>(null);
  /** Distances of the two ground marks from the kick spot, m (the drill's target by default). */
  protected readonly spotAlongM = signal(0);
  protected readonly markAlongM = signal<number | null>(null);
  /** Ball taps by frame index: a second tap in the same frame moves it. */
  protected readonly taps = signal<ReadonlyMap<number, MarkPixel>>(new Map());
  protected readonly crosshair = signal<MarkPixel>({ xPx: 0, yPx: 0 });
  protected readonly result = signal<LaunchTrackResult | null>(null);
  protected readonly solving = signal(false);
  protected readonly saveState = signal<'idle' | 'saving' | 'saved' | 'failed'>('idle');
  protected readonly saveMessage = signal('');

  protected readonly tapList = computed(() =>
    [...this.taps().entries()].sort((a, b) => a[0] - b[0]).map(([frame, px]) => ({ frame, tS: frame / this.framesPerSecond(), ...px })),
  );
  protected readonly stepFrames = computed(() => suggestedStepFrames(this.framesPerSecond()));
  protected readonly canSolve = computed(
    () => this.spot() !== null && this.mark() !== null && this.markAlongM() !== null && this.tapList().length >= MIN_TRACK_POINTS,
  );
  protected readonly fit = computed(() => {
    const r = this.result();
    return r && r.ok ? r : null;
  });
  protected readonly refusal = computed(() => {
    const r = this.result();
    return r && !r.ok ? r.message : null;
  });
  protected readonly pathPoints = computed(() =>
    (this.fit()?.pathPx ?? []).map((p) => `${p.xPx.toFixed(1)},${p.yPx.toFixed(1)}`).join(' '),
  );
  protected readonly spinText = computed(() => {
    const f = this.fit();
    return f ? spinWords(f.backspinRps, f.uncertainty.backspinRps) : '';
  });
  protected readonly spinRough = computed(() => {
    const f = this.fit();
    return f !== null && !(f.uncertainty.backspinRps <= ROUGH_SPIN_SD_RPS);
  });
  protected readonly viewBox = computed(() => `0 0 ${this.frameWidthPx()} ${this.frameHeightPx()}`);
  protected readonly ballRadiusPx = computed(() => Math.max(4, this.frameWidthPx() / 160));

  constructor() {
    // The drill's target is the default far mark (a cone at the target is the usual second ground point).
    effect(() => {
      const distance = this.drill()?.targetDistanceM ?? this.kick()?.targetDistanceM;
      if (distance !== undefined && this.markAlongM() === null) this.markAlongM.set(distance);
    });
    inject(DestroyRef).onDestroy(() => this.releaseVideo());
  }

  /** Opens a clip from the phone: shown from memory, never sent anywhere. */
  protected openVideo(event: Event): void {
    const file = (event.target as HTMLInputElement).files?.[0];
    if (!file) return;
    this.releaseVideo();
    this.fileName.set(file.name);
    this.videoUrl.set(URL.createObjectURL(file));
    this.taps.set(new Map());
    this.spot.set(null);
    this.mark.set(null);
    this.result.set(null);
    this.target.set('spot');
    this.frameIndex.set(0);
  }

  protected videoLoaded(): void {
    const v = this.video()?.nativeElement;
    if (!v) return;
    this.frameWidthPx.set(v.videoWidth);
    this.frameHeightPx.set(v.videoHeight);
    this.durationS.set(Number.isFinite(v.duration) ? v.duration : 0);
    this.crosshair.set({ xPx: v.videoWidth / 2, yPx: v.videoHeight / 2 });
    this.showFrame(0);
  }

  /** Shows frame `n`: seeks to the middle of its display interval, so rounding never lands on a neighbour. */
  protected showFrame(n: number): void {
    const frame = Math.min(this.lastFrame(), Math.max(0, Math.round(n)));
    this.frameIndex.set(frame);
    const v = this.video()?.nativeElement;
    if (v) v.currentTime = (frame + 0.5) / this.framesPerSecond();
  }

  protected setFramesPerSecond(value: number | string): void {
    const fps = Number(value);
    if (Number.isFinite(fps) && fps >= 10 && fps <= 1000) {
      this.framesPerSecond.set(fps);
      this.result.set(null);
      this.showFrame(this.frameIndex());
    }
  }

  /** A tap or click on the frame marks the chosen target at the pixel under it. */
  protected tapFrame(event: MouseEvent): void {
    const v = this.video()?.nativeElement;
    if (!v) return;
    const px = videoPixelAt(v.getBoundingClientRect(), this.frameWidthPx(), this.frameHeightPx(), event.clientX, event.clientY);
    if (px === null) return;
    this.crosshair.set(px);
    this.place(px);
  }

  /** Keyboard marking: arrows move the crosshair, Enter or Space marks at it. */
  protected keyOnFrame(event: KeyboardEvent): void {
    const step = event.shiftKey ? KEY_BIG_STEP_PX : KEY_STEP_PX;
    const moves: Record<string, [number, number]> = {
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
    };
    const move = moves[event.key];
    if (move) {
      const c = this.crosshair();
      this.crosshair.set({
        xPx: Math.min(this.frameWidthPx(), Math.max(0, c.xPx + move[0])),
        yPx: Math.min(this.frameHeightPx(), Math.max(0, c.yPx + move[1])),
      });
    } else if (event.key === 'Enter' || event.key === ' ') {
      this.place(this.crosshair());
    } else if (event.key === ',' || event.key === '.') {
      this.showFrame(this.frameIndex() + (event.key === ',' ? -1 : 1));
    } else {
      return;
    }
    event.preventDefault();
  }

  private place(px: MarkPixel): void {
    this.result.set(null);
    this.saveState.set('idle');
    const t = this.target();
    if (t === 'spot') {
      this.spot.set(px);
      if (this.mark() === null) this.target.set('mark');
    } else if (t === 'mark') {
      this.mark.set(px);
      this.target.set('ball');
    } else {
      this.taps.update((m) => new Map(m).set(this.frameIndex(), px));
    }
  }

  protected removeTap(frame: number): void {
    this.taps.update((m) => {
      const next = new Map(m);
      next.delete(frame);
      return next;
    });
    this.result.set(null);
  }

  /** Fits the flight model to the taps in the flight worker. */
  protected async measure(): Promise<void> {
    const spot = this.spot();
    const mark = this.mark();
    const markAlongM = this.markAlongM();
    if (!spot || !mark || markAlongM === null) return;
    const points: TrackPoint[] = this.tapList().map((p) => ({ tS: p.tS, xPx: p.xPx, yPx: p.yPx }));
    this.solving.set(true);
    try {
      const result = await firstValueFrom(
        this.engine.launchFromTrack({
          points,
          calibration: { a: { ...spot, alongM: this.spotAlongM() }, b: { ...mark, alongM: markAlongM } },
          conditions: sessionConditions(this.session()),
        }),
      );
      this.result.set(result);
    } catch (e) {
      this.result.set({ ok: false, code: 'no_kick_fits', message: e instanceof Error ? e.message : String(e) });
    } finally {
      this.solving.set(false);
    }
  }

  /** Saves the measurement to the repetition on this phone; the outbox carries it to the server. */
  protected async save(): Promise<void> {
    const fit = this.fit();
    const id = this.id();
    const spot = this.spot();
    const mark = this.mark();
    if (!fit || !id || !spot || !mark) return;
    const candidate: VideoTrack = {
      frameWidthPx: this.frameWidthPx(),
      frameHeightPx: this.frameHeightPx(),
      points: this.tapList().map((p) => ({ tS: p.tS, xPx: p.xPx, yPx: p.yPx })),
      calibration: { a: { ...spot, alongM: this.spotAlongM() }, b: { ...mark, alongM: this.markAlongM() ?? 0 } },
      backspinRps: fit.backspinRps,
      contactTimeS: fit.contactTimeS,
      rmsResidualPx: fit.rmsResidualPx,
      uncertainty: {
        speedMs: fit.uncertainty.speedMs,
        elevationDeg: fit.uncertainty.elevationDeg,
        backspinRps: fit.uncertainty.backspinRps,
      },
    };
    const parsed = videoTrackSchema.safeParse(candidate);
    if (!parsed.success) {
      this.saveState.set('failed');
      this.saveMessage.set(
        'This fit cannot be saved: its spread could not be worked out. Add taps across the whole flight and measure again.',
      );
      return;
    }
    this.saveState.set('saving');
    try {
      await this.kicks.recordVideoMeasurement(id, { speedMs: fit.speedMs, elevationDeg: fit.elevationDeg, videoTrack: parsed.data });
      this.saveState.set('saved');
      this.saveMessage.set('Saved on this phone. It goes to the club with the next sync.');
    } catch (e) {
      this.saveState.set('failed');
      this.saveMessage.set(e instanceof Error ? e.message : 'Not saved.');
    }
  }

  private releaseVideo(): void {
    const url = this.videoUrl();
    if (url) URL.revokeObjectURL(url);
  }
}
