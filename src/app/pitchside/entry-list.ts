import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ClubFormat } from '../core/club-format';
import type { KickCorrection } from '../core/kick-store';
import type { CachedPlayer, LocalKick, OutboxEntry } from '../core/loftline-db';
import { KickEditor } from './kick-editor';
import { OUTCOME_LABELS, TECHNIQUE_LABELS, backspinLabel } from '../../../shared/vocabulary';

/** A correction of one entry, as the list reports it. */
export interface EntryCorrection {
  readonly id: string;
  readonly changes: KickCorrection;
}

/**
 * Every repetition of the session, newest first, with whether the server has it yet — and,
 * when it refused one, why. Any entry can be opened to correct or void it.
 */
@Component({
  selector: 'll-entry-list',
  imports: [MatButtonModule, MatIconModule, KickEditor, RouterLink],
  template: `
    <ol class="entries" aria-label="Repetitions this session">
      @for (kick of kicks(); track kick.id) {
        @let entry = entries().get(kick.id);
        <li class="entry" [class.entry--rejected]="entry?.state === 'rejected'">
          @if (editingId() === kick.id) {
            <ll-kick-editor
              [kick]="kick"
              [players]="players()"
              (saved)="correct(kick.id, $event)"
              (voided)="voidEntry(kick.id)"
              (cancelled)="editingId.set(null)"
            />
          } @else {
            <span class="entry__time">{{ time(kick.recordedAt) }}</span>
            <span class="entry__what">
              <strong>{{ playerName(kick.playerId) }}</strong>
              · {{ outcomeLabels[kick.outcome] }} · {{ techniqueLabels[kick.technique] }} {{ fmt().round(kick.targetDistanceM) }} ·
              {{ backspinLabel(kick.backspinStep) }}
              @if (kick.carryM !== null && kick.carryM !== undefined) {
                · carry {{ fmt().distance(kick.carryM) }}
              }
              @if (kick.hangTimeS !== null && kick.hangTimeS !== undefined) {
                · timed {{ fmt().number(kick.hangTimeS) }} s
              }
              @if (entry?.state === 'rejected') {
                <span class="entry__reason">Not accepted: {{ entry?.error?.message }}</span>
              }
            </span>
            <mat-icon class="entry__sync" [attr.aria-label]="syncLabel(entry)">{{ syncIcon(entry) }}</mat-icon>
            <a
              mat-icon-button
              [routerLink]="['/measure', kick.id]"
              [attr.aria-label]="'Measure from video: ' + playerName(kick.playerId) + ' at ' + time(kick.recordedAt)"
            >
              <mat-icon aria-hidden="true">videocam</mat-icon>
            </a>
            <button
              mat-icon-button
              type="button"
              [attr.aria-label]="'Correct ' + playerName(kick.playerId) + ' at ' + time(kick.recordedAt)"
              (click)="editingId.set(kick.id)"
            >
              <mat-icon aria-hidden="true">edit</mat-icon>
            </button>
          }
        </li>
      } @empty {
        <li class="entry entry--empty">No repetitions logged yet.</li>
      }
    </ol>
  `,
  styles: `
    .entries {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .entry {
      display: grid;
      grid-template-columns: auto 1fr auto auto auto;
      align-items: center;
      gap: 8px;
      min-height: 48px;
      padding: 4px 0 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .entry:has(ll-kick-editor) {
      display: block;
      padding: 4px 0;
    }
    .entry--rejected {
      border-left: 4px solid var(--mat-sys-error);
    }
    .entry__time {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .entry__what {
      font: var(--mat-sys-body-medium);
    }
    .entry__reason {
      display: block;
      color: var(--mat-sys-error);
    }
    .entry__sync {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EntryList {
  /** The session's repetitions, newest first. */
  readonly kicks = input.required<readonly LocalKick[]>();
  /** The squad's players. */
  readonly players = input.required<readonly CachedPlayer[]>();
  /** Outbox entries of the session by row id. */
  readonly entries = input.required<ReadonlyMap<string, OutboxEntry>>();
  /** Emits a correction to save. */
  readonly corrected = output<EntryCorrection>();
  /** Emits the id of an entry to void. */
  readonly voided = output<string>();

  /** The entry open for correction, if any. */
  readonly editingId = signal<string | null>(null);

  protected readonly outcomeLabels = OUTCOME_LABELS;
  protected readonly techniqueLabels = TECHNIQUE_LABELS;
  protected readonly backspinLabel = backspinLabel;
  /** The club's formatter (distance unit, locale). */
  protected readonly fmt = inject(ClubFormat).format;
  private readonly names = computed(
    () => new Map(this.players().map((p) => [p.id, `${p.shirtNumber === null ? '' : p.shirtNumber + ' '}${p.displayName}`])),
  );

  /** Opens an entry for correction (e.g. from the sync panel's "fix"). */
  open(kickId: string): void {
    this.editingId.set(kickId);
  }

  protected playerName(id: string): string {
    return this.names().get(id) ?? 'Unknown player';
  }

  protected time(iso: string): string {
    return this.fmt().time(iso, true);
  }

  protected syncIcon(entry: OutboxEntry | undefined): string {
    if (!entry) return 'cloud_done';
    return entry.state === 'rejected' ? 'error' : 'cloud_upload';
  }

  protected syncLabel(entry: OutboxEntry | undefined): string {
    if (!entry) return 'On the server';
    return entry.state === 'rejected' ? 'Not accepted by the server' : 'Waiting to sync';
  }

  protected correct(id: string, changes: KickCorrection): void {
    this.editingId.set(null);
    this.corrected.emit({ id, changes });
  }

  protected voidEntry(id: string): void {
    this.editingId.set(null);
    this.voided.emit(id);
  }
}
