import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { LoftlineMark } from './loftline-mark';

/**
 * The frame of the pages people reach from an e-mail without being signed in (invitation,
 * password reset, unsubscribe): the product's mark, a heading, and the page's content, laid
 * out like the sign-in page so a link from a mail is recognisably Loftline.
 */
@Component({
  selector: 'll-public-panel',
  imports: [LoftlineMark],
  template: `
    <main class="public">
      <section class="public__panel" aria-labelledby="public-title">
        <header class="public__brand">
          <ll-loftline-mark [size]="56" />
          <div>
            <p class="public__product">Loftline</p>
            <h1 id="public-title" class="public__title">{{ heading() }}</h1>
          </div>
        </header>
        <ng-content />
      </section>
    </main>
  `,
  styles: `
    :host {
      display: block;
      min-height: 100dvh;
    }
    .public {
      box-sizing: border-box;
      min-height: 100dvh;
      display: grid;
      place-items: center;
      padding: 24px 16px;
    }
    .public__panel {
      box-sizing: border-box;
      width: min(100%, 460px);
      padding: 32px 24px 24px;
      border-radius: var(--mat-sys-corner-large);
      background: var(--mat-sys-surface-container-lowest);
      color: var(--mat-sys-on-surface);
      border: 1px solid var(--mat-sys-outline-variant);
    }
    .public__brand {
      display: flex;
      align-items: center;
      gap: 16px;
      margin-bottom: 24px;
    }
    .public__product {
      margin: 0;
      font: var(--mat-sys-title-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .public__title {
      margin: 0;
      font: var(--mat-sys-headline-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PublicPanel {
  /** The page's heading, e.g. "Set your password". */
  readonly heading = input.required<string>();
}
