import { Routes } from '@angular/router';
import { requireSignedIn, requireSignedOut } from './core/auth/auth-guard';
import { requireAdmin, requireGuardian, requireSandboxAccess, requireStaff } from './core/auth/role-guard';
import { guardianLanding } from './home/guardian-landing';

/**
 * The app's routes. Sign-in stands alone; everything else sits inside the shell behind
 * the signed-in guard. Feature pages are lazy so the first download on a phone stays small.
 * A new feature adds its route under the shell and one line in `NAV_ITEMS`.
 */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Loftline',
    canMatch: [requireSignedOut],
    loadComponent: () => import('./auth/sign-in').then((m) => m.SignIn),
  },
  // Pages opened from e-mailed links: public (the token in the link is the credential).
  {
    path: 'accept-invite',
    title: 'Set your password · Loftline',
    loadComponent: () => import('./auth/accept-invite').then((m) => m.AcceptInvite),
  },
  {
    path: 'forgot-password',
    title: 'Forgot your password · Loftline',
    loadComponent: () => import('./auth/forgot-password').then((m) => m.ForgotPassword),
  },
  {
    path: 'reset-password',
    title: 'Choose a new password · Loftline',
    loadComponent: () => import('./auth/reset-password').then((m) => m.ResetPassword),
  },
  {
    path: 'unsubscribe',
    title: 'Stop the Family digest · Loftline',
    loadComponent: () => import('./guardian/unsubscribe').then((m) => m.Unsubscribe),
  },
  {
    path: '',
    // Lazy too: the shell (navigation, menus, the sync queue and its database) is not what sign-in shows.
    loadComponent: () => import('./shell/app-shell').then((m) => m.AppShell),
    canActivate: [requireSignedIn],
    canActivateChild: [requireSignedIn],
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'home' },
      {
        path: 'home',
        title: 'Home · Loftline',
        canActivate: [guardianLanding],
        loadComponent: () => import('./home/home').then((m) => m.Home),
      },
      {
        path: 'guardian',
        title: 'Guardian home · Loftline',
        canMatch: [requireGuardian],
        loadComponent: () => import('./guardian/guardian-home').then((m) => m.GuardianHome),
      },
      {
        path: 'admin',
        canMatch: [requireAdmin],
        loadChildren: () => import('./admin/admin.routes').then((m) => m.ADMIN_ROUTES),
      },
      {
        path: 'pitchside',
        title: 'Pitchside · Loftline',
        canMatch: [requireStaff],
        loadComponent: () => import('./pitchside/pitchside').then((m) => m.Pitchside),
      },
      {
        path: 'pitchside/:sessionId',
        title: 'Pitchside · Loftline',
        canMatch: [requireStaff],
        loadComponent: () => import('./pitchside/pitchside').then((m) => m.Pitchside),
      },
      {
        path: 'measure/:kickId',
        title: 'Measure from video · Loftline',
        canMatch: [requireStaff],
        loadComponent: () => import('./measure/video-measure').then((m) => m.VideoMeasure),
      },
      {
        path: 'sandbox',
        title: 'Flight sandbox · Loftline',
        canMatch: [requireSandboxAccess],
        loadComponent: () => import('./sandbox/sandbox').then((m) => m.Sandbox),
      },
      {
        path: 'planner',
        title: 'Set-piece planner · Loftline',
        canMatch: [requireStaff],
        loadComponent: () => import('./planner/planner').then((m) => m.Planner),
      },
      {
        path: 'players/:id',
        title: 'Player file · Loftline',
        loadComponent: () => import('./player-file/player-file').then((m) => m.PlayerFile),
      },
      {
        path: 'squad-week',
        title: 'Squad week · Loftline',
        canMatch: [requireStaff],
        loadComponent: () => import('./squad-week/squad-week').then((m) => m.SquadWeek),
      },
      {
        path: 'imports',
        canMatch: [requireStaff],
        // The app's routes are the one place that composes features: the data-requests screen is a
        // tab of the imports page but its own feature.
        loadChildren: () =>
          import('./imports/imports.routes').then((m) =>
            m.importsRoutes(() => import('./data-requests/data-requests').then((d) => d.DataRequests)),
          ),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
