import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterOutlet } from '@angular/router';
import { ThemePreference } from './core/theme-preference';

/**
 * The root component: only a router outlet, so the sign-in page can stand alone while every
 * signed-in page gets the shell. It applies the remembered theme before the first page draws.
 */
@Component({
  selector: 'll-root',
  imports: [RouterOutlet],
  template: '<router-outlet />',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  constructor() {
    inject(ThemePreference);
  }
}
