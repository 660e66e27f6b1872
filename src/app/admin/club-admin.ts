import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

/** One section of Club admin, reachable by its own URL so a link to it (or a reload) lands there. */
interface AdminSection {
  readonly path: string;
  readonly label: string;
}

const SECTIONS: readonly AdminSection[] = [
  { path: 'guardians', label: 'Guardians' },
  { path: 'invites', label: 'Invitations' },
  { path: 'grounds', label: 'Grounds' },
  { path: 'outbox', label: 'Outbox' },
  { path: 'mail', label: 'Captured mail' },
  { path: 'stopwatch', label: 'Stopwatch timing' },
  { path: 'ball', label: 'Ball model' },
  { path: 'units', label: 'Units and locale' },
];

/**
 * Club admin (`/admin`): the administrator's page for guardian links and consent, invitations,
 * training grounds and mail delivery. Sections are routed tabs rather than one long page so `/admin/mail` can be
 * linked from a developer's notes and the browser's back button moves between sections.
 */
@Component({
  selector: 'll-club-admin',
  imports: [MatTabsModule, RouterLink, RouterLinkActive, RouterOutlet],
  template: `
    <header class="admin__header">
      <h1 class="admin__title">Club admin</h1>
      <p class="admin__subtitle">
        Guardian links and consent, invitations, training grounds, the club’s outgoing mail, the Pitchside stopwatch timing, the ball model,
        and the club’s units and locale.
      </p>
    </header>
    <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Club admin sections" mat-stretch-tabs="false">
      @for (section of sections; track section.path) {
        <a mat-tab-link [routerLink]="section.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
          {{ section.label }}
        </a>
      }
    </nav>
    <mat-tab-nav-panel #panel class="admin__panel">
      <router-outlet />
    </mat-tab-nav-panel>
  `,
  styles: `
    :host {
      display: block;
      box-sizing: border-box;
      max-width: 1180px;
      margin: 0 auto;
      padding: 24px 16px 32px;
    }
    .admin__title {
      margin: 0;
      font: var(--mat-sys-headline-medium);
    }
    .admin__subtitle {
      margin: 4px 0 12px;
      font: var(--mat-sys-body-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .admin__panel {
      display: block;
      padding-top: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClubAdmin {
  protected readonly sections = SECTIONS;
}
