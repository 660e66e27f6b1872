import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, of, timeout } from 'rxjs';
import type { Ground, GroundConditions, GroundInput } from '../../../shared/schemas/grounds';
import { describeApiError } from './api-error';

/**
 * How long Pitchside waits for conditions before the coach's taps stay the source. The server gives
 * the weather service 2 s and then answers "unavailable"; the extra second covers a slow pitch-side link.
 */
export const CONDITIONS_WAIT_MS = 3000;

/** The shared shapes, re-exported so screens import them from the service that fetches them. */
export type { Ground, GroundConditions, GroundInput };

/**
 * The club's training grounds (`/api/grounds`): listed for staff, edited by admins in Club admin,
 * and the conditions the weather service measured at one, for a session's start. The one place that
 * knows these URLs.
 */
@Injectable({ providedIn: 'root' })
export class GroundApi {
  private readonly http = inject(HttpClient);

  /** The club's grounds by name. */
  list(): Observable<Ground[]> {
    return this.http.get<{ grounds: Ground[] }>('/api/grounds').pipe(map((body) => body.grounds));
  }

  /** Adds a ground (admins). */
  create(input: GroundInput): Observable<Ground> {
    return this.http.post<Ground>('/api/grounds', input);
  }

  /** Corrects a ground (admins). */
  update(id: string, input: GroundInput): Observable<Ground> {
    return this.http.put<Ground>(`/api/grounds/${id}`, input);
  }

  /**
   * Conditions at a ground. Never fails: no signal, a slow link or an error all answer
   * `unavailable` with the reason, within `CONDITIONS_WAIT_MS`, so a session start never waits on it.
   */
  conditions(groundId: string): Observable<GroundConditions> {
    return this.http.get<GroundConditions>(`/api/grounds/${groundId}/conditions`).pipe(
      timeout(CONDITIONS_WAIT_MS),
      catchError((error: unknown) =>
        of<GroundConditions>({
          source: 'unavailable',
          groundId,
          reason: error instanceof Error && error.name === 'TimeoutError' ? 'No answer in time' : describeApiError(error).message,
        }),
      ),
    );
  }
}
