import { Signal, computed, signal } from '@angular/core';
import { describeApiError } from './api-error';

/**
 * The state of one write a screen makes (save, send, link, remove), beside `LoadState` for reads:
 * a discriminated union so a screen cannot show "Saving…" and "Saved" at once.
 */
export type ActionState =
  | { readonly status: 'idle' }
  | { readonly status: 'pending' }
  | { readonly status: 'done' }
  | { readonly status: 'failed'; readonly message: string };

/**
 * One write's state as signals, and the one way to run it: `pending` while it runs (disable the
 * button), `done` after it succeeded (show the confirmation), `failure` with a readable message
 * otherwise. Replaces the hand-paired `pending`/`failure`/`saved` signals of each screen.
 */
export class WriteAction {
  private readonly state = signal<ActionState>({ status: 'idle' });
  /** Whether the write is under way. */
  readonly pending: Signal<boolean> = computed(() => this.state().status === 'pending');
  /** Whether the last write succeeded. */
  readonly done: Signal<boolean> = computed(() => this.state().status === 'done');
  /** Why the last write failed, or null. */
  readonly failure: Signal<string | null> = computed(() => {
    const state = this.state();
    return state.status === 'failed' ? state.message : null;
  });

  /**
   * Runs `work`, moving through pending to done or failed; the failure's message comes from
   * `describe` (by default the server's own words). Resolves with the work's value, or undefined
   * when it failed: errors end up in the state, never thrown at the template.
   */
  async run<T>(
    work: () => Promise<T>,
    describe: (error: unknown) => string = (error) => describeApiError(error).message,
  ): Promise<T | undefined> {
    this.state.set({ status: 'pending' });
    try {
      const value = await work();
      this.state.set({ status: 'done' });
      return value;
    } catch (error) {
      this.state.set({ status: 'failed', message: describe(error) });
      return undefined;
    }
  }

  /** Records a failure found before any call (e.g. a check on the device). */
  fail(message: string): void {
    this.state.set({ status: 'failed', message });
  }

  /** Back to idle: forgets the last outcome. */
  reset(): void {
    this.state.set({ status: 'idle' });
  }
}
