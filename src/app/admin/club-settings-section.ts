import { Directive, OnInit, inject } from '@angular/core';
import type { FormControl, FormGroup } from '@angular/forms';
import type { ClubSettings, ClubSettingsUpdate } from '../../../shared/schemas/club';
import { WriteAction } from '../core/action-state';
import { describeApiError } from '../core/api-error';
import { ClubSettingsStore } from '../core/club-settings-store';
import { applyServerErrors } from './server-errors';

/** A reactive form whose controls hold exactly the fields of `V`. */
export type FormOf<V> = FormGroup<{ [K in keyof V]: FormControl<V[K]> }>;

/**
 * One Club admin section editing part of the club's settings (stopwatch timing, ball model, units and
 * locale): the form starts from the cached settings, takes the server's once they arrive (unless the
 * admin has already typed), and saves through `ClubSettingsStore` with one `WriteAction`, server field
 * errors placed under their fields. A section says only which fields it shows and how they map.
 */
@Directive()
export abstract class ClubSettingsSection<V extends object> implements OnInit {
  protected readonly store = inject(ClubSettingsStore);
  /** The save under way, done or failed. */
  protected readonly saving = new WriteAction();
  /** The section's form. */
  protected abstract readonly form: FormOf<V>;

  /** The form's values for the club's `settings`. */
  protected abstract fromSettings(settings: ClubSettings): V;

  /** The body of `PUT /api/club/settings` for the form's `value`, keeping the `current` settings it does not show. */
  protected abstract toUpdate(value: V, current: ClubSettings): ClubSettingsUpdate;

  async ngOnInit(): Promise<void> {
    await this.store.refresh();
    if (!this.form.dirty) this.form.setValue(this.fromSettings(this.store.settings()) as never);
  }

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.saving.reset();
      this.form.markAllAsTouched();
      return;
    }
    await this.saving.run(
      async () => {
        const saved = await this.store.save(this.toUpdate(this.form.getRawValue() as V, this.store.settings()));
        this.form.reset(this.fromSettings(saved) as never);
      },
      (error) => applyServerErrors(this.form, describeApiError(error)),
    );
  }
}
