import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { DrillSuggestion } from '../core/drill-suggestion';
import { RosterStore } from '../core/roster-store';
import { SessionStore } from '../core/session-store';
import { SyncQueue } from '../core/sync/sync-queue';
import { KickLogger } from './kick-logger';
import { windLabel } from './pitchside-labels';
import { SessionStart } from './session-start';
import { SyncBadge } from './sync-badge';
import { SyncPanel } from './sync-panel';

/**
 * Pitchside (`/pitchside`, `/pitchside/:sessionId`): the screen a coach holds in one hand during
 * training. Without a session id it starts or resumes a session; with one it logs repetitions.
 * Everything it shows comes from IndexedDB, so it opens and works with no signal; the bar at
 * the top always says whether the phone is online and how many entries the server lacks.
 */
@Component({
  selector: 'll-pitchside',
  imports: [MatButtonModule, MatProgressBarModule, RouterLink, KickLogger, SessionStart, SyncBadge, SyncPanel],
  templateUrl: './pitchside.html',
  styleUrl: './pitchside.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Pitchside {
  private readonly roster = inject(RosterStore);

  /** The session to log, from the route (`:sessionId`); absent on the start page. */
  readonly sessionId = input<string | undefined>(undefined);
  /** A drill suggested by Next targets (query parameters), added with one tap in the drill form. */
  readonly drillTechnique = input<string | undefined>(undefined);
  readonly drillTargetM = input<string | undefined>(undefined);
  readonly drillRadiusM = input<string | undefined>(undefined);

  protected readonly suggestion = inject(DrillSuggestion);

  private readonly id = computed(() => this.sessionId() ?? null);
  private readonly logger = viewChild(KickLogger);

  protected readonly session = inject(SessionStore).liveSession(this.id);
  protected readonly panelOpen = signal(false);
  protected readonly players = this.roster.livePlayers(computed(() => this.session()?.squadId ?? null));

  /** The bar's summary, e.g. "U16 · Tue 18:30 · 12 °C · headwind light · ball 5", plus "measured 18:15" when the weather service filled it. */
  protected readonly summary = computed(() => {
    const session = this.session();
    if (!session) {
      return 'Pitchside';
    }
    const squad = this.roster.squads()?.find((s) => s.id === session.squadId);
    const started = new Date(session.startedAt).toLocaleString([], { weekday: 'short', hour: '2-digit', minute: '2-digit' });
    const parts = [squad?.name ?? 'Session', started];
    if (session.temperatureC !== null && session.temperatureC !== undefined) {
      parts.push(`${session.temperatureC} °C`);
    }
    const wind = windLabel(session.windSpeedMs, session.windFromDeg);
    const measuredWind = session.conditionsSource?.['windSpeedMs'] === 'weather';
    if (wind) {
      // A measured wind is a number, not a judgement: show it (e.g. "headwind moderate 6.2 m/s").
      parts.push(measuredWind && session.windSpeedMs ? `${wind} ${Math.round(session.windSpeedMs * 10) / 10} m/s` : wind);
    }
    parts.push(`ball ${session.ballSize}`);
    if (session.conditionsObservedAt) {
      const at = new Date(session.conditionsObservedAt).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
      parts.push(`measured ${at}`);
    }
    return parts.join(' · ');
  });

  constructor() {
    // Opening Pitchside is a good moment to sync: the coach is about to rely on the data.
    inject(SyncQueue).syncNow();
    effect(() => this.suggestion.offer(this.drillTechnique(), this.drillTargetM(), this.drillRadiusM()));
  }

  protected fixKick(kickId: string): void {
    this.panelOpen.set(false);
    this.logger()?.openEntry(kickId);
  }
}
