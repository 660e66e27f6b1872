import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, NavigationError, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { ROLE_LABELS } from '../../../shared/roles';
import { DeviceHandover } from '../core/auth/device-handover';
import { AuthSession } from '../core/auth/auth-session';
import { ClubFormat } from '../core/club-format';
import { NAV_ITEMS, navItemsFor } from '../core/nav-items';
import { ProfileStore } from '../core/profile-store';
import { SyncQueue } from '../core/sync/sync-queue';
import { ThemePreference } from '../core/theme-preference';
import { LoftlineMark } from '../ui/loftline-mark';
import { UpdateBanner } from './update-banner';
import { SignOutWarning, type SignOutWarningChoice, type SignOutWarningData } from './sign-out-warning';

/** From this width on the navigation sits in a side nav; below it, in a bottom bar for thumbs. */
export const WIDE_LAYOUT_QUERY = '(min-width: 840px)';

/** How many tabs fit the bottom bar of a 360 px phone with 48 px+ targets and readable labels. */
const BOTTOM_BAR_SLOTS = 4;

/**
 * The frame around every signed-in page: the ink-navy bar with product, club and user, the
 * theme toggle and sign-out, and the navigation the user's role allows. On a phone the
 * navigation moves to a bottom bar within reach of the thumb and the account controls fold
 * into one menu, so the bar never wraps on a 360 px screen.
 */
@Component({
  selector: 'll-app-shell',
  imports: [
    MatButtonModule,
    MatDividerModule,
    MatIconModule,
    MatListModule,
    MatMenuModule,
    MatSidenavModule,
    MatToolbarModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    LoftlineMark,
    UpdateBanner,
  ],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[class.shell--wide]': 'wide()' },
})
export class AppShell {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  private readonly breakpoints = inject(BreakpointObserver);
  private readonly dialog = inject(MatDialog);
  /** Started here so the outbox syncs on open, on whichever page the app opens. */
  private readonly sync = inject(SyncQueue);

  protected readonly theme = inject(ThemePreference);
  protected readonly user = this.session.user;
  protected readonly roleLabel = computed(() => {
    const role = this.session.role();
    return role ? ROLE_LABELS[role] : '';
  });
  /** Unsynced changes another user left on this shared phone (kept under them, not shown here). */
  protected readonly keptForOthers = inject(DeviceHandover).keptForOthers;
  protected readonly clubName = computed(() => this.session.club()?.name ?? null);
  protected readonly wide = toSignal(this.breakpoints.observe(WIDE_LAYOUT_QUERY).pipe(map((state) => state.matches)), {
    initialValue: this.breakpoints.isMatched(WIDE_LAYOUT_QUERY),
  });

  protected readonly navItems = computed(() => navItemsFor(this.session.role(), NAV_ITEMS));
  /** Tabs shown in the phone's bottom bar; the rest go into its "More" menu. */
  protected readonly bottomItems = computed(() => {
    const items = this.navItems();
    return items.length <= BOTTOM_BAR_SLOTS ? items : items.slice(0, BOTTOM_BAR_SLOTS - 1);
  });
  protected readonly overflowItems = computed(() => {
    const items = this.navItems();
    return items.length <= BOTTOM_BAR_SLOTS ? [] : items.slice(BOTTOM_BAR_SLOTS - 1);
  });
  /** The bar's sync mark: shown while the server lacks changes or the phone is offline. */
  protected readonly syncMark = computed(() => {
    const unsynced = this.sync.unsynced();
    const phase = this.sync.phase();
    if (phase === 'signed_out' || (unsynced === 0 && phase !== 'offline')) {
      return null;
    }
    const offline = phase === 'offline';
    const label = `${offline ? 'Offline, ' : ''}${unsynced} ${unsynced === 1 ? 'change' : 'changes'} not synced`;
    return { offline, unsynced, label };
  });
  /**
   * A screen whose code could not be fetched: only Home and Pitchside (with sign-in and this frame) are
   * stored on the phone at the first visit (ngsw-config.json); other screens are stored the first time
   * they open with a signal. Cleared by the next navigation that succeeds.
   */
  protected readonly notOnPhone = signal(false);
  protected readonly themeToggleLabel = computed(() => (this.theme.isDark() ? 'Switch to light theme' : 'Switch to dark theme'));

  constructor() {
    // The club name in the bar comes from GET /api/me; the stored one shows until it answers.
    inject(ProfileStore).ensureLoaded();
    // The club's distance unit and locale (cached on the device for offline use) for every screen.
    void inject(ClubFormat).refresh();
    // A dynamic import that fails rejects with a TypeError in every browser; other navigation errors are not this.
    this.router.events.pipe(takeUntilDestroyed()).subscribe((event) => {
      if (event instanceof NavigationError) this.notOnPhone.set(event.error instanceof TypeError);
      else if (event instanceof NavigationEnd) this.notOnPhone.set(false);
    });
    // A printed sheet carries every chart's table: open the "Show as table" alternatives while printing.
    const opened: HTMLDetailsElement[] = [];
    const openTables = (): void => {
      for (const d of Array.from(document.querySelectorAll<HTMLDetailsElement>('details.ll-chart__alt:not([open])'))) {
        d.open = true;
        opened.push(d);
      }
    };
    const closeTables = (): void => {
      for (const d of opened.splice(0)) d.open = false;
    };
    window.addEventListener('beforeprint', openTables);
    window.addEventListener('afterprint', closeTables);
    inject(DestroyRef).onDestroy(() => {
      window.removeEventListener('beforeprint', openTables);
      window.removeEventListener('afterprint', closeTables);
    });
  }

  protected signOut(): void {
    const unsynced = this.sync.unsynced();
    if (unsynced === 0) {
      this.leave();
      return;
    }
    // Signing out never deletes the outbox; the coach only has to know the changes wait here.
    this.dialog
      .open<SignOutWarning, SignOutWarningData, SignOutWarningChoice>(SignOutWarning, {
        data: { unsynced, offline: this.sync.phase() === 'offline' },
      })
      .afterClosed()
      .subscribe((choice) => {
        if (choice === 'sign_out') {
          this.leave();
        } else {
          this.sync.syncNow();
        }
      });
  }

  private leave(): void {
    this.session.signOut();
    void this.router.navigateByUrl('/sign-in');
  }
}
