import { Routes } from '@angular/router';
import { requireSignedIn, requireSignedOut } from './core/auth-guard';
import { AppShell } from './shell/app-shell';

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
  {
    path: '',
    component: AppShell,
    canActivate: [requireSignedIn],
    canActivateChild: [requireSignedIn],
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'home' },
      {
        path: 'home',
        title: 'Home · Loftline',
        loadComponent: () => import('./home/home').then((m) => m.Home),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
