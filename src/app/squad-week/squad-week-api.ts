import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, throwError } from 'rxjs';
import type { CarryBasis, SquadProfilesResponse, SquadWeek } from '../../../shared/schemas/analysis';
import type { SquadSummary } from '../../../shared/schemas/squads';
import type { Technique } from '../../../shared/schemas/sync';
import { AuthSession } from '../core/auth/auth-session';
import { SquadApi } from '../core/squad-api';
import { ANSWER_STORE, type Answer, type AnswerKind, cachedAnswer } from '../core/offline-cache';

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/**
 * Squad week's server calls: the staff member's squads, one squad's week (per-player figures,
 * zone hit rates, calibration, load flags) and every player's cached profile for next targets.
 * Answers are kept on the device per user so the review opens offline with the last data.
 */
@Injectable({ providedIn: 'root' })
export class SquadWeekApi {
  private readonly http = inject(HttpClient);
  private readonly session = inject(AuthSession);
  private readonly squadApi = inject(SquadApi);
  private readonly store = inject(ANSWER_STORE);

  /** The caller's squads (`GET /api/squads`). */
  squads(): Observable<Answer<SquadSummary[]>> {
    return this.cached('squads', 'squads', this.squadApi.listSquads());
  }

  /** One squad's week starting on `weekStart` (a Monday, YYYY-MM-DD) on the chosen carry basis. */
  week(squadId: string, weekStart: string, carry: CarryBasis): Observable<Answer<SquadWeek>> {
    if (!ISO_DATE.test(weekStart)) {
      return throwError(() => new RangeError('weekStart must be a date (YYYY-MM-DD)'));
    }
    const params = new HttpParams().set('start', weekStart).set('carry', carry);
    return this.cached(
      `week:${squadId}:${weekStart}:${carry}`,
      'week',
      this.http.get<SquadWeek>(`/api/squads/${encodeURIComponent(squadId)}/week`, { params }),
    );
  }

  /** Every player's cached launch profile of one technique (`GET /api/squads/:id/profiles`). */
  profiles(squadId: string, technique: Technique): Observable<Answer<SquadProfilesResponse>> {
    const params = new HttpParams().set('technique', technique);
    return this.cached(
      `squad-profiles:${squadId}:${technique}`,
      'profile',
      this.http.get<SquadProfilesResponse>(`/api/squads/${encodeURIComponent(squadId)}/profiles`, { params }),
    );
  }

  private cached<T>(key: string, kind: AnswerKind, request: Observable<T>): Observable<Answer<T>> {
    const userId = this.session.user()?.id ?? 'signed-out';
    return cachedAnswer(this.store, `${userId}|${key}`, kind, request);
  }
}
