import { DOCUMENT } from '@angular/common';
import { Injectable, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { SwUpdate, type VersionReadyEvent } from '@angular/service-worker';
import { exhaustMap, filter, fromEvent, interval, merge } from 'rxjs';

/** How often a page left open asks for a new version (common practice: hourly; the worker also asks on each navigation). */
const CHECK_EVERY_MS = 60 * 60 * 1000;

/**
 * A new deploy, announced. The service worker keeps serving the old app until every tab closes, which on a
 * phone can be days; when it has the new version in its cache (`VERSION_READY`) this says so and offers to
 * reload. Reloading is safe for the data — every repetition is in IndexedDB and the outbox is only emptied by
 * the server's acknowledgement, so a reload at worst replays a push the server counts once — but it must not
 * cut a coach off mid-entry: screens that are collecting a repetition (a player picked with a carry typed, a
 * stopwatch running, a save in flight) hold the offer back through `hold()`; it appears once they let go.
 * The worker itself only looks for a new version when the app navigates, and Pitchside stays on one page for a
 * whole session, so this also asks when the app comes back into view, when the connection returns and hourly.
 */
@Injectable({ providedIn: 'root' })
export class AppUpdate {
  /** Absent where no service worker is provided (development server, unit tests): then nothing is offered. */
  private readonly updates = inject(SwUpdate, { optional: true });
  private readonly document = inject(DOCUMENT);
  private readonly ready = signal(false);
  private readonly holds = signal<ReadonlySet<symbol>>(new Set());
  private readonly reloading = signal(false);

  /** Whether a new version waits and nothing on screen is mid-entry: show the offer. */
  readonly offer = computed(() => this.ready() && this.holds().size === 0 && !this.reloading());
  /** Whether a new version waits but a half-entered repetition holds the offer back. */
  readonly held = computed(() => this.ready() && this.holds().size > 0 && !this.reloading());
  /** Whether a new version waits (even while the offer is held back). */
  readonly versionReady = this.ready.asReadonly();

  constructor() {
    if (!this.updates?.isEnabled) return;
    this.updates.versionUpdates
      .pipe(
        filter((e): e is VersionReadyEvent => e.type === 'VERSION_READY'),
        takeUntilDestroyed(),
      )
      .subscribe(() => this.ready.set(true));
    const updates = this.updates;
    const win = this.document.defaultView;
    merge(
      fromEvent(this.document, 'visibilitychange').pipe(filter(() => this.document.visibilityState === 'visible')),
      win ? fromEvent(win, 'online') : [],
      interval(CHECK_EVERY_MS),
    )
      .pipe(
        exhaustMap(() => updates.checkForUpdate().catch(() => false)),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  /**
   * Holds the offer back while a repetition is being entered; returns the release (call it when the entry is
   * saved or abandoned). Releasing twice is harmless.
   */
  hold(): () => void {
    const token = Symbol('hold');
    this.holds.update((s) => new Set(s).add(token));
    return () =>
      this.holds.update((s) => {
        const next = new Set(s);
        next.delete(token);
        return next;
      });
  }

  /** Switches to the new version and reloads (refused while something holds the offer back). */
  async reload(): Promise<void> {
    if (!this.offer()) return;
    this.reloading.set(true);
    try {
      await this.updates?.activateUpdate();
    } finally {
      this.document.location.reload();
    }
  }

  /** Hides the offer until the next deploy (the new version still loads on the next start). */
  dismiss(): void {
    this.ready.set(false);
  }
}
