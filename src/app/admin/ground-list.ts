import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { finalize } from 'rxjs';
import { groundInputSchema } from '../../../shared/schemas/grounds';
import { describeApiError } from '../core/api-error';
import { GroundApi, type Ground, type GroundInput } from '../core/ground-api';
import { LOADING, type LoadState, toLoadState } from '../core/load-state';
import { zodValidator } from '../core/zod-validator';
import { LoadFailure } from '../ui/load-failure';
import { applyServerErrors } from './server-errors';

/** The compass word for a bearing, to check an entry at a glance (N, NNE, … on the 16-point rose). */
export function compassPoint(bearingDeg: number): string {
  const points = ['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW'];
  return points[Math.round((((bearingDeg % 360) + 360) % 360) / 22.5) % 16];
}

/**
 * Club admin's training grounds: where each is (so the server can ask the weather service about the air
 * at the pitch), its altitude, and the compass bearing of the main kicking direction, which turns the
 * service's wind into the headwind, tailwind or cross-wind of a drill. Corrections apply to sessions
 * started afterwards; sessions already started keep their conditions.
 */
@Component({
  selector: 'll-ground-list',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatTableModule,
    LoadFailure,
  ],
  templateUrl: './ground-list.html',
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GroundList {
  private readonly api = inject(GroundApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly columns = ['name', 'position', 'altitude', 'bearing', 'actions'];
  protected readonly grounds = signal<LoadState<Ground[]>>(LOADING);
  /** The ground being corrected, or null when the form adds a new one. */
  protected readonly editing = signal<Ground | null>(null);
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly saved = signal<string | null>(null);
  protected readonly compassPoint = compassPoint;

  private readonly shape = groundInputSchema.shape;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, zodValidator(this.shape.name)]],
    latitude: [null as number | null, [Validators.required, zodValidator(this.shape.latitude)]],
    longitude: [null as number | null, [Validators.required, zodValidator(this.shape.longitude)]],
    altitudeM: [null as number | null, [Validators.required, zodValidator(this.shape.altitudeM)]],
    kickingBearingDeg: [null as number | null, [Validators.required, zodValidator(this.shape.kickingBearingDeg)]],
  });

  constructor() {
    this.load();
  }

  protected load(): void {
    this.api
      .list()
      .pipe(toLoadState(), takeUntilDestroyed(this.destroyRef))
      .subscribe((state) => this.grounds.set(state));
  }

  protected edit(ground: Ground): void {
    this.editing.set(ground);
    this.saved.set(null);
    this.failure.set(null);
    this.form.reset({
      name: ground.name,
      latitude: ground.latitude,
      longitude: ground.longitude,
      altitudeM: ground.altitudeM,
      kickingBearingDeg: ground.kickingBearingDeg,
    });
  }

  protected addNew(): void {
    this.editing.set(null);
    this.form.reset({ name: '', latitude: null, longitude: null, altitudeM: null, kickingBearingDeg: null });
  }

  protected save(): void {
    if (this.saving()) {
      return;
    }
    this.failure.set(null);
    this.saved.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const input: GroundInput = {
      name: value.name.trim(),
      latitude: Number(value.latitude),
      longitude: Number(value.longitude),
      altitudeM: Number(value.altitudeM),
      kickingBearingDeg: Number(value.kickingBearingDeg),
    };
    const editing = this.editing();
    this.saving.set(true);
    (editing ? this.api.update(editing.id, input) : this.api.create(input)).pipe(finalize(() => this.saving.set(false))).subscribe({
      next: (ground) => {
        this.saved.set(editing ? `${ground.name} is corrected.` : `${ground.name} is added.`);
        this.addNew();
        this.load();
      },
      error: (error: unknown) => this.failure.set(applyServerErrors(this.form, describeApiError(error))),
    });
  }
}
