import { Observable, Subject, of } from 'rxjs';
import { latestWhenIdle } from './latest-when-idle';

describe('latestWhenIdle', () => {
  it('starts no second job while one runs and then runs only the newest value', () => {
    const source = new Subject<number>();
    const jobs = new Map<number, Subject<string>>();
    const started: number[] = [];
    const results: string[] = [];
    source
      .pipe(
        latestWhenIdle((v): Observable<string> => {
          started.push(v);
          const job = new Subject<string>();
          jobs.set(v, job);
          return job;
        }),
      )
      .subscribe((r) => results.push(r));

    source.next(1);
    source.next(2);
    source.next(3);
    source.next(4);
    expect(started).toEqual([1]);
    jobs.get(1)!.next('one');
    jobs.get(1)!.complete();
    expect(started).toEqual([1, 4]);
    jobs.get(4)!.next('four');
    jobs.get(4)!.complete();
    source.next(5);
    expect(started).toEqual([1, 4, 5]);
    expect(results).toEqual(['one', 'four']);
  });

  it('handles jobs that complete synchronously (no worker) and completes after the source', () => {
    const out: number[] = [];
    let completed = false;
    of(1, 2, 3)
      .pipe(latestWhenIdle((v) => of(v * 10)))
      .subscribe({ next: (v) => out.push(v), complete: () => (completed = true) });
    expect(out).toEqual([10, 20, 30]);
    expect(completed).toBeTrue();
  });

  it('tears the running job down when unsubscribed', () => {
    const source = new Subject<number>();
    let torn = 0;
    const subscription = source.pipe(latestWhenIdle(() => new Observable<number>(() => () => torn++))).subscribe();
    source.next(1);
    source.next(2);
    subscription.unsubscribe();
    expect(torn).toBe(1);
    expect(source.observed).toBeFalse();
  });
});
