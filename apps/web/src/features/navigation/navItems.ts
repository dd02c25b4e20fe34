import type { Permission } from '@rotaplex/contracts';
import { PATHS } from '@/app/paths';

export type NavKey =
  | 'home'
  | 'users'
  | 'units'
  | 'organisation'
  | 'mailbox'
  | 'outbox'
  | 'profile'
  | 'myRoster'
  | 'swaps'
  | 'openShifts'
  | 'swapApprovals'
  | 'myAvailability'
  | 'myRequests'
  | 'requests'
  | 'rosterPeriods'
  | 'coverNeeds'
  | 'demand'
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
    key: 'myRoster',
    label: 'My roster',
    path: PATHS.myRoster,
    section: 'workspace',
    permission: 'rosters:read',
    description: "Your published shifts and your team's in a calendar, and your calendar feed.",
  },
  {
    key: 'swaps',
    label: 'Swaps',
    path: PATHS.swaps,
    section: 'workspace',
    permission: 'requests:own',
    description: 'Swap a published shift with a colleague or offer it; answer their requests.',
  },
  {
    key: 'openShifts',
    label: 'Open shifts',
    path: PATHS.openShifts,
    section: 'workspace',
    permission: 'rosters:read',
    description: 'Published shifts still short of people; staff claim the ones they can take.',
  },
  {
    key: 'swapApprovals',
    label: 'Swap approvals',
    path: PATHS.swapApprovals,
    section: 'workspace',
    permission: 'requests:approve',
    description: 'Agreed swaps and open-shift claims waiting for a manager.',
  },
  {
    key: 'myAvailability',
    label: 'My availability',
    path: PATHS.myAvailability,
    section: 'workspace',
    permission: 'requests:own',
    description: 'Your usual week: when you are available, would rather not work, or cannot.',
  },
  {
    key: 'myRequests',
    label: 'My requests',
    path: PATHS.myRequests,
    section: 'workspace',
    permission: 'requests:own',
    description: 'Ask for shifts or days off in the next roster, request leave and see its status.',
  },
  {
    key: 'requests',
    label: 'Requests',
    path: PATHS.requests,
    section: 'workspace',
    permission: 'requests:approve',
    description: "Your units' date requests and leave; approve or decline leave.",
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
    key: 'outbox',
    label: 'Outbox',
    path: PATHS.outbox,
    section: 'administration',
    permission: 'mailbox:read',
    description: 'Every e-mail on its way out, with retries and failures.',
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
    key: 'demand',
    label: 'Demand',
    path: PATHS.demand,
    section: 'planning',
    permission: 'rosters:plan',
    description:
      'Forecast contacts or expected patients, turned into the staff each interval or shift needs.',
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
