import { NAV_ITEMS, NavItem, navItemsFor, navSectionsFor } from './nav-items';

const paths = (items: NavItem[]) => items.map((item) => item.path);

describe('nav items', () => {
  it('should show an admin every built section', () => {
    expect(paths(navItemsFor('admin'))).toEqual(['/record/photo', '/collection', '/reference-set', '/admin/users', '/admin/outbox', '/admin/audit', '/account']);
  });

  it('should hide the admin section from a recorder', () => {
    expect(paths(navItemsFor('recorder'))).toEqual(['/record/photo', '/collection', '/reference-set', '/account']);
  });

  it('should show Record to those who take readings, not to a reviewer', () => {
    expect(paths(navItemsFor('trainer'))).toContain('/record/photo');
    expect(paths(navItemsFor('reviewer'))).not.toContain('/record/photo');
  });

  it('should show the reference set to every role', () => {
    for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) expect(paths(navItemsFor(role))).toContain('/reference-set');
  });

  it('should show nothing when nobody is signed in', () => {
    expect(navItemsFor(null)).toEqual([]);
  });

  it('should gather the admin entries under one Admin heading', () => {
    const sections = navSectionsFor('admin');
    expect(sections.map((section) => section.heading)).toEqual([null, 'Admin', null]);
    expect(paths(sections[1].items)).toEqual(['/admin/users', '/admin/outbox', '/admin/audit']);
  });

  it('should show a newly added entry only to its roles', () => {
    const review: NavItem = { label: 'Review', icon: 'fact_check', path: '/review', roles: ['reviewer'] };
    const items = [...NAV_ITEMS, review];
    expect(paths(navItemsFor('reviewer', items))).toContain('/review');
    expect(paths(navItemsFor('trainer', items))).not.toContain('/review');
  });
});
