import { ChangeDetectionStrategy, Component, DestroyRef, InjectionToken, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { startWith, switchMap } from 'rxjs';
import { optionalMetres } from './metres-field';
import { ClubFormat } from '../core/club-format';

/**
 * Milliseconds from a monotonic clock. `performance.now()` in the app (wall-clock changes and NTP steps do
 * not move it); a token so a component spec can step time by hand.
 */
export const HANG_TIMER_CLOCK = new InjectionToken<() => number>('HANG_TIMER_CLOCK', {
  providedIn: 'root',
  factory: () => () => performance.now(),
});

/** A click this soon after a handled pointer-down, and the first since, is that same tap, ms. */
const SAME_TAP_MS = 1500;

/**
 * The Pitchside stopwatch: one large button in the thumb zone, tapped at foot contact and again at the
 * first bounce. The reading lands in `control` (seconds, as text), where the coach can correct or clear it
 * before the repetition is logged; the logger attaches it to the next repetition. Taps are taken on
 * pointer-down, the moment the thumb lands, not on release; the keyboard's click still works.
 */
@Component({
  selector: 'll-hang-timer',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <div class="timer__row">
      <button
        mat-flat-button
        type="button"
        class="timer__tap"
        [class.timer__tap--running]="running()"
        data-testid="hang-timer-tap"
        [attr.aria-label]="running() ? 'Stopwatch: tap at the first bounce' : 'Stopwatch: tap at foot contact'"
        (pointerdown)="tapFromPointer($event)"
        (click)="tapFromClick()"
      >
        <mat-icon aria-hidden="true">timer</mat-icon>
        @if (running()) {
          Bounce · {{ elapsedText() }}
        } @else {
          Contact
        }
      </button>
      <mat-form-field appearance="outline" class="timer__reading" subscriptSizing="dynamic">
        <mat-label>Hang time</mat-label>
        <input matInput inputmode="decimal" [formControl]="control()" placeholder="—" data-testid="hang-time" />
        <span matTextSuffix>s</span>
        @if (control().errors?.['schema']; as message) {
          <mat-error>{{ message }}</mat-error>
        }
      </mat-form-field>
      <button
        mat-icon-button
        type="button"
        class="timer__discard"
        aria-label="Discard time"
        [disabled]="!hasReading() && !running()"
        (click)="discard()"
      >
        <mat-icon aria-hidden="true">close</mat-icon>
      </button>
    </div>
    <p class="timer__note" role="status">{{ note() }}</p>
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .timer__row {
      display: flex;
      gap: 8px;
      align-items: center;
    }
    .timer__tap {
      flex: 1 1 auto;
      min-height: 72px;
      font: var(--mat-sys-title-large);
      text-transform: uppercase;
      touch-action: manipulation;
      user-select: none;
      --mat-button-filled-container-color: var(--mat-sys-secondary-container);
      --mat-button-filled-label-text-color: var(--mat-sys-on-secondary-container);
    }
    .timer__tap--running {
      --mat-button-filled-container-color: var(--mat-sys-tertiary-container);
      --mat-button-filled-label-text-color: var(--mat-sys-on-tertiary-container);
    }
    .timer__reading {
      flex: 0 1 104px;
      min-width: 88px;
    }
    .timer__discard {
      flex: none;
      width: 48px;
      height: 48px;
    }
    .timer__note {
      margin: 0;
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HangTimer {
  private readonly clock = inject(HANG_TIMER_CLOCK);

  /** The reading, seconds as text (owned by the logger, which validates it against the kick schema). */
  readonly control = input.required<FormControl<string>>();
  /** The club's timing bias, s: shown so the coach sees the flight time the model will use. */
  readonly biasS = input.required<number>();

  /** The club's formatter (decimal mark of the shown times). */
  private readonly fmt = inject(ClubFormat).format;
  private readonly startedAt = signal<number | null>(null);
  private readonly now = signal(0);
  /** When the last pointer-down was taken, while its click has not arrived yet (null: none pending). */
  private pointerPendingAt: number | null = null;
  private ticker: ReturnType<typeof setInterval> | null = null;

  protected readonly running = computed(() => this.startedAt() !== null);
  protected readonly elapsedText = computed(() => {
    const started = this.startedAt();
    return started === null ? '' : `${this.fmt().fixed(Math.max(0, this.now() - started) / 1000, 1)} s`;
  });
  private readonly value = toSignal(toObservable(this.control).pipe(switchMap((c) => c.valueChanges.pipe(startWith(c.value)))), {
    initialValue: '',
  });
  protected readonly hasReading = computed(() => this.value().trim() !== '');
  protected readonly note = computed(() => {
    if (this.running()) return 'Timing… tap again at the first bounce.';
    const reading = optionalMetres(this.value());
    if (reading === null || Number.isNaN(reading)) return 'Tap at foot contact, then at the first bounce.';
    const flight = reading - this.biasS();
    const f = this.fmt();
    return `Goes with the next repetition: about ${f.fixed(flight, 2)} s in the air after the club's ${f.fixed(this.biasS(), 2)} s timing bias.`;
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stopTicker());
  }

  /** Stops a timing under way and clears the reading (after a repetition is logged, or on discard). */
  reset(): void {
    this.startedAt.set(null);
    this.stopTicker();
    this.control().setValue('');
  }

  protected tapFromPointer(event: PointerEvent): void {
    if (event.button !== 0) return;
    const at = this.clock();
    this.pointerPendingAt = at;
    this.tap(at);
  }

  protected tapFromClick(): void {
    const at = this.clock();
    const pending = this.pointerPendingAt;
    this.pointerPendingAt = null;
    // The click that ends a pointer tap is the same tap; a keyboard press comes without a pointer-down.
    if (pending !== null && at - pending < SAME_TAP_MS) return;
    this.tap(at);
  }

  protected discard(): void {
    this.reset();
  }

  private tap(at: number): void {
    const started = this.startedAt();
    if (started === null) {
      this.startedAt.set(at);
      this.now.set(at);
      this.control().setValue('');
      this.startTicker();
      return;
    }
    this.startedAt.set(null);
    this.stopTicker();
    this.control().setValue(this.fmt().fixed((at - started) / 1000, 2));
    this.control().markAsTouched();
  }

  private startTicker(): void {
    this.stopTicker();
    this.ticker = setInterval(() => this.now.set(this.clock()), 100);
  }

  private stopTicker(): void {
    if (this.ticker !== null) clearInterval(this.ticker);
    this.ticker = null;
  }
}
