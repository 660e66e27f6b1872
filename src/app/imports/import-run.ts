import { computed, signal } from '@angular/core';
import type { Observable, Subscription } from 'rxjs';
import { describeImportFailure, type ImportRefusal } from './import-problem';
import type { ImportAnswer, UploadEvent } from './import-types';

/** Where one upload (a preview or a commit) stands. */
export type RunState<S> =
  | { readonly status: 'idle' }
  | { readonly status: 'uploading'; readonly dryRun: boolean; readonly loadedBytes: number; readonly totalBytes: number | null }
  | { readonly status: 'checking'; readonly dryRun: boolean }
  | { readonly status: 'answered'; readonly answer: ImportAnswer<S> }
  | { readonly status: 'refused'; readonly dryRun: boolean; readonly refusal: ImportRefusal };

const IDLE: RunState<never> = { status: 'idle' };

/**
 * The life of the uploads of one wizard: bytes going up, the server checking, its answer or its
 * refusal. One discriminated state, so a screen cannot show a progress bar and an answer at once;
 * a new upload cancels the one before, so a coach who changes the mapping mid-upload never sees
 * the old file's answer arrive late.
 */
export class ImportRun<S> {
  private readonly current = signal<RunState<S>>(IDLE);
  private subscription: Subscription | null = null;

  /** The state now. */
  readonly state = this.current.asReadonly();
  /** Whether an upload is on its way or being checked. */
  readonly busy = computed(() => {
    const status = this.current().status;
    return status === 'uploading' || status === 'checking';
  });
  /** The server's answer, once there is one. */
  readonly answer = computed(() => {
    const state = this.current();
    return state.status === 'answered' ? state.answer : null;
  });

  /** Starts an upload, cancelling any under way; `answered` runs once the server has answered. */
  start(request: Observable<UploadEvent<ImportAnswer<S>>>, dryRun: boolean, answered?: (answer: ImportAnswer<S>) => void): void {
    this.cancel();
    this.current.set({ status: 'uploading', dryRun, loadedBytes: 0, totalBytes: null });
    this.subscription = request.subscribe({
      next: (event) => {
        if (event.kind === 'done') {
          this.current.set({ status: 'answered', answer: event.answer });
          answered?.(event.answer);
        } else if (event.totalBytes !== null && event.loadedBytes >= event.totalBytes) {
          this.current.set({ status: 'checking', dryRun });
        } else {
          this.current.set({ status: 'uploading', dryRun, loadedBytes: event.loadedBytes, totalBytes: event.totalBytes });
        }
      },
      error: (error: unknown) => {
        this.subscription = null;
        this.current.set({ status: 'refused', dryRun, refusal: describeImportFailure(error) });
      },
      complete: () => {
        this.subscription = null;
      },
    });
  }

  /**
   * Stops waiting for the upload under way. While bytes are still going up the server never gets
   * the whole request and writes nothing; once they are all sent it finishes on its own, which is
   * why screens offer "Cancel" only while uploading.
   */
  cancel(): void {
    this.subscription?.unsubscribe();
    this.subscription = null;
    if (this.busy()) {
      this.current.set(IDLE);
    }
  }

  /** Forgets any answer or refusal, e.g. after the file or mapping changed. */
  reset(): void {
    this.cancel();
    this.current.set(IDLE);
  }
}
