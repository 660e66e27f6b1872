import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import type { Role } from '../../../shared/roles';
import { AuthSession } from '../core/auth/auth-session';

/** One section of the page, reachable by its own URL. */
interface ImportSection {
  readonly path: string;
  readonly label: string;
  readonly roles: readonly Role[];
}

/** The sections in order; roster and data requests are for administrators only. */
export const IMPORT_SECTIONS: readonly ImportSection[] = [
  { path: 'kicks', label: 'Measured kicks', roles: ['admin', 'head_coach', 'assistant_coach'] },
  { path: 'roster', label: 'Roster', roles: ['admin'] },
  { path: 'exports', label: 'Kick exports', roles: ['admin', 'head_coach', 'assistant_coach'] },
  { path: 'data-requests', label: 'Data requests', roles: ['admin'] },
];

/**
 * Imports and exports (`/imports`): data coming in from files (a measuring device's kicks, the
 * club roster) and going out (kicks as CSV, a player's data on request, erasure). Routed tabs, so
 * each section has an address a coach can bookmark and the back button moves between them; each
 * role sees only the sections the server would let it use.
 */
@Component({
  selector: 'll-imports-page',
  imports: [MatTabsModule, RouterLink, RouterLinkActive, RouterOutlet],
  template: `
    <header>
      <h1 class="imports__title">Imports and exports</h1>
    </header>
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Import and export sections" mat-stretch-tabs="false">
      @for (section of sections(); track section.path) {
        <a mat-tab-link [routerLink]="section.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
          {{ section.label }}
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel class="imports__panel">
      <router-outlet />
    </mat-tab-nav-panel>
  `,
  styles: `
    :host {
      display: block;
      box-sizing: border-box;
      max-width: 1180px;
      margin: 0 auto;
      padding: 16px 16px 32px;
    }
    .imports__title {
      margin: 0 0 8px;
      font: var(--mat-sys-headline-small);
    }
    .imports__panel {
      display: block;
      padding-top: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportsPage {
  private readonly session = inject(AuthSession);

  protected readonly sections = computed(() => {
    const role = this.session.role();
    return role === null ? [] : IMPORT_SECTIONS.filter((section) => section.roles.includes(role));
  });
}
