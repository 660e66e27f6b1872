import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Technique } from '../../../shared/flight';
import type { SquadProfilesResponse } from '../../../shared/schemas/analysis';

/**
 * The planner's server calls: every player's cached launch profile of one technique, the input of the
 * squad ranking. The one place that knows the URL, so the planner's store deals in typed responses.
 */
@Injectable({ providedIn: 'root' })
export class PlannerApi {
  private readonly http = inject(HttpClient);

  /** `GET /api/squads/:id/profiles?technique=`: profiles as cached (null + pending while computing). */
  squadProfiles(squadId: string, technique: Technique): Observable<SquadProfilesResponse> {
    const params = new HttpParams().set('technique', technique);
    return this.http.get<SquadProfilesResponse>(`/api/squads/${encodeURIComponent(squadId)}/profiles`, { params });
  }
}
