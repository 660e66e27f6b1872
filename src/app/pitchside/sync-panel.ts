import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { CachedPlayer, ConflictNotice, OutboxEntry } from '../core/loftline-db';
import { StorageStatus } from '../core/storage-status';
import { SyncIssues } from '../core/sync/sync-issues';
import { SyncQueue } from '../core/sync/sync-queue';
import { OUTCOME_LABELS } from '../../../shared/vocabulary';
import type { Outcome } from '../../../shared/schemas/sync';

/** Words for the fields a conflict can name. */
const FIELD_LABELS: Record<string, string> = {
  outcome: 'outcome',
  playerId: 'player',
  backspinStep: 'spin',
  sidespinStep: 'curl',
  carryM: 'carry',
  lateralM: 'lateral offset',
  foot: 'foot',
  technique: 'technique',
  targetDistanceM: 'target distance',
  targetRadiusM: 'target radius',
  temperatureC: 'temperature',
  windSpeedMs: 'wind speed',
  windFromDeg: 'wind direction',
  ballSize: 'ball size',
  endedAt: 'end time',
  notes: 'notes',
  label: 'name',
};

/**
 * Sync details behind the badge: what the queue is doing and when it last reached the server,
 * whether the browser keeps the data persistently and how much it holds, and the changes the
 * server would not take — rejected ones with the reason (fix, send again, or discard) and
 * conflicts with what differed (keep the server's version or put the coach's back).
 */
@Component({
  selector: 'll-sync-panel',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './sync-panel.html',
  styleUrl: './sync-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SyncPanel {
  protected readonly queue = inject(SyncQueue);
  protected readonly storage = inject(StorageStatus);
  protected readonly issues = inject(SyncIssues);

  /** The squad's players, to name kickers. */
  readonly players = input<readonly CachedPlayer[]>([]);
  /** Emits the id of a rejected kick the coach wants to correct. */
  readonly fixKick = output<string>();

  private readonly names = computed(() => new Map(this.players().map((p) => [p.id, p.displayName])));

  protected readonly status = computed(() => {
    switch (this.queue.phase()) {
      case 'offline':
        return 'No connection. Everything is saved on this phone and will be sent when the signal is back.';
      case 'syncing':
        return 'Sending and fetching changes…';
      case 'waiting':
        return `Could not reach the server. ${this.queue.lastProblem() ?? ''} Trying again at ${this.clock(this.queue.nextAttemptAt())}.`;
      case 'signed_out':
        return 'Signed out: changes wait on this phone until you sign in again.';
      default:
        return this.queue.unsynced() === 0 ? 'Everything is on the server.' : 'Changes are waiting to be sent.';
    }
  });

  protected readonly lastSynced = computed(() => {
    const at = this.queue.lastSyncedAt();
    return at ? this.clock(Date.parse(at)) : null;
  });

  protected readonly storageLine = computed(() => {
    const persisted = this.storage.persisted();
    const keep =
      persisted === true
        ? 'The browser keeps Loftline’s data (persistent storage granted).'
        : persisted === false
          ? 'The browser may clear Loftline’s data when the phone runs short of space (persistent storage not granted). Sync often, or install the app.'
          : 'Whether the browser keeps Loftline’s data is not known.';
    const used = this.storage.usageBytes();
    const quota = this.storage.quotaBytes();
    return used === null ? keep : `${keep} Using ${megabytes(used)}${quota === null ? '' : ` of ${megabytes(quota)}`}.`;
  });

  constructor() {
    void this.storage.refresh();
  }

  protected describeEntry(entry: OutboxEntry): string {
    if (entry.entity === 'kick') {
      const player = this.names().get(String(entry.data['playerId'])) ?? 'a player';
      const outcome = OUTCOME_LABELS[entry.data['outcome'] as Outcome] ?? '';
      return entry.op === 'delete' ? 'Void of a repetition' : `Repetition by ${player}${outcome ? ` · ${outcome}` : ''}`;
    }
    const what = entry.entity === 'drill' ? 'Drill' : 'Session';
    return entry.op === 'delete' ? `Deletion of a ${what.toLowerCase()}` : what;
  }

  protected describeConflict(notice: ConflictNotice): string {
    if (notice.mineWasDelete) {
      return 'You voided this, but it had been changed on the server first. The server’s version stands.';
    }
    const changes = notice.changedFields.map((field) => {
      const label = FIELD_LABELS[field] ?? field;
      return `${label}: yours ${this.show(field, notice.mine[field])}, server ${this.show(field, notice.theirs[field])}`;
    });
    const deleted = notice.theirs.deletedAt ? ' It was voided on the server.' : '';
    return `Changed elsewhere first — ${changes.join('; ')}.${deleted}`;
  }

  /** Discards every rejected change, e.g. the kicks of a session the server refused. */
  protected async discardAll(): Promise<void> {
    for (const entry of this.issues.rejected()) {
      await this.issues.discard(entry.id);
    }
  }

  protected canFix(entry: OutboxEntry): boolean {
    return entry.entity === 'kick' && entry.op === 'upsert';
  }

  private show(field: string, value: unknown): string {
    if (value === null || value === undefined) return '—';
    if (field === 'outcome') return OUTCOME_LABELS[value as Outcome] ?? String(value);
    if (field === 'playerId') return this.names().get(String(value)) ?? 'another player';
    return String(value);
  }

  private clock(epochMs: number | null): string {
    return epochMs === null ? '—' : new Date(epochMs).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', second: '2-digit' });
  }
}

function megabytes(bytes: number): string {
  return `${(bytes / 1_000_000).toFixed(bytes < 10_000_000 ? 1 : 0)} MB`;
}
