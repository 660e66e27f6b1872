import type { QuantityFormat } from '../../../../shared/quantity-format';
import { Observable, OperatorFunction, catchError, map, of, startWith } from 'rxjs';
import { describeApiError } from '../api-error';
import type { LoadState } from '../load-state';
import { LOADING } from '../load-state';
import type { Answer } from '../offline-cache';

/**
 * Like `toLoadState`, but an error that is not an HTTP failure (e.g. "your account is not linked
 * to a player") keeps its own message instead of a generic one.
 */
export function toAnswerState<T>(): OperatorFunction<T, LoadState<T>> {
  return (source: Observable<T>) =>
    source.pipe(
      map((value): LoadState<T> => ({ status: 'ready', value })),
      startWith<LoadState<T>>(LOADING),
      catchError((error: unknown) => {
        const problem = describeApiError(error);
        const own = error instanceof Error && !('status' in error) ? { ...problem, message: error.message } : problem;
        return of<LoadState<T>>({ status: 'error', problem: own });
      }),
    );
}

/** The answer of a ready state, else null. */
export function readyValue<T>(state: LoadState<T>): T | null {
  return state.status === 'ready' ? state.value : null;
}

/** Whether a failed load was the server saying "nothing here for you" (404). */
export function isNotFound(state: LoadState<unknown>): boolean {
  return state.status === 'error' && state.problem.code === 'not_found';
}

/** The oldest time among the answers shown from the device's cache, or null when all are fresh. */
export function oldestCachedAt(answers: readonly (Answer<unknown> | null)[]): string | null {
  let oldest: string | null = null;
  for (const answer of answers) {
    if (answer?.fromCache && (oldest === null || answer.fetchedAt < oldest)) {
      oldest = answer.fetchedAt;
    }
  }
  return oldest;
}

/** "Tue 4 Mar, 18:42" (in the club's locale): when a cached answer was last fresh. */
export function updatedLabel(iso: string, f: QuantityFormat): string {
  return f.dateTime(iso, { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
}
