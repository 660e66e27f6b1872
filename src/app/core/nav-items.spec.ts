import { NAV_ITEMS, NavItem, navItemsFor } from './nav-items';

describe('navItemsFor', () => {
  const items: readonly NavItem[] = [
    { path: '/home', label: 'Home', icon: 'home', roles: ['admin', 'head_coach', 'player'] },
    { path: '/admin', label: 'Club admin', icon: 'shield_person', roles: ['admin'] },
    { path: '/mine', label: 'Mine', icon: 'person', roles: ['player'] },
  ];

  it('keeps only the entries for the role, in order', () => {
    expect(navItemsFor('admin', items).map((item) => item.label)).toEqual(['Home', 'Club admin']);
    expect(navItemsFor('player', items).map((item) => item.label)).toEqual(['Home', 'Mine']);
    expect(navItemsFor('guardian', items)).toEqual([]);
  });

  it('shows nothing when signed out', () => {
    expect(navItemsFor(null)).toEqual([]);
  });

  it('offers Home to every role but the guardian, whose home is Guardian home', () => {
    for (const role of ['admin', 'head_coach', 'assistant_coach', 'player'] as const) {
      expect(navItemsFor(role, NAV_ITEMS).map((item) => item.path)).toContain('/home');
    }
    expect(navItemsFor('guardian', NAV_ITEMS).map((item) => item.path)).toEqual(['/guardian']);
  });
});
