import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Subject, Subscription, combineLatest, of, startWith, switchMap } from 'rxjs';
import type { PlayerSummary } from '../../../shared/schemas/squads';
import { type ApiProblem, describeApiError } from '../core/api-error';
import { LOADING, type LoadState, toLoadState } from '../core/load-state';
import { SquadApi } from '../core/squad-api';
import { ExportApi } from '../core/export-api';
import { FileDownload } from '../core/file-download';
import { LoadFailure } from '../ui/load-failure';
import { ErasureApi, type ErasureMode } from './erasure-api';

/** Where one request (download or erasure) stands. */
type RequestState =
  | { readonly status: 'idle' }
  | { readonly status: 'working' }
  | { readonly status: 'done'; readonly message: string }
  | { readonly status: 'failed'; readonly problem: ApiProblem };

const IDLE: RequestState = { status: 'idle' };

/**
 * Data requests about one player (admin): a copy of everything Loftline holds about them (a
 * data-access request), and erasure. Erasure is irreversible, so it asks for a deliberate choice
 * of what happens to the kicks and for the player's name typed out, says that it is written to
 * the audit log, and defers to the club's safeguarding policy and data-protection law, which
 * decide whether a request must be granted and what must be kept.
 */
@Component({
  selector: 'll-data-requests',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    LoadFailure,
  ],
  templateUrl: './data-requests.html',
  styleUrl: './data-requests.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DataRequests {
  private readonly squadApi = inject(SquadApi);
  private readonly exports = inject(ExportApi);
  private readonly erasure = inject(ErasureApi);
  private readonly download = inject(FileDownload);
  private readonly retries = new Subject<void>();
  private readonly reloadPlayers = new Subject<void>();
  private requests = new Subscription();

  protected readonly choice = new FormGroup({
    squadId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    playerId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
  });
  protected readonly erase = new FormGroup({
    mode: new FormControl<ErasureMode | null>(null, [Validators.required]),
    confirmName: new FormControl('', { nonNullable: true }),
  });

  protected readonly squads = toSignal(
    this.retries.pipe(
      startWith(undefined),
      switchMap(() => this.squadApi.listSquads().pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );
  private readonly squadId = toSignal(this.choice.controls.squadId.valueChanges, { initialValue: '' });
  private readonly playerId = toSignal(this.choice.controls.playerId.valueChanges, { initialValue: '' });
  protected readonly players = toSignal(
    combineLatest([toObservable(this.squadId), this.reloadPlayers.pipe(startWith(undefined))]).pipe(
      switchMap(([squadId]) =>
        squadId === '' ? of<LoadState<PlayerSummary[]>>(LOADING) : this.squadApi.listPlayers(squadId).pipe(toLoadState()),
      ),
    ),
    { initialValue: LOADING },
  );
  protected readonly player = computed(() => {
    const players = this.players();
    return players.status === 'ready' ? (players.value.find((p) => p.id === this.playerId()) ?? null) : null;
  });

  private readonly eraseValue = toSignal(this.erase.valueChanges, { initialValue: this.erase.getRawValue() });
  /** Whether the typed name is the player's name (as the server compares it: exact, spaces trimmed). */
  protected readonly nameMatches = computed(() => {
    const player = this.player();
    return player !== null && (this.eraseValue().confirmName ?? '').trim() === player.displayName;
  });
  protected readonly canErase = computed(
    () => this.nameMatches() && (this.eraseValue().mode ?? null) !== null && this.erasing().status !== 'working',
  );

  protected readonly exporting = signal<RequestState>(IDLE);
  protected readonly erasing = signal<RequestState>(IDLE);

  constructor() {
    effect(() => {
      const squads = this.squads();
      const first = squads.status === 'ready' ? squads.value[0] : undefined;
      if (first && this.choice.controls.squadId.value === '') {
        this.choice.controls.squadId.setValue(first.id);
      }
    });
    // An empty list cannot open, so the player field waits, disabled, until the players are there.
    effect(() => {
      const control = this.choice.controls.playerId;
      const players = this.players();
      if (players.status === 'ready' && players.value.length > 0) control.enable({ emitEvent: false });
      else control.disable({ emitEvent: false });
    });
    // Another squad: no player chosen yet.
    this.choice.controls.squadId.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.choice.controls.playerId.setValue(''));
    // Another player: start both requests afresh, so a typed name never carries over to someone else.
    // (Cleared after an erasure too; its message stays until another player is chosen.)
    this.choice.controls.playerId.valueChanges.pipe(takeUntilDestroyed()).subscribe((playerId) => {
      this.erase.reset({ mode: null, confirmName: '' });
      this.exporting.set(IDLE);
      if (playerId !== '') this.erasing.set(IDLE);
    });
    inject(DestroyRef).onDestroy(() => this.requests.unsubscribe());
  }

  protected retry(): void {
    this.retries.next();
  }

  /** Downloads everything held about the chosen player as a JSON file. */
  protected downloadData(): void {
    const player = this.player();
    if (player === null) return;
    this.exporting.set({ status: 'working' });
    this.requests.add(
      this.exports.playerData(player.id).subscribe({
        next: (file) => {
          this.download.save(file.blob, file.fileName);
          this.exporting.set({
            status: 'done',
            message: `Saved ${file.fileName}. Send it to the person who asked by a secure route, then delete your copy.`,
          });
        },
        error: (error: unknown) => this.exporting.set({ status: 'failed', problem: describeApiError(error) }),
      }),
    );
  }

  /** Erases the chosen player once the name has been typed and a mode chosen. */
  protected erasePlayer(): void {
    const player = this.player();
    const { mode, confirmName } = this.erase.getRawValue();
    if (player === null || mode === null || !this.nameMatches()) return;
    this.erasing.set({ status: 'working' });
    this.requests.add(
      this.erasure.erase(player.id, mode, confirmName.trim()).subscribe({
        next: (result) => {
          const kicks = `${result.kicksAffected} ${result.kicksAffected === 1 ? 'kick' : 'kicks'}`;
          const what = mode === 'remove' ? `${kicks} removed` : `${kicks} kept only as anonymised figures`;
          this.erasing.set({ status: 'done', message: `${player.displayName} has been erased: ${what}. The erasure is in the audit log.` });
          this.choice.controls.playerId.setValue('');
          this.reloadPlayers.next();
        },
        error: (error: unknown) => this.erasing.set({ status: 'failed', problem: describeApiError(error) }),
      }),
    );
  }
}
