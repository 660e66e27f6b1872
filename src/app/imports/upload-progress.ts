import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { RunState } from './import-run';
import { megabytes } from './local-csv';

/**
 * How far an upload has got: a bar that fills as the file goes up, then an indeterminate bar
 * while the server reads every row. Said in words too (and to screen readers), because a bar
 * alone does not tell a coach whether a slow pitch-side connection or the server is the wait.
 */
@Component({
  selector: 'll-upload-progress',
  imports: [MatButtonModule, MatProgressBarModule],
  template: `
    @if (view(); as v) {
      <mat-progress-bar [mode]="v.mode" [value]="v.percent" [attr.aria-label]="v.text" />
      <div class="upload-progress__line">
        <p class="upload-progress__text" role="status">{{ v.text }}</p>
        @if (v.mode === 'determinate') {
          <button mat-button type="button" (click)="cancelUpload.emit()">Cancel</button>
        }
      </div>
    }
  `,
  styles: `
    :host {
      display: block;
      margin: 12px 0;
    }
    .upload-progress__line {
      display: flex;
      align-items: center;
      justify-content: space-between;
      gap: 8px;
      min-height: 48px;
    }
    .upload-progress__text {
      margin: 0;
      font: var(--mat-sys-body-medium);
    }
    button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadProgress {
  /** The run to show; nothing shows unless it is uploading or checking. */
  readonly state = input.required<RunState<unknown>>();
  /** What is going up, e.g. "kicks.csv". */
  readonly fileName = input.required<string>();
  /** Emitted when the coach stops an upload that is still sending. */
  readonly cancelUpload = output<void>();

  protected readonly view = computed(
    () => {
      const state = this.state();
      if (state.status === 'checking') {
        const what = state.dryRun ? 'Checking every row on the server' : 'Importing on the server';
        return { mode: 'indeterminate' as const, percent: 0, text: `${what}…` };
      }
      if (state.status !== 'uploading') {
        return null;
      }
      const { loadedBytes, totalBytes } = state;
      if (totalBytes === null || totalBytes === 0) {
        return { mode: 'determinate' as const, percent: 0, text: `Sending ${this.fileName()}: ${kilobytes(loadedBytes)}…` };
      }
      const percent = Math.min(100, Math.round((loadedBytes / totalBytes) * 100));
      return {
        mode: 'determinate' as const,
        percent,
        text: `Sending ${this.fileName()}: ${kilobytes(loadedBytes)} of ${kilobytes(totalBytes)} (${percent} %)`,
      };
    },
    { equal: (a, b) => a?.text === b?.text && a?.mode === b?.mode },
  );
}

/** A byte count for people: "840 kB", "3.2 MB". */
export function kilobytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? megabytes(bytes) : `${Math.max(1, Math.round(bytes / 1024))} kB`;
}
