import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { DomSanitizer, SafeHtml } from '@angular/platform-browser';
import { Subject, combineLatest, startWith, switchMap } from 'rxjs';
import { LOADING, toLoadState } from '../core/load-state';
import { dateTimeLabel } from '../core/date-labels';
import { LoadFailure } from '../ui/load-failure';
import { CapturedMailApi, type CapturedMailMessage } from './captured-mail-api';
import { framedMailHtml, hasInlineImages, splitMailText } from './mail-text';

/**
 * One captured mail: its headers, its text part, and its HTML part as the recipient's mail
 * program would draw it. The HTML comes from our own templates but is treated as untrusted all
 * the same: it renders only inside an `<iframe sandbox srcdoc>` with no sandbox permissions.
 */
@Component({
  selector: 'll-mail-reader',
  imports: [MatIconModule, MatProgressBarModule, MatTabsModule, LoadFailure],
  templateUrl: './mail-reader.html',
  styleUrl: './mail-reader.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailReader {
  private readonly api = inject(CapturedMailApi);
  private readonly sanitizer = inject(DomSanitizer);
  private readonly reloads = new Subject<void>();

  /** The captured message to show. */
  readonly messageId = input.required<string>();

  protected readonly state = toSignal(
    combineLatest([toObservable(this.messageId), this.reloads.pipe(startWith(undefined))]).pipe(
      switchMap(([id]) => this.api.get(id).pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );
  protected readonly message = computed<CapturedMailMessage | null>(() => {
    const state = this.state();
    return state.status === 'ready' && state.value.found ? state.value.message : null;
  });
  protected readonly headers = computed(() => Object.entries(this.message()?.headers ?? {}).map(([name, value]) => ({ name, value })));
  protected readonly textParts = computed(() => splitMailText(this.message()?.text ?? ''));
  /**
   * The HTML part for the frame's `srcdoc`. Marked trusted only because the frame is sandboxed
   * with no permissions (no scripts, no same-origin access, no forms, no navigation of the app);
   * Angular's sanitizer would otherwise strip the styles that make a mail look like itself.
   */
  protected readonly frameHtml = computed<SafeHtml | null>(() => {
    const html = this.message()?.html;
    return html ? this.sanitizer.bypassSecurityTrustHtml(framedMailHtml(html)) : null;
  });

  /** Whether the HTML shows inline attachments, which captured mail does not keep. */
  protected readonly inlineImages = computed(() => hasInlineImages(this.message()?.html ?? ''));

  protected when(iso: string): string {
    return dateTimeLabel(iso);
  }

  protected reload(): void {
    this.reloads.next();
  }
}
