import { Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { liveQuery } from 'dexie';
import { type Observable, from, of, switchMap } from 'rxjs';

/**
 * A Dexie query kept live as a signal, re-run whenever `key` changes and whenever a table it read
 * changes: `whenNull` while the key is null (no user, no session picked), `initial` until IndexedDB
 * first answers. The one place the `toObservable → switchMap → liveQuery → toSignal` idiom is spelled
 * out; call it from an injection context (a field initialiser or constructor).
 */
export function liveSignal<K, T, I = T>(
  key: Signal<K | null>,
  query: (key: K) => T | Promise<T>,
  options: { readonly whenNull: T; readonly initial: I },
): Signal<T | I> {
  const source: Observable<T | I> = toObservable(key).pipe(
    switchMap((k) => (k === null ? of(options.whenNull) : from(liveQuery(() => query(k))))),
  );
  return toSignal(source, { initialValue: options.initial });
}

/** A Dexie query that depends on no signal, kept live: `initial` until IndexedDB first answers. */
export function liveQuerySignal<T, I = T>(query: () => T | Promise<T>, initial: I): Signal<T | I> {
  const source: Observable<T | I> = from(liveQuery(query));
  return toSignal(source, { initialValue: initial });
}
