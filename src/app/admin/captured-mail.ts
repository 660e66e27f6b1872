import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { Subject, startWith, switchMap } from 'rxjs';
import { LOADING, toLoadState } from '../core/load-state';
import { dateTimeLabel } from '../core/date-labels';
import { LoadFailure } from '../ui/load-failure';
import { CapturedMailApi } from './captured-mail-api';
import { MailReader } from './mail-reader';

/**
 * Captured mail (`/admin/mail`, `/admin/mail?message=<id>`): what the local fake SMTP server
 * caught, so an admin can check an invitation, a reset or a Family digest without a real
 * mailbox. The selected message is in the URL (a query parameter, so the list stays loaded
 * while moving between messages), and the phone's back button returns to the list.
 * On a server without the fake mail server the page says so instead of showing an error.
 */
@Component({
  selector: 'll-captured-mail',
  imports: [MatButtonModule, MatIconModule, MatListModule, MatProgressBarModule, RouterLink, LoadFailure, MailReader],
  templateUrl: './captured-mail.html',
  styleUrl: './captured-mail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CapturedMail {
  private readonly api = inject(CapturedMailApi);
  private readonly reloads = new Subject<void>();

  /** The open message (`?message=`, bound by the router), if any. */
  readonly message = input<string | undefined>(undefined);

  protected readonly mailbox = toSignal(
    this.reloads.pipe(
      startWith(undefined),
      switchMap(() => this.api.list().pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );

  protected when(iso: string): string {
    return dateTimeLabel(iso);
  }

  protected reload(): void {
    this.reloads.next();
  }
}
