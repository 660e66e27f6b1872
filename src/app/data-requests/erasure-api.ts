import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

/** How a player's kicks are treated when the player is erased. */
export type ErasureMode = 'anonymise' | 'remove';

/** The server's answer to an erasure. */
export interface ErasureResult {
  readonly erased: true;
  /** How many kicks were anonymised or removed. */
  readonly kicksAffected: number;
}

/**
 * Erasure of a player on request (admin): `POST /api/admin/players/:id/erase`. The server checks
 * the typed name against the player's, does the whole erasure in one transaction and writes it to
 * the audit log; this service only carries the request, so nothing here can erase by accident.
 */
@Injectable({ providedIn: 'root' })
export class ErasureApi {
  private readonly http = inject(HttpClient);

  /** Erases the player, treating their kicks as `mode` says; `confirmName` must be their name. */
  erase(playerId: string, mode: ErasureMode, confirmName: string): Observable<ErasureResult> {
    return this.http.post<ErasureResult>(`/api/admin/players/${encodeURIComponent(playerId)}/erase`, { mode, confirmName });
  }
}
