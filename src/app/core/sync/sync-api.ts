import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { PullResponse, PullWindow, PushResponse } from '../../../../shared/schemas/sync';
import type { OutboxEntry } from '../loftline-db';

/**
 * The two sync endpoints (`shared/schemas/sync.ts` holds the contract). Only the queue calls
 * them; the auth interceptor adds the token and renews it when it has expired.
 */
@Injectable({ providedIn: 'root' })
export class SyncApi {
  private readonly http = inject(HttpClient);

  /** Sends outbox entries (at most 500) and gets one answer per mutation. */
  push(deviceId: string, entries: readonly OutboxEntry[]): Observable<PushResponse> {
    const mutations = entries.map((e) => ({
      id: e.id,
      entity: e.entity,
      op: e.op,
      data: e.data,
      ...(e.baseVersion === undefined ? {} : { baseVersion: e.baseVersion }),
    }));
    return this.http.post<PushResponse>('/api/sync/push', { deviceId, mutations });
  }

  /** Changes after `since`, oldest first, at most `limit`; only the recent sessions or the history with a `window`. */
  pull(since: number, limit: number, window?: PullWindow): Observable<PullResponse> {
    let params = new HttpParams().set('since', since).set('limit', limit);
    if (window?.part === 'recent') params = params.set('part', 'recent').set('from', window.from);
    if (window?.part === 'history') params = params.set('part', 'history').set('upTo', window.upTo);
    return this.http.get<PullResponse>('/api/sync/pull', { params });
  }
}
