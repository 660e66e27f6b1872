import { Injectable, inject } from '@angular/core';
import { Observable, catchError, concat, from, map, mergeMap, of, scan, startWith, switchMap } from 'rxjs';
import type { ProfileEntry } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import { describeApiError } from '../core/api-error';
import { ReachEnvelopes } from '../core/analysis/reach-envelopes';
import { SquadWeekApi } from './squad-week-api';
import type { NextTargetState, NextTargets } from './squad-week-rows';

const COMPUTING: NextTargetState = { status: 'computing' };
const EMPTY_TARGETS: NextTargets = { byPlayer: new Map(), otherwise: COMPUTING };

/** Envelopes computed at once; the worker runs one at a time anyway, this only bounds the queue. */
const CONCURRENT_ENVELOPES = 2;

/**
 * Next week's target for every player of a squad in one technique: each player's cached profile
 * from the server, its standard-conditions envelope from the flight worker (or the device's
 * cache), then the distance with about 55 % predicted hits. The map fills in as envelopes finish,
 * so the table shows the first targets within a second rather than after the whole squad.
 */
@Injectable({ providedIn: 'root' })
export class SquadNextTargets {
  private readonly api = inject(SquadWeekApi);
  private readonly envelopes = inject(ReachEnvelopes);

  /** Each player's next-target state; starts with every row "computing". */
  forSquad(squadId: string, technique: Technique, ballSize: number): Observable<NextTargets> {
    return this.api.profiles(squadId, technique).pipe(
      switchMap((answer) => {
        const players = answer.value.players;
        const immediate: [string, NextTargetState][] = players
          .filter((p) => p.profile === null)
          .map((p) => [p.playerId, { status: 'unavailable', reason: p.pending ? 'profile being fitted' : 'no repetitions' }]);
        const computed = from(players.filter((p) => p.profile !== null)).pipe(
          mergeMap((entry) => this.one(entry, ballSize), CONCURRENT_ENVELOPES),
        );
        return concat(from(immediate), computed);
      }),
      scan(
        (all: NextTargets, [playerId, state]: [string, NextTargetState]): NextTargets => ({
          byPlayer: new Map(all.byPlayer).set(playerId, state),
          otherwise: COMPUTING,
        }),
        EMPTY_TARGETS,
      ),
      startWith(EMPTY_TARGETS),
      catchError((error: unknown) => {
        const reason = describeApiError(error).unreachable ? 'offline' : 'not available';
        return of<NextTargets>({ byPlayer: new Map(), otherwise: { status: 'unavailable', reason } });
      }),
    );
  }

  private one(entry: ProfileEntry, ballSize: number): Observable<[string, NextTargetState]> {
    return this.envelopes.analyse(entry, ballSize, false).pipe(
      map((analysis): [string, NextTargetState] => [
        entry.playerId,
        analysis ? { status: 'ready', result: analysis.nextTarget } : { status: 'unavailable', reason: 'no repetitions' },
      ]),
      catchError(() => of<[string, NextTargetState]>([entry.playerId, { status: 'unavailable', reason: 'could not compute' }])),
    );
  }
}
