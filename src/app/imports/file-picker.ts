import { ChangeDetectionStrategy, Component, ElementRef, input, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/**
 * Picks one CSV file: a button that opens the device's file chooser, and a drop zone for a
 * desktop. The real `<input type="file">` stays in the page (visually hidden, labelled) so
 * keyboards, screen readers and test drivers reach it like any other file field.
 */
@Component({
  selector: 'll-file-picker',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div
      class="file-picker__zone"
      [class.file-picker__zone--over]="dragging()"
      (dragover)="allowDrop($event)"
      (dragleave)="dragging.set(false)"
      (drop)="takeDrop($event)"
    >
      <input
        #input
        class="file-picker__input"
        type="file"
        accept=".csv,.txt,text/csv,text/plain"
        [attr.aria-label]="label()"
        [disabled]="disabled()"
        (change)="takeChosen()"
      />
      <button mat-flat-button type="button" [disabled]="disabled()" (click)="input.click()">
        <mat-icon aria-hidden="true">upload_file</mat-icon>
        {{ fileName() ? 'Choose another file' : label() }}
      </button>
      @if (fileName(); as name) {
        <span class="file-picker__chosen">{{ name }}</span>
      } @else {
        <span class="file-picker__hint">or drop a CSV file here</span>
      }
    </div>
  `,
  styles: `
    .file-picker__zone {
      position: relative;
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
      padding: 16px;
      border: 2px dashed var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
    }
    .file-picker__zone--over {
      border-color: var(--mat-sys-primary);
      background: var(--mat-sys-surface-container);
    }
    .file-picker__input {
      position: absolute;
      width: 1px;
      height: 1px;
      opacity: 0;
      overflow: hidden;
    }
    button {
      min-height: 48px;
    }
    .file-picker__chosen {
      font: var(--mat-sys-title-small);
      overflow-wrap: anywhere;
    }
    .file-picker__hint {
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilePicker {
  /** The button's words and the file field's accessible name, e.g. "Choose the roster CSV". */
  readonly label = input.required<string>();
  /** The chosen file's name, shown beside the button (null before one is chosen). */
  readonly fileName = input<string | null>(null);
  /** Whether choosing is not possible now (an upload is under way). */
  readonly disabled = input(false);
  /** Emitted with the file the coach chose or dropped. */
  readonly fileChosen = output<File>();

  protected readonly dragging = signal(false);
  private readonly input = viewChild.required<ElementRef<HTMLInputElement>>('input');

  protected takeChosen(): void {
    const element = this.input().nativeElement;
    const file = element.files?.[0];
    if (file) {
      this.fileChosen.emit(file);
    }
    // Clear it, so choosing the same file again (after fixing it) fires a change again.
    element.value = '';
  }

  protected allowDrop(event: DragEvent): void {
    if (this.disabled()) return;
    event.preventDefault();
    this.dragging.set(true);
  }

  protected takeDrop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files[0];
    if (file && !this.disabled()) {
      this.fileChosen.emit(file);
    }
  }
}
