import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { Subject, finalize, map, startWith, switchMap } from 'rxjs';
import { ROLES, ROLE_LABELS, type Role } from '../../../shared/roles';
import { loginRequestSchema } from '../../../shared/schemas/auth';
import type { PlayerSummary } from '../../../shared/schemas/squads';
import { describeApiError } from '../core/api-error';
import { LOADING, LoadState, toLoadState } from '../core/load-state';
import { SquadApi } from '../core/squad-api';
import { zodValidator } from '../core/zod-validator';
import { dateTimeLabel } from '../core/date-labels';
import { LoadFailure } from '../ui/load-failure';
import { AdminApi, type AdminUser, type InviteRequest } from './admin-api';
import { applyServerErrors } from './server-errors';

/** Roles that work with squads and are invited onto some. Admins see the whole club without. */
const SQUAD_ROLES: readonly Role[] = ['head_coach', 'assistant_coach'];

/** What the invitation needs besides e-mail and name, by role. */
export function inviteNeeds(role: Role): 'squads' | 'player' | 'child' | 'nothing' {
  if (SQUAD_ROLES.includes(role)) {
    return 'squads';
  }
  return role === 'player' ? 'player' : role === 'guardian' ? 'child' : 'nothing';
}

/**
 * Club admin's invitations: creates an account and e-mails a single-use link (valid 7 days) to
 * set its password. What else an invitation carries depends on the role — squads for coaches,
 * the player entry for a player, the child for a guardian — so the server can scope the new
 * account from its first sign-in. Below, the accounts still waiting to accept.
 */
@Component({
  selector: 'll-invite-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    LoadFailure,
  ],
  templateUrl: './invite-form.html',
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteForm {
  private readonly adminApi = inject(AdminApi);
  private readonly squadApi = inject(SquadApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly reloadChoices = new Subject<void>();

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly columns = ['who', 'role', 'invited', 'status'];

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, zodValidator(loginRequestSchema.shape.email)]],
    displayName: ['', [Validators.required, Validators.maxLength(120)]],
    role: ['guardian' as Role, [Validators.required]],
    squadIds: [[] as string[]],
    playerId: [''],
  });
  private readonly role = toSignal(this.form.controls.role.valueChanges, { initialValue: this.form.controls.role.value });
  protected readonly needs = computed(() => inviteNeeds(this.role()));

  protected readonly squads = toSignal(
    this.reloadChoices.pipe(
      startWith(undefined),
      switchMap(() => this.squadApi.listSquads().pipe(toLoadState())),
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
  protected readonly playerGroups = computed(() => {
    const state = this.players();
    const minorsOnly = this.needs() === 'child';
    const groups = new Map<string, PlayerSummary[]>();
    for (const player of state.status === 'ready' ? state.value : []) {
      if (!minorsOnly || player.isMinor) {
        groups.set(player.squadName, [...(groups.get(player.squadName) ?? []), player]);
      }
    }
    return [...groups.entries()].map(([squadName, players]) => ({ squadName, players }));
  });

  protected readonly pendingUsers = signal<LoadState<AdminUser[]>>(LOADING);
  protected readonly sending = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly sent = signal<{ email: string; expires: string } | null>(null);

  constructor() {
    this.loadUsers();
    this.form.controls.role.valueChanges.pipe(takeUntilDestroyed()).subscribe((role) => this.requireForRole(role));
    this.requireForRole(this.form.controls.role.value);
  }

  protected loadUsers(): void {
    this.adminApi
      .listUsers()
      .pipe(
        map((users) => users.filter((user) => user.invitedAt !== null)),
        toLoadState(),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((state) => this.pendingUsers.set(state));
  }

  protected retryChoices(): void {
    this.reloadChoices.next();
  }

  protected roleLabel(user: AdminUser): string {
    return ROLE_LABELS[user.role];
  }

  protected invitedLabel(user: AdminUser): string {
    return user.invitedAt === null ? '–' : dateTimeLabel(user.invitedAt);
  }

  protected send(): void {
    if (this.sending()) {
      return;
    }
    this.failure.set(null);
    this.sent.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const request: InviteRequest = {
      email: value.email.trim().toLowerCase(),
      displayName: value.displayName.trim(),
      role: value.role,
    };
    const needs = inviteNeeds(value.role);
    if (needs === 'squads') {
      request.squadIds = value.squadIds;
    } else if (needs === 'player' || needs === 'child') {
      request.playerId = value.playerId;
    }
    this.sending.set(true);
    this.adminApi
      .invite(request)
      .pipe(finalize(() => this.sending.set(false)))
      .subscribe({
        next: (created) => {
          this.sent.set({ email: created.email, expires: dateTimeLabel(created.expiresAt) });
          this.form.reset({ email: '', displayName: '', role: value.role, squadIds: [], playerId: '' });
          this.loadUsers();
        },
        error: (error: unknown) => this.failure.set(applyServerErrors(this.form, describeApiError(error))),
      });
  }

  /** Makes the role's extra field required and clears the others, so a hidden field never blocks sending. */
  private requireForRole(role: Role): void {
    const { squadIds, playerId } = this.form.controls;
    const needs = inviteNeeds(role);
    squadIds.setValidators(needs === 'squads' ? [Validators.required, nonEmptyList] : []);
    playerId.setValidators(needs === 'player' || needs === 'child' ? [Validators.required] : []);
    if (needs !== 'squads') {
      squadIds.setValue([]);
    }
    if (needs !== 'player' && needs !== 'child') {
      playerId.setValue('');
    }
    squadIds.updateValueAndValidity();
    playerId.updateValueAndValidity();
  }
}

/** `Validators.required` passes an empty array; a coach needs at least one squad. */
function nonEmptyList(control: { value: unknown }): { required: true } | null {
  return Array.isArray(control.value) && control.value.length > 0 ? null : { required: true };
}
