import { NAV_ITEMS, NavItem, mayOpen, navItemsFor, navSectionsFor } from './nav-items';

const paths = (items: NavItem[]) => items.map((item) => item.path);

describe('nav items', () => {
  it('should show an admin every built section', () => {
    expect(paths(navItemsFor('admin'))).toEqual(['/record', '/queue', '/readings', '/drift', '/review', '/collection', '/calibration', '/reference-set', '/admin/users', '/admin/outbox', '/admin/api-tokens', '/admin/walk-order', '/admin/audit', '/account']);
  });

  it('should hide the admin section from a recorder', () => {
    expect(paths(navItemsFor('recorder'))).toEqual(['/record', '/queue', '/readings', '/drift', '/collection', '/calibration', '/reference-set', '/account']);
  });

  it('should show Record to those who take readings, not to a reviewer', () => {
    expect(paths(navItemsFor('trainer'))).toContain('/record');
    expect(paths(navItemsFor('reviewer'))).not.toContain('/record');
    expect(paths(navItemsFor('reviewer'))).not.toContain('/queue');
  });

  it('should show Readings to every role', () => {
    for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) expect(paths(navItemsFor(role))).toContain('/readings');
  });

  it('should show Drift to every role, right after Readings', () => {
    for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) {
      const list = paths(navItemsFor(role));
      expect(list[list.indexOf('/readings') + 1]).toBe('/drift');
    }
  });

  it('should show Review to reviewers and admins only', () => {
    expect(paths(navItemsFor('reviewer'))).toContain('/review');
    expect(paths(navItemsFor('admin'))).toContain('/review');
    expect(paths(navItemsFor('recorder'))).not.toContain('/review');
    expect(paths(navItemsFor('trainer'))).not.toContain('/review');
  });

  it('should show the reference set to every role', () => {
    for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) expect(paths(navItemsFor(role))).toContain('/reference-set');
  });

  it('should show Calibration to every role: trainers run sessions, anyone may take part', () => {
    for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) expect(paths(navItemsFor(role))).toContain('/calibration');
  });

  it('should show nothing when nobody is signed in', () => {
    expect(navItemsFor(null)).toEqual([]);
  });

  it('should gather the admin entries under one Admin heading', () => {
    const sections = navSectionsFor('admin');
    expect(sections.map((section) => section.heading)).toEqual([null, 'Admin', null]);
    expect(paths(sections[1].items)).toEqual(['/admin/users', '/admin/outbox', '/admin/api-tokens', '/admin/walk-order', '/admin/audit']);
  });

  it('should show a newly added entry only to its roles', () => {
    const review: NavItem = { label: 'Review', icon: 'fact_check', path: '/review', roles: ['reviewer'] };
    const items = [...NAV_ITEMS, review];
    expect(paths(navItemsFor('reviewer', items))).toContain('/review');
    expect(paths(navItemsFor('trainer', items))).not.toContain('/review');
  });

  it('should say a reviewer may not open Record while a recorder, trainer and admin may', () => {
    expect(mayOpen('reviewer', '/record')).toBe(false);
    for (const role of ['recorder', 'trainer', 'admin'] as const) expect(mayOpen(role, '/record')).toBe(true);
    expect(mayOpen(null, '/record')).toBe(false);
    expect(mayOpen('admin', '/nowhere')).toBe(false);
  });
});
