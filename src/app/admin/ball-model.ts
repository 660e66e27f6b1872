import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import {
  DEFAULT_DRAG_CRISIS_RE,
  DRAG_CRISIS_RE_RANGE,
  clubSettingsSchema,
  type ClubSettings,
  type ClubSettingsUpdate,
} from '../../../shared/schemas/club';
import { ClubSettingsSection } from './club-settings-section';
import { SectionStatus } from './section-status';

/** The field of the ball model form: the drag crisis in units of 10⁵. */
interface BallModelFields {
  dragCrisisRe: number;
}

/** Reynolds numbers are entered in units of 10⁵, as ball makers and wind-tunnel papers quote them. */
const RE_UNIT = 1e5;

/**
 * The club's ball for the flight model: the Reynolds number where its drag drops (the drag crisis).
 * Panel design and surface move it (Asai et al. 2007 measured 2.2–3.0 × 10⁵ across balls), and with it how
 * slow balls — chips, short passes — carry. Every kick of the club is modelled with it; changing it
 * refits the club's profiles.
 */
@Component({
  selector: 'll-ball-model',
  imports: [SectionStatus, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <section class="section__card" aria-labelledby="ball-title">
      <h2 id="ball-title" class="section__title">Ball model</h2>
      <p class="section__lead">
        A ball's drag drops sharply above a certain speed (the drag crisis). Where that happens depends on the ball: wind-tunnel tests put
        it between about 2.2 and 3.0 × 10⁵ in Reynolds number for different match balls. The default,
        {{ defaultRe }} × 10⁵ (the centre of the drop), is the ball of a published trajectory study. Change it only from a measurement of
        the ball your club uses; slower balls (chips, short passes) are the ones it moves.
      </p>
      <form class="section__form" [formGroup]="form" (ngSubmit)="save()" aria-label="Ball model">
        <mat-form-field appearance="outline">
          <mat-label>Drag-crisis Reynolds number</mat-label>
          <input matInput type="number" step="0.01" formControlName="dragCrisisRe" />
          <span matTextSuffix>× 10⁵</span>
          <mat-hint>Centre of the drop ({{ range[0] }}–{{ range[1] }} × 10⁵)</mat-hint>
          @if (form.controls.dragCrisisRe.errors; as errors) {
            <mat-error>{{ errors['server'] ?? 'Enter a number from ' + range[0] + ' to ' + range[1] }}</mat-error>
          }
        </mat-form-field>
        <div class="section__form-actions">
          <button mat-flat-button type="submit" [disabled]="saving.pending()">
            {{ saving.pending() ? 'Saving…' : 'Save ball model' }}
          </button>
        </div>
      </form>
      <ll-section-status [action]="saving" doneText="Saved. The club's profiles are being refitted with this ball." />
    </section>
  `,
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BallModel extends ClubSettingsSection<BallModelFields> {
  protected readonly defaultRe = (DEFAULT_DRAG_CRISIS_RE / RE_UNIT).toFixed(2);
  protected readonly range = DRAG_CRISIS_RE_RANGE.map((v) => v / RE_UNIT);
  protected readonly form = inject(NonNullableFormBuilder).group({
    dragCrisisRe: [
      this.shown(this.store.settings().dragCrisisRe),
      [Validators.required, Validators.min(DRAG_CRISIS_RE_RANGE[0] / RE_UNIT), Validators.max(DRAG_CRISIS_RE_RANGE[1] / RE_UNIT)],
    ],
  });

  protected fromSettings(settings: ClubSettings): BallModelFields {
    return { dragCrisisRe: this.shown(settings.dragCrisisRe) };
  }

  protected toUpdate(value: BallModelFields, current: ClubSettings): ClubSettingsUpdate {
    return clubSettingsSchema.parse({
      timingBiasS: current.timingBiasS,
      timingSdS: current.timingSdS,
      dragCrisisRe: Math.round(value.dragCrisisRe * RE_UNIT),
    });
  }

  private shown(re: number | undefined): number {
    return Math.round(((re ?? DEFAULT_DRAG_CRISIS_RE) / RE_UNIT) * 100) / 100;
  }
}
