import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSlideToggleChange, MatSlideToggleModule } from '@angular/material/slide-toggle';
import { Observable, filter, finalize, switchMap } from 'rxjs';
import { describeApiError } from '../core/api-error';
import { ConfirmDialog, type ConfirmDialogData } from '../ui/confirm-dialog';
import { consentSentence, consentStatus } from '../core/guardians/consent-state';
import { type ConsentText, GuardianApi, type GuardianLinkView } from '../core/guardians/guardian-api';

/** What the panel is waiting for the server to do. */
type PendingAction = 'consent' | 'withdraw' | 'digest';

/**
 * One child's consent and Family digest choice, for their guardian. Consent and the digest are
 * separate on purpose: consent says the club may send a summary, the toggle says whether this
 * guardian wants one, and the toggle stays off limits until consent is in force. Consent is sent
 * with the version of the text shown, so the record says exactly what was agreed to, and a newer
 * text asks the guardian to read and consent again.
 */
@Component({
  selector: 'll-consent-panel',
  imports: [ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatIconModule, MatSlideToggleModule],
  templateUrl: './consent-panel.html',
  styleUrl: './consent-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConsentPanel {
  private readonly api = inject(GuardianApi);
  private readonly dialog = inject(MatDialog);

  /** The link this panel is about. */
  readonly link = input.required<GuardianLinkView>();
  /** The consent text in force, or null when it could not be loaded (consenting then waits). */
  readonly consentText = input.required<ConsentText | null>();
  /** Emitted with the server's updated link after every successful change. */
  readonly changed = output<GuardianLinkView>();
  /** Emitted when the server says the consent text shown is no longer the one in force. */
  readonly textOutdated = output<void>();

  protected readonly status = computed(() => consentStatus(this.link(), this.consentText()?.version ?? null));
  protected readonly sentence = computed(() => consentSentence(this.status()));
  protected readonly active = computed(() => this.status().kind === 'active');
  /** Whether the guardian should (re)read and consent: no consent, withdrawn, or an older text. */
  protected readonly asksForConsent = computed(() => {
    const status = this.status();
    return status.kind !== 'active' || status.outdated;
  });
  protected readonly pending = signal<PendingAction | null>(null);
  protected readonly failure = signal<string | null>(null);
  /** The toggle's shown position: the server's value, or the requested one while a change is on its way. */
  protected readonly optInShown = linkedSignal(() => this.link().digestOptIn);
  protected readonly readConfirmed = new FormControl(false, { nonNullable: true, validators: [Validators.requiredTrue] });
  protected readonly ids = computed(() => {
    const id = this.link().id;
    return { title: `consent-${id}-title`, text: `consent-${id}-text`, digestHint: `consent-${id}-digest-hint` };
  });

  protected recordConsent(): void {
    const text = this.consentText();
    if (this.pending() !== null || text === null) {
      return;
    }
    if (this.readConfirmed.invalid) {
      this.readConfirmed.markAsTouched();
      return;
    }
    this.run('consent', this.api.recordConsent(this.link().id, text.version), () => this.readConfirmed.reset(false));
  }

  protected withdrawConsent(): void {
    if (this.pending() !== null) {
      return;
    }
    const firstName = this.link().playerFirstName;
    const data: ConfirmDialogData = {
      title: 'Withdraw consent?',
      message:
        `The club will stop sending you the Family digest about ${firstName}. ` +
        'You can give consent again at any time. Withdrawing does not delete training records; ' +
        'ask the club if you want them exported or deleted.',
      confirmLabel: 'Withdraw consent',
    };
    this.failure.set(null);
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data, autoFocus: 'dialog' })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => {
          this.pending.set('withdraw');
          return this.api.withdrawConsent(this.link().id).pipe(finalize(() => this.pending.set(null)));
        }),
      )
      .subscribe({
        next: (link) => this.changed.emit(link),
        error: (error: unknown) => this.failure.set(describeApiError(error).message),
      });
  }

  protected setDigest(change: MatSlideToggleChange): void {
    const wanted = change.checked;
    this.optInShown.set(wanted);
    this.run('digest', this.api.setDigestOptIn(this.link().id, wanted), undefined, () => this.optInShown.set(!wanted));
  }

  private run(action: PendingAction, request: Observable<GuardianLinkView>, onDone?: () => void, onFailure?: () => void): void {
    this.failure.set(null);
    this.pending.set(action);
    request.pipe(finalize(() => this.pending.set(null))).subscribe({
      next: (link) => {
        onDone?.();
        this.changed.emit(link);
      },
      error: (error: unknown) => {
        onFailure?.();
        const problem = describeApiError(error);
        this.failure.set(problem.message);
        if (problem.fields['textVersion'] !== undefined) {
          this.textOutdated.emit();
        }
      },
    });
  }
}
