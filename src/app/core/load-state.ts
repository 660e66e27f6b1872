import { Observable, OperatorFunction, catchError, map, of, startWith } from 'rxjs';
import { ApiProblem, describeApiError } from './api-error';

/**
 * The state of one piece of data a screen loads from the server. A discriminated union
 * (rather than separate loading/error/value signals) so a template cannot show a value and
 * an error at once, and `@switch (state.status)` covers every case.
 */
export type LoadState<T> =
  | { readonly status: 'loading' }
  | { readonly status: 'ready'; readonly value: T }
  | { readonly status: 'error'; readonly problem: ApiProblem };

/** The state before the first answer arrives. */
export const LOADING: LoadState<never> = { status: 'loading' };

/**
 * Maps a one-shot request to its load states: `loading` at once, then `ready` with the
 * value or `error` with a readable problem. Errors end up in the state instead of
 * breaking the stream, so a retry can simply subscribe again.
 */
export function toLoadState<T>(): OperatorFunction<T, LoadState<T>> {
  return (source: Observable<T>) =>
    source.pipe(
      map((value): LoadState<T> => ({ status: 'ready', value })),
      startWith<LoadState<T>>(LOADING),
      catchError((error: unknown) => of<LoadState<T>>({ status: 'error', problem: describeApiError(error) })),
    );
}
