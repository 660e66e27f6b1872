import { DOCUMENT } from '@angular/common';
import { DestroyRef, Injectable, inject, signal } from '@angular/core';
import { Observable, Subject } from 'rxjs';

/**
 * Whether the browser believes it has a network, and when that belief changes. The `online`
 * and `offline` events are the only connectivity signal every browser gives a page (there is
 * no background sync to rely on), so the sync queue pushes when `online` fires. The flag can
 * be optimistic — "online" behind a dead captive portal — which is why a failed push still
 * counts as a failure and backs off.
 */
@Injectable({ providedIn: 'root' })
export class Connectivity {
  private readonly window = inject(DOCUMENT).defaultView;
  private readonly state = signal(this.window?.navigator.onLine ?? true);
  private readonly cameOnline = new Subject<void>();

  /** Whether the browser reports a network connection. */
  readonly online = this.state.asReadonly();
  /** Emits each time the browser regains a connection. */
  readonly online$: Observable<void> = this.cameOnline.asObservable();

  constructor() {
    const win = this.window;
    if (!win) {
      return;
    }
    const up = (): void => {
      this.state.set(true);
      this.cameOnline.next();
    };
    const down = (): void => this.state.set(false);
    win.addEventListener('online', up);
    win.addEventListener('offline', down);
    inject(DestroyRef).onDestroy(() => {
      win.removeEventListener('online', up);
      win.removeEventListener('offline', down);
    });
  }
}
