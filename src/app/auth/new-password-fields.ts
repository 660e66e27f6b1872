import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import {
  AbstractControl,
  FormControl,
  FormGroup,
  FormGroupDirective,
  NgForm,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  ValidationErrors,
  Validators,
} from '@angular/forms';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MIN_PASSWORD_LENGTH } from '../../../shared/schemas/mail';

/** Shortest password the server accepts for a new or reset password (the shared rule). */
export const NEW_PASSWORD_MIN_LENGTH = MIN_PASSWORD_LENGTH;
/** Longest password the server accepts (as at sign-in). */
export const NEW_PASSWORD_MAX_LENGTH = 200;

/** The two fields of a new password. */
export interface NewPasswordControls {
  password: FormControl<string>;
  confirm: FormControl<string>;
}

/** Group-level check that the password was typed the same twice (error `mismatch`). */
export function passwordsMatch(group: AbstractControl): ValidationErrors | null {
  const password: unknown = group.get('password')?.value;
  const confirm: unknown = group.get('confirm')?.value;
  return typeof confirm === 'string' && confirm !== '' && password !== confirm ? { mismatch: true } : null;
}

/** A new-password group with the server's length rules and the "typed twice" check. */
export function newPasswordGroup(fb: NonNullableFormBuilder): FormGroup<NewPasswordControls> {
  return fb.group(
    {
      password: fb.control('', [
        Validators.required,
        Validators.minLength(NEW_PASSWORD_MIN_LENGTH),
        Validators.maxLength(NEW_PASSWORD_MAX_LENGTH),
      ]),
      confirm: fb.control('', [Validators.required]),
    },
    { validators: [passwordsMatch] },
  );
}

/** Shows the repeat field in error when the two differ, although the mismatch belongs to the group. */
class RepeatErrorMatcher implements ErrorStateMatcher {
  isErrorState(control: FormControl | null, form: FormGroupDirective | NgForm | null): boolean {
    if (control === null) {
      return false;
    }
    const shown = control.touched || (form?.submitted ?? false);
    return shown && (control.invalid || (control.parent?.hasError('mismatch') ?? false));
  }
}

/**
 * "New password" and "Repeat the new password", shared by accepting an invitation and resetting
 * a password so both say the same rules in the same words. The parent owns the form group and
 * puts server field errors on `password` as `{ server: message }`.
 */
@Component({
  selector: 'll-new-password-fields',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <ng-container [formGroup]="group()">
      <mat-form-field appearance="outline">
        <mat-label>New password</mat-label>
        <input matInput [type]="visible() ? 'text' : 'password'" formControlName="password" autocomplete="new-password" required />
        <mat-icon matPrefix aria-hidden="true">lock</mat-icon>
        <button
          mat-icon-button
          matSuffix
          type="button"
          (click)="toggleVisibility()"
          [attr.aria-label]="visible() ? 'Hide passwords' : 'Show passwords'"
          [attr.aria-pressed]="visible()"
        >
          <mat-icon aria-hidden="true">{{ visible() ? 'visibility_off' : 'visibility' }}</mat-icon>
        </button>
        <mat-hint>At least {{ minLength }} characters. A few unrelated words are easy to remember.</mat-hint>
        @let password = group().controls.password;
        @if (password.hasError('required')) {
          <mat-error>Enter a new password</mat-error>
        } @else if (password.hasError('minlength')) {
          <mat-error>Use at least {{ minLength }} characters</mat-error>
        } @else if (password.hasError('maxlength')) {
          <mat-error>Use at most {{ maxLength }} characters</mat-error>
        } @else if (password.getError('server'); as message) {
          <mat-error>{{ message }}</mat-error>
        }
      </mat-form-field>

      <mat-form-field appearance="outline">
        <mat-label>Repeat the new password</mat-label>
        <input
          matInput
          [type]="visible() ? 'text' : 'password'"
          formControlName="confirm"
          autocomplete="new-password"
          [errorStateMatcher]="repeatMatcher"
          required
        />
        <mat-icon matPrefix aria-hidden="true">lock_reset</mat-icon>
        @if (group().controls.confirm.hasError('required')) {
          <mat-error>Enter the new password again</mat-error>
        } @else if (group().hasError('mismatch')) {
          <mat-error>The two passwords are not the same</mat-error>
        }
      </mat-form-field>
    </ng-container>
  `,
  styles: `
    :host {
      display: flex;
      flex-direction: column;
      gap: 8px;
    }
    mat-form-field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields {
  /** The group made by {@link newPasswordGroup}. */
  readonly group = input.required<FormGroup<NewPasswordControls>>();

  protected readonly minLength = NEW_PASSWORD_MIN_LENGTH;
  protected readonly maxLength = NEW_PASSWORD_MAX_LENGTH;
  protected readonly repeatMatcher = new RepeatErrorMatcher();
  /** Whether both passwords are shown in clear text. */
  protected readonly visible = signal(false);

  protected toggleVisibility(): void {
    this.visible.update((shown) => !shown);
  }
}
