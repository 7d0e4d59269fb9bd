import { ROLES, type Role } from '../../../../shared/api/roles.js';

/** Every role, for sections all signed-in people may open. */
const EVERYONE: readonly Role[] = ROLES;

/** One entry of the side navigation. */
export interface NavItem {
  label: string;
  /** Material Symbols ligature name. */
  icon: string;
  /** Absolute router path. */
  path: string;
  /** Roles that see this entry. */
  roles: readonly Role[];
  /** Heading the entry is listed under, if any. */
  group?: string;
}

/** A run of entries under one heading (or none). */
export interface NavSection {
  heading: string | null;
  items: NavItem[];
}

/**
 * The app's sections in the order shown. Adding a section is one line here; its route goes in
 * app.routes.ts with the same roles.
 */
export const NAV_ITEMS: readonly NavItem[] = [
  { label: 'Record', icon: 'photo_camera', path: '/record', roles: ['recorder', 'admin', 'trainer'] },
  { label: 'Waiting to send', icon: 'cloud_upload', path: '/queue', roles: ['recorder', 'admin', 'trainer'] },
  { label: 'Readings', icon: 'table_rows', path: '/readings', roles: EVERYONE },
  { label: 'Drift', icon: 'insights', path: '/drift', roles: EVERYONE },
  { label: 'Review', icon: 'fact_check', path: '/review', roles: ['reviewer', 'admin'] },
  { label: 'Collection', icon: 'potted_plant', path: '/collection', roles: EVERYONE },
  { label: 'Calibration', icon: 'groups', path: '/calibration', roles: EVERYONE },
  { label: 'Reference set', icon: 'palette', path: '/reference-set', roles: EVERYONE },
  { label: 'Users', icon: 'group', path: '/admin/users', roles: ['admin'], group: 'Admin' },
  { label: 'Outbox', icon: 'outgoing_mail', path: '/admin/outbox', roles: ['admin'], group: 'Admin' },
  { label: 'BrAPI tokens', icon: 'key', path: '/admin/api-tokens', roles: ['admin'], group: 'Admin' },
  { label: 'Walk order', icon: 'format_list_numbered', path: '/admin/walk-order', roles: ['admin'], group: 'Admin' },
  { label: 'Audit', icon: 'history', path: '/admin/audit', roles: ['admin'], group: 'Admin' },
  { label: 'Account', icon: 'manage_accounts', path: '/account', roles: EVERYONE },
];

/** The entries a role may see, in order; nobody signed in sees none. */
export function navItemsFor(role: Role | null, items: readonly NavItem[] = NAV_ITEMS): NavItem[] {
  if (role === null) return [];
  return items.filter((item) => item.roles.includes(role));
}

/**
 * Whether a role may open the section at `path`: a page offers a link (such as "New reading") only
 * to those the section's guard lets in, so no button silently leads elsewhere.
 */
export function mayOpen(role: Role | null | undefined, path: string, items: readonly NavItem[] = NAV_ITEMS): boolean {
  return role !== null && role !== undefined && (items.find((item) => item.path === path)?.roles.includes(role) ?? false);
}

/** The entries a role may see, with consecutive entries of one group gathered under its heading. */
export function navSectionsFor(role: Role | null, items: readonly NavItem[] = NAV_ITEMS): NavSection[] {
  const sections: NavSection[] = [];
  for (const item of navItemsFor(role, items)) {
    const heading = item.group ?? null;
    const last = sections.at(-1);
    if (last && last.heading === heading) last.items.push(item);
    else sections.push({ heading, items: [item] });
  }
  return sections;
}
