import { ROLES, STAFF_ROLES, type Role } from '../../../shared/roles';

/** One entry of the app's navigation. */
export interface NavItem {
  /** Router path the entry opens. */
  readonly path: string;
  /** Visible label (also the accessible name). */
  readonly label: string;
  /** Material Symbols ligature name. */
  readonly icon: string;
  /** Roles that see the entry. The server still checks every call; this only hides dead ends. */
  readonly roles: readonly Role[];
}

/**
 * Every navigation entry, in display order. A feature adds itself with one line here (plus
 * its route); the shell shows each user only the entries for their role, in the side nav on
 * wide screens and in the bottom bar on a phone.
 */
export const NAV_ITEMS: readonly NavItem[] = [
  // A guardian's home is Guardian home (Home redirects there), so they get one entry, not two.
  { path: '/home', label: 'Home', icon: 'home', roles: ROLES.filter((r) => r !== 'guardian') },
  { path: '/pitchside', label: 'Pitchside', icon: 'sports_soccer', roles: STAFF_ROLES },
  { path: '/planner', label: 'Set-piece planner', icon: 'strategy', roles: STAFF_ROLES },
  { path: '/sandbox', label: 'Flight sandbox', icon: 'science', roles: [...STAFF_ROLES, 'player'] },
  { path: '/squad-week', label: 'Squad week', icon: 'leaderboard', roles: STAFF_ROLES },
  { path: '/players/me', label: 'My file', icon: 'person', roles: ['player'] },
  { path: '/guardian', label: 'Guardian home', icon: 'family_restroom', roles: ['guardian'] },
  { path: '/imports', label: 'Imports and exports', icon: 'upload_file', roles: STAFF_ROLES },
  { path: '/admin', label: 'Club admin', icon: 'admin_panel_settings', roles: ['admin'] },
];

/** The entries a user with this role sees, in order. */
export function navItemsFor(role: Role | null, items: readonly NavItem[] = NAV_ITEMS): NavItem[] {
  return role === null ? [] : items.filter((item) => item.roles.includes(role));
}
