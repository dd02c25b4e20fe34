import type { Permission } from '@rotaplex/contracts';
import { PATHS } from '@/app/paths';

export type NavKey = 'home' | 'users' | 'units' | 'organisation' | 'mailbox' | 'profile';
export type NavSection = 'workspace' | 'administration';

export interface NavItem {
  key: NavKey;
  label: string;
  path: string;
  section: NavSection;
  /** What the page is for, shown on the overview page. */
  description: string;
  /** Needed to see the item; items without one are open to every signed-in user. */
  permission?: Permission;
}

export const NAV_SECTIONS: Record<NavSection, string> = {
  workspace: 'Workspace',
  administration: 'Administration',
};

/** Every navigation destination, in display order. Visibility follows the contracts' permission table. */
export const NAV_ITEMS: readonly NavItem[] = [
  {
    key: 'home',
    label: 'Overview',
    path: PATHS.home,
    section: 'workspace',
    description: 'Your units, your role and what you can do.',
  },
  {
    key: 'users',
    label: 'People',
    path: PATHS.users,
    section: 'administration',
    permission: 'users:read',
    description: 'Find people, invite new colleagues, change roles and units.',
  },
  {
    key: 'units',
    label: 'Units',
    path: PATHS.units,
    section: 'administration',
    permission: 'units:write',
    description: 'Wards, teams and stores, each with its own time zone.',
  },
  {
    key: 'organisation',
    label: 'Organisation',
    path: PATHS.organisation,
    section: 'administration',
    permission: 'organisation:manage',
    description: 'The name everyone sees in the header and in e-mails.',
  },
  {
    key: 'mailbox',
    label: 'Mailbox',
    path: PATHS.mailbox,
    section: 'administration',
    permission: 'mailbox:read',
    description: 'Messages Rotaplex has sent, as received by the local mail catcher.',
  },
  {
    key: 'profile',
    label: 'Profile',
    path: PATHS.profile,
    section: 'workspace',
    description: 'Your details and your password.',
  },
];

/** The items a user with these permissions may see, in display order. */
export function navItemsFor(permissions: readonly Permission[]): NavItem[] {
  return NAV_ITEMS.filter((item) => !item.permission || permissions.includes(item.permission));
}

/** The items grouped by section, leaving out empty sections. */
export function navSectionsFor(
  permissions: readonly Permission[],
): { section: NavSection; title: string; items: NavItem[] }[] {
  const items = navItemsFor(permissions);
  return (Object.keys(NAV_SECTIONS) as NavSection[])
    .map((section) => ({
      section,
      title: NAV_SECTIONS[section],
      items: items.filter((i) => i.section === section),
    }))
    .filter((group) => group.items.length > 0);
}

/** The permission a path needs, if any (for route guards and tests). */
export function permissionForPath(path: string): Permission | undefined {
  return NAV_ITEMS.find((item) => item.path !== PATHS.home && path.startsWith(item.path))?.permission;
}
