import { Routes } from '@angular/router';
import { BallModel } from './ball-model';
import { CapturedMail } from './captured-mail';
import { ClubAdmin } from './club-admin';
import { GroundList } from './ground-list';
import { GuardianLinks } from './guardian-links';
import { InviteForm } from './invite-form';
import { OutboxView } from './outbox-view';
import { StopwatchTiming } from './stopwatch-timing';
import { UnitsLocale } from './units-locale';

/**
 * Club admin's sections under `/admin`. The whole set is one lazy chunk (loaded from
 * `app.routes.ts`), so only administrators ever download it.
 */
export const ADMIN_ROUTES: Routes = [
  {
    path: '',
    component: ClubAdmin,
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'guardians' },
      { path: 'guardians', title: 'Guardians · Club admin · Loftline', component: GuardianLinks },
      { path: 'grounds', title: 'Training grounds · Club admin · Loftline', component: GroundList },
      { path: 'invites', title: 'Invitations · Club admin · Loftline', component: InviteForm },
      { path: 'outbox', title: 'Outbox · Club admin · Loftline', component: OutboxView },
      { path: 'mail', title: 'Captured mail · Club admin · Loftline', component: CapturedMail },
      { path: 'stopwatch', title: 'Stopwatch timing · Club admin · Loftline', component: StopwatchTiming },
      { path: 'ball', title: 'Ball model · Club admin · Loftline', component: BallModel },
      { path: 'units', title: 'Units and locale · Club admin · Loftline', component: UnitsLocale },
    ],
  },
];
