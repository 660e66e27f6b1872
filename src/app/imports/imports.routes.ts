import type { Type } from '@angular/core';
import { Routes } from '@angular/router';
import { requireAdmin } from '../core/auth/role-guard';
import { ImportApi } from './import-api';
import { ImportsPage } from './imports-page';
import { KickExports } from './kick-exports';
import { KickImport } from './kick-import';
import { RosterImport } from './roster-import';
import { provideUploadHttp } from './upload-http';

/**
 * The sections under `/imports` (one lazy chunk, loaded from `app.routes.ts` for staff). The
 * upload client and {@link ImportApi} are provided here, not in root, so uploads go through
 * XMLHttpRequest and can report progress (see {@link provideUploadHttp}). Roster import and data
 * requests are for administrators; the server refuses everyone else anyway. The data-requests screen
 * is its own feature, so the app's routes pass its loader in.
 */
export function importsRoutes(dataRequests: () => Promise<Type<unknown>>): Routes {
  return [
    {
      path: '',
      component: ImportsPage,
      providers: [...provideUploadHttp(), ImportApi],
      children: [
        { path: '', pathMatch: 'full', redirectTo: 'kicks' },
        { path: 'kicks', title: 'Measured kicks · Imports · Loftline', component: KickImport },
        { path: 'roster', title: 'Roster · Imports · Loftline', canMatch: [requireAdmin], component: RosterImport },
        { path: 'exports', title: 'Kick exports · Imports · Loftline', component: KickExports },
        {
          path: 'data-requests',
          title: 'Data requests · Imports · Loftline',
          canMatch: [requireAdmin],
          loadComponent: dataRequests,
        },
      ],
    },
  ];
}
