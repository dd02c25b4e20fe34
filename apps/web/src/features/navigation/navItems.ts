import type { Permission } from '@rotaplex/contracts';
import { PATHS } from '@/app/paths';

export type NavKey =
  | 'home'
  | 'users'
  | 'units'
  | 'organisation'
  | 'mailbox'
  | 'profile'
  | 'rosterPeriods'
  | 'coverNeeds'
  | 'staff'
  | 'shiftTypes'
  | 'contracts'
  | 'skills';
export type NavSection = 'workspace' | 'planning' | 'administration';

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
  planning: 'Planning',
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
  {
    key: 'rosterPeriods',
    label: 'Roster periods',
    path: PATHS.rosterPeriods,
    section: 'planning',
    permission: 'rosters:plan',
    description: 'The weeks each roster covers: create, change while draft, archive.',
  },
  {
    key: 'coverNeeds',
    label: 'Cover needs',
    path: PATHS.coverNeeds,
    section: 'planning',
    permission: 'rosters:plan',
    description: 'How many people each shift needs, by skill, day of the week and date.',
  },
  {
    key: 'staff',
    label: 'Staff',
    path: PATHS.staff,
    section: 'planning',
    permission: 'rosters:plan',
    description: 'The people on the roster: skills, contract and cost; CSV upload and export.',
  },
  {
    key: 'shiftTypes',
    label: 'Shift types',
    path: PATHS.shiftTypes,
    section: 'planning',
    permission: 'rosters:plan',
    description: "Each unit's shifts: times, paid minutes and colour.",
  },
  {
    key: 'contracts',
    label: 'Contracts',
    path: PATHS.contracts,
    section: 'planning',
    permission: 'rosters:plan',
    description: 'Work rules: hours, rest, runs of days and nights, weekends; start from a preset.',
  },
  {
    key: 'skills',
    label: 'Skills',
    path: PATHS.skills,
    section: 'planning',
    permission: 'rosters:plan',
    description: 'Qualifications and languages that cover needs ask for.',
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
