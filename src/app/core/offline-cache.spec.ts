import { HttpErrorResponse } from '@angular/common/http';
import { firstValueFrom, of, throwError } from 'rxjs';
import { MemoryAnswerStore, cachedAnswer, isUnreachable } from './offline-cache';

const offline = (): HttpErrorResponse => new HttpErrorResponse({ status: 0, statusText: 'Unknown Error', url: '/api/x' });
const notFound = (): HttpErrorResponse =>
  new HttpErrorResponse({ status: 404, url: '/api/x', error: { error: { code: 'not_found', message: 'No such player in your squads' } } });

describe('cachedAnswer', () => {
  const at = new Date('2025-03-10T07:30:00.000Z');

  it('passes a fresh answer on and keeps it', async () => {
    const store = new MemoryAnswerStore();
    const answer = await firstValueFrom(cachedAnswer<{ n: number }>(store, 'k', 'week', of({ n: 1 }), () => at));
    expect(answer).toEqual({ value: { n: 1 }, fetchedAt: at.toISOString(), fromCache: false });
    expect(store.count('week')).toBe(1);
  });

  it('answers from the cache, with the original time, when the server cannot be reached', async () => {
    const store = new MemoryAnswerStore();
    await firstValueFrom(cachedAnswer<{ n: number }>(store, 'k', 'week', of({ n: 1 }), () => at));
    const later = new Date('2025-03-11T07:30:00.000Z');
    const answer = await firstValueFrom(cachedAnswer<{ n: number }>(store, 'k', 'week', throwError(offline), () => later));
    expect(answer).toEqual({ value: { n: 1 }, fetchedAt: at.toISOString(), fromCache: true });
  });

  it('never covers a refusal with an old answer', async () => {
    const store = new MemoryAnswerStore();
    await firstValueFrom(cachedAnswer(store, 'k', 'player', of({ n: 1 })));
    await expectAsync(firstValueFrom(cachedAnswer(store, 'k', 'player', throwError(notFound)))).toBeRejectedWith(
      jasmine.objectContaining({ status: 404 }),
    );
  });

  it('passes the failure on when offline with nothing cached', async () => {
    await expectAsync(firstValueFrom(cachedAnswer(new MemoryAnswerStore(), 'k', 'player', throwError(offline)))).toBeRejectedWith(
      jasmine.objectContaining({ status: 0 }),
    );
  });

  it('treats gateway failures as unreachable, other statuses as answers', () => {
    expect(isUnreachable(offline())).toBeTrue();
    expect(isUnreachable(new HttpErrorResponse({ status: 504 }))).toBeTrue();
    expect(isUnreachable(notFound())).toBeFalse();
    expect(isUnreachable(new HttpErrorResponse({ status: 500 }))).toBeFalse();
    expect(isUnreachable(new Error('x'))).toBeFalse();
  });
});
