import { Observable, type OperatorFunction, type Subscription } from 'rxjs';

/**
 * Like `switchMap`, but for work that cannot be cancelled once started (a Web Worker computes a posted
 * job to the end): runs `project` for a value only when the previous run has finished, and while one
 * runs keeps just the newest value, so dragging a slider never queues stale jobs in the worker — at most
 * one job runs and one (the latest) waits. Each run's results are passed on as they come.
 */
export function latestWhenIdle<T, R>(project: (value: T) => Observable<R>): OperatorFunction<T, R> {
  return (source) =>
    new Observable<R>((subscriber) => {
      let busy = false;
      let waiting: { value: T } | null = null;
      let sourceDone = false;
      let run: Subscription | null = null;

      const finish = (): void => {
        busy = false;
        run = null;
        if (waiting !== null) {
          const next = waiting;
          waiting = null;
          start(next.value);
        } else if (sourceDone) {
          subscriber.complete();
        }
      };

      const start = (value: T): void => {
        busy = true;
        let done = false;
        const subscription = project(value).subscribe({
          next: (result) => subscriber.next(result),
          error: (error: unknown) => subscriber.error(error),
          complete: () => {
            done = true;
            finish();
          },
        });
        // A synchronous project (no worker) has completed before `subscribe` returned.
        if (!done) run = subscription;
      };

      const input = source.subscribe({
        next: (value) => {
          if (busy) waiting = { value };
          else start(value);
        },
        error: (error: unknown) => subscriber.error(error),
        complete: () => {
          sourceDone = true;
          if (!busy && waiting === null) subscriber.complete();
        },
      });

      return () => {
        input.unsubscribe();
        run?.unsubscribe();
        waiting = null;
      };
    });
}
