import { permissionsOf } from '@rotaplex/contracts';
import { navItemsFor, navSectionsFor, permissionForPath } from './navItems';
import { PATHS } from '@/app/paths';

// Issue 2, item 4: admin features are users, organisation and units (plus the mailbox of item 5);
// managers read the people in their units; staff see only their own things. Issue 4, item 2: admins
// and managers (who hold rosters:plan) see the Planning group of set-up screens; staff do not.
describe('navigation by role', () => {
  const PLANNING = ['Roster periods', 'Cover needs', 'Demand', 'Staff', 'Shift types', 'Contracts', 'Skills'];
  const labels = (role: 'admin' | 'manager' | 'staff') =>
    navItemsFor(permissionsOf(role)).map((i) => i.label);

  it('gives administrators every administration page', () => {
    expect(labels('admin')).toEqual([
      'Overview',
      'My roster',
      'Open shifts',
      'Swap approvals',
      'Requests',
      'People',
      'Units',
      'Organisation',
      'Mailbox',
      'Outbox',
      'Profile',
      ...PLANNING,
    ]);
  });

  it('gives managers the people of their units and no organisation settings', () => {
    expect(labels('manager')).toEqual([
      'Overview',
      'My roster',
      'Open shifts',
      'Swap approvals',
      'Requests',
      'People',
      'Profile',
      ...PLANNING,
    ]);
    expect(navSectionsFor(permissionsOf('manager')).map((s) => s.title)).toEqual([
      'Workspace',
      'Planning',
      'Administration',
    ]);
  });

  it('gives staff no administration section at all', () => {
    expect(labels('staff')).toEqual([
      'Overview',
      'My roster',
      'Swaps',
      'Open shifts',
      'My availability',
      'My requests',
      'Profile',
    ]);
    expect(navSectionsFor(permissionsOf('staff')).map((s) => s.title)).toEqual(['Workspace']);
  });

  it('protects each administration path with the permission of its item', () => {
    expect(permissionForPath(PATHS.users)).toBe('users:read');
    expect(permissionForPath(PATHS.mailboxMessage('abc'))).toBe('mailbox:read');
    // Issue 5, item 5: admins see the outbox and its failures; planners read a period's audit trail.
    expect(permissionForPath(PATHS.outbox)).toBe('mailbox:read');
    expect(permissionForPath(PATHS.periodAudit('abc'))).toBe('rosters:plan');
    expect(permissionForPath(PATHS.profile)).toBeUndefined();
    expect(permissionForPath(PATHS.myRoster)).toBe('rosters:read');
    expect(permissionForPath(PATHS.coverNeeds)).toBe('rosters:plan');
    // Issue 5, items 3 and 4: staff propose swaps and claim open shifts; managers approve them.
    expect(permissionForPath(PATHS.swaps)).toBe('requests:own');
    expect(permissionForPath(PATHS.swapApprovals)).toBe('requests:approve');
    // Issue 5, item 1: staff enter their own availability and requests; managers decide leave.
    expect(permissionForPath(PATHS.myAvailability)).toBe('requests:own');
    expect(permissionForPath(PATHS.myRequests)).toBe('requests:own');
    expect(permissionForPath(PATHS.requests)).toBe('requests:approve');
    expect(permissionForPath(`${PATHS.staff}?unit=abc`)).toBe('rosters:plan');
  });
});
