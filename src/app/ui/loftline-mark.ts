import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/**
 * Loftline's mark (a lofted ball arc dropping into a target ring) drawn inline, so it shows
 * offline, in both themes and at any size without another download. Decorative: the product
 * name always sits next to it as text.
 */
@Component({
  selector: 'll-loftline-mark',
  template: `
    <svg viewBox="0 0 512 512" [attr.width]="size()" [attr.height]="size()" aria-hidden="true" focusable="false">
      <rect width="512" height="512" rx="112" fill="#1B2A41" />
      <line x1="72" y1="404" x2="440" y2="404" stroke="#F7F5F0" stroke-width="14" stroke-linecap="round" opacity="0.55" />
      <ellipse cx="404" cy="404" rx="44" ry="13" fill="none" stroke="#F0A202" stroke-width="10" />
      <path
        d="M104 398 C 168 150, 300 92, 404 398"
        fill="none"
        stroke="#F0A202"
        stroke-width="22"
        stroke-linecap="round"
        stroke-dasharray="2 40"
      />
      <circle cx="250" cy="170" r="50" fill="#F7F5F0" />
      <path d="M250 146 l22.8 16.6 -8.7 26.8 h-28.2 l-8.7 -26.8 z" fill="#1B2A41" />
    </svg>
  `,
  styles: `
    :host {
      display: inline-flex;
      flex: none;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoftlineMark {
  /** Edge length in CSS pixels. */
  readonly size = input(40);
}
