import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { PullResponse, PushResponse } from '../../../../shared/schemas/sync';
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

  /** Changes after `since`, oldest first, at most `limit`. */
  pull(since: number, limit: number): Observable<PullResponse> {
    const params = new HttpParams().set('since', since).set('limit', limit);
    return this.http.get<PullResponse>('/api/sync/pull', { params });
  }
}
