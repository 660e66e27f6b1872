import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Subject, catchError, filter, finalize, map, of, startWith, switchMap } from 'rxjs';
import type { PlayerSummary } from '../../../shared/schemas/squads';
import { describeApiError } from '../core/api-error';
import { LOADING, LoadState, toLoadState } from '../core/load-state';
import { SquadApi } from '../core/squad-api';
import { ConfirmDialog, type ConfirmDialogData } from '../ui/confirm-dialog';
import { consentSentence, consentStatus, hasActiveConsent } from '../core/guardians/consent-state';
import { GuardianApi, type GuardianLinkView } from '../core/guardians/guardian-api';
import { LoadFailure } from '../ui/load-failure';
import { AdminApi } from './admin-api';
import { applyServerErrors } from './server-errors';

/** Relationships offered when linking; the server stores the word as given. */
export const RELATIONSHIPS = [
  { value: 'parent', label: 'Parent' },
  { value: 'guardian', label: 'Legal guardian' },
  { value: 'carer', label: 'Carer' },
] as const;

/** One row of the links table, worded once so the cells stay simple. */
interface LinkRow {
  readonly link: GuardianLinkView;
  readonly relationship: string;
  readonly consent: string;
  readonly consentActive: boolean;
  readonly digest: string;
}

/**
 * Club admin's guardian links: who may see which child's summary, and where each link's consent
 * and digest stand. Admins link and unlink here; consent itself is the guardian's to give in
 * Guardian home, so this page shows it but does not set it.
 */
@Component({
  selector: 'll-guardian-links',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    LoadFailure,
  ],
  templateUrl: './guardian-links.html',
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GuardianLinks {
  private readonly guardianApi = inject(GuardianApi);
  private readonly adminApi = inject(AdminApi);
  private readonly squadApi = inject(SquadApi);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
  private readonly reloadChoices = new Subject<void>();

  protected readonly relationships = RELATIONSHIPS;
  protected readonly columns = ['guardian', 'child', 'relationship', 'consent', 'digest', 'actions'];
  protected readonly links = signal<LoadState<GuardianLinkView[]>>(LOADING);
  protected readonly guardians = toSignal(
    this.reloadChoices.pipe(
      startWith(undefined),
      switchMap(() => this.adminApi.listUsers('guardian').pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );
  protected readonly players = toSignal(
    this.reloadChoices.pipe(
      startWith(undefined),
      switchMap(() => this.squadApi.listPlayers().pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );
  /** The consent text version in force, to mark consents given to an older text (null if unknown). */
  private readonly consentVersion = toSignal(
    this.guardianApi.consentText().pipe(
      map((text): string | null => text.version),
      catchError(() => of(null)),
    ),
    { initialValue: null },
  );
  /** Players grouped by squad for the picker. */
  protected readonly playerGroups = computed(() => {
    const state = this.players();
    const groups = new Map<string, PlayerSummary[]>();
    for (const player of state.status === 'ready' ? state.value : []) {
      groups.set(player.squadName, [...(groups.get(player.squadName) ?? []), player]);
    }
    return [...groups.entries()].map(([squadName, players]) => ({ squadName, players }));
  });

  protected readonly filterControl = new FormControl('', { nonNullable: true });
  private readonly filterText = toSignal(this.filterControl.valueChanges, { initialValue: '' });
  protected readonly rows = computed<LinkRow[]>(() => {
    const state = this.links();
    if (state.status !== 'ready') {
      return [];
    }
    const needle = this.filterText().trim().toLowerCase();
    const version = this.consentVersion();
    return state.value
      .filter(
        (link) =>
          needle === '' ||
          [link.guardianName, link.guardianEmail, link.playerName, link.squadName].some((text) => text.toLowerCase().includes(needle)),
      )
      .map((link) => {
        const status = consentStatus(link, version);
        const active = hasActiveConsent(link);
        const outdated = status.kind === 'active' && status.outdated ? ' Given to an older consent text.' : '';
        return {
          link,
          relationship: RELATIONSHIPS.find((option) => option.value === link.relationship)?.label ?? link.relationship,
          consent: consentSentence(status) + outdated,
          consentActive: active,
          digest: !active ? 'Off — no consent' : link.digestOptIn ? 'On' : 'Off — not chosen',
        };
      });
  });

  protected readonly form = inject(NonNullableFormBuilder).group({
    guardianUserId: ['', [Validators.required]],
    playerId: ['', [Validators.required]],
    relationship: ['parent'],
  });
  protected readonly linking = signal(false);
  protected readonly linkFailure = signal<string | null>(null);
  protected readonly linkDone = signal<string | null>(null);
  protected readonly removing = signal<string | null>(null);
  protected readonly removeFailure = signal<string | null>(null);

  constructor() {
    this.loadLinks();
  }

  protected loadLinks(): void {
    this.guardianApi
      .listLinks()
      .pipe(toLoadState(), takeUntilDestroyed(this.destroyRef))
      .subscribe((state) => this.links.set(state));
  }

  protected retryChoices(): void {
    this.reloadChoices.next();
  }

  protected link(): void {
    if (this.linking()) {
      return;
    }
    this.linkFailure.set(null);
    this.linkDone.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { guardianUserId, playerId, relationship } = this.form.getRawValue();
    this.linking.set(true);
    this.guardianApi
      .linkGuardian({ guardianUserId, playerId, relationship })
      .pipe(finalize(() => this.linking.set(false)))
      .subscribe({
        next: (link) => {
          this.links.update((state) => (state.status === 'ready' ? { status: 'ready', value: [link, ...state.value] } : state));
          this.linkDone.set(`${link.guardianName} is now linked to ${link.playerName} (${link.squadName}).`);
          this.form.reset({ guardianUserId: '', playerId: '', relationship: 'parent' });
        },
        error: (error: unknown) => this.linkFailure.set(applyServerErrors(this.form, describeApiError(error))),
      });
  }

  protected remove(link: GuardianLinkView): void {
    if (this.removing() !== null) {
      return;
    }
    this.removeFailure.set(null);
    this.linkDone.set(null);
    const data: ConfirmDialogData = {
      title: 'Remove this link?',
      message:
        `${link.guardianName} will no longer see ${link.playerName}’s summary, and the Family digest about ` +
        `${link.playerFirstName} stops for them. The consent record goes with the link.`,
      confirmLabel: 'Remove link',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data, autoFocus: 'dialog' })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => {
          this.removing.set(link.id);
          return this.guardianApi.removeLink(link.id).pipe(finalize(() => this.removing.set(null)));
        }),
      )
      .subscribe({
        next: () =>
          this.links.update((state) =>
            state.status === 'ready' ? { status: 'ready', value: state.value.filter((other) => other.id !== link.id) } : state,
          ),
        error: (error: unknown) => this.removeFailure.set(describeApiError(error).message),
      });
  }
}
