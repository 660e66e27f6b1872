import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';

/**
 * Squads and players as the server scopes them to the signed-in user: staff see the squads
 * they work with, a player sees only their own entry, a guardian only their linked children.
 * The one place that knows these URLs, so screens deal in arrays, not in response envelopes.
 */
@Injectable({ providedIn: 'root' })
export class SquadApi {
  private readonly http = inject(HttpClient);

  /** The caller's squads (`GET /api/squads`). */
  listSquads(): Observable<SquadSummary[]> {
    return this.http.get<{ squads: SquadSummary[] }>('/api/squads').pipe(map((body) => body.squads));
  }

  /** The players the caller may see (`GET /api/players`), optionally of one squad only. */
  listPlayers(squadId?: string): Observable<PlayerSummary[]> {
    const params = squadId ? new HttpParams().set('squadId', squadId) : undefined;
    return this.http.get<{ players: PlayerSummary[] }>('/api/players', { params }).pipe(map((body) => body.players));
  }
}
