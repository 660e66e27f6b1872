import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map, of, throwError } from 'rxjs';
import type {
  CarryBasis,
  PlayerKicksResponse,
  ProfileEntry,
  ProgressResponse,
  SpinEstimatesResponse,
} from '../../../shared/schemas/analysis';
import type { MeResponse } from '../../../shared/schemas/auth';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';
import type { Technique } from '../../../shared/schemas/sync';
import { AuthSession } from '../core/auth/auth-session';
import { SquadApi } from '../core/squad-api';
import { ANSWER_STORE, type Answer, type AnswerKind, cachedAnswer } from '../core/offline-cache';

/** How many recent kicks the Player file loads for its table (the server allows up to 1000). */
export const RECENT_KICKS_LIMIT = 500;

/** The route parameter that stands for "my own file" in a player's navigation. */
export const OWN_FILE_ID = 'me';

/** Thrown when a player account asks for its own file but is not linked to a player entry. */
export class NoOwnPlayerError extends Error {
  constructor() {
    super('Your account is not linked to a player entry yet. Ask your coach to link it.');
    this.name = 'NoOwnPlayerError';
  }
}

/**
 * The Player file's server calls: the player, their weekly progress, recent kicks, cached
 * launch profiles and spin from hang time. The server decides what the caller may see (a player only themselves, staff
 * their squads' players; anything else is a 404). Every answer is also kept on the device, keyed
 * by the signed-in user, so the file opens with its last data when the pitch has no signal.
 */
@Injectable({ providedIn: 'root' })
export class PlayerFileApi {
  private readonly http = inject(HttpClient);
  private readonly session = inject(AuthSession);
  private readonly squadApi = inject(SquadApi);
  private readonly store = inject(ANSWER_STORE);

  /**
   * The player id a route parameter names: itself, or for `me` the signed-in player's own id
   * (from `GET /api/me`, cached for offline starts).
   */
  resolvePlayerId(idParam: string): Observable<string> {
    if (idParam !== OWN_FILE_ID) {
      return of(idParam);
    }
    return this.cached('me', 'me', this.http.get<MeResponse>('/api/me')).pipe(
      map((answer) => {
        if (!answer.value.playerId) {
          throw new NoOwnPlayerError();
        }
        return answer.value.playerId;
      }),
    );
  }

  /** One player (`GET /api/players/:id`); 404 when the caller may not see them. */
  player(playerId: string): Observable<Answer<PlayerSummary>> {
    return this.cached(
      `player:${playerId}`,
      'player',
      this.http.get<{ player: PlayerSummary }>(`/api/players/${encodeURIComponent(playerId)}`).pipe(map((body) => body.player)),
    );
  }

  /** The caller's squads, for the ball size a player's squad trains with. */
  squads(): Observable<Answer<SquadSummary[]>> {
    return this.cached('squads', 'squads', this.squadApi.listSquads());
  }

  /** Weekly progress per technique on the chosen carry basis (`GET /api/players/:id/progress`). */
  progress(playerId: string, carry: CarryBasis): Observable<Answer<ProgressResponse>> {
    const params = new HttpParams().set('carry', carry);
    return this.cached(
      `progress:${playerId}:${carry}`,
      'progress',
      this.http.get<ProgressResponse>(`/api/players/${encodeURIComponent(playerId)}/progress`, { params }),
    );
  }

  /** The player's most recent kicks, newest first (`GET /api/players/:id/kicks`). */
  kicks(playerId: string, limit: number = RECENT_KICKS_LIMIT): Observable<Answer<PlayerKicksResponse>> {
    if (!Number.isInteger(limit) || limit < 1 || limit > 1000) {
      return throwError(() => new RangeError('limit must be an integer from 1 to 1000'));
    }
    const params = new HttpParams().set('limit', String(limit));
    return this.cached(
      `kicks:${playerId}:${limit}`,
      'kicks',
      this.http.get<PlayerKicksResponse>(`/api/players/${encodeURIComponent(playerId)}/kicks`, { params }),
    );
  }

  /** The cached launch profile of one technique (`GET /api/players/:id/profile`). */
  profile(playerId: string, technique: Technique): Observable<Answer<ProfileEntry>> {
    const params = new HttpParams().set('technique', technique);
    return this.cached(
      `profile:${playerId}:${technique}`,
      'profile',
      this.http.get<ProfileEntry>(`/api/players/${encodeURIComponent(playerId)}/profile`, { params }),
    );
  }

  /** Spin inferred from the player's timed repetitions, per technique (`GET /api/players/:id/spin-estimates`). */
  spinEstimates(playerId: string): Observable<Answer<SpinEstimatesResponse>> {
    return this.cached(
      `spin:${playerId}`,
      'spin',
      this.http.get<SpinEstimatesResponse>(`/api/players/${encodeURIComponent(playerId)}/spin-estimates`),
    );
  }

  private cached<T>(key: string, kind: AnswerKind, request: Observable<T>): Observable<Answer<T>> {
    // Keyed by user so a shared phone never shows one user's cached answers to another.
    const userId = this.session.user()?.id ?? 'signed-out';
    return cachedAnswer(this.store, `${userId}|${key}`, kind, request);
  }
}
