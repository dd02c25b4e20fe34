import { permissionsOf } from '@rotaplex/contracts';
import { navItemsFor, navSectionsFor, permissionForPath } from './navItems';
import { PATHS } from '@/app/paths';

// Issue 2, item 4: admin features are users, organisation and units (plus the mailbox of item 5);
// managers read the people in their units; staff see only their own things. Issue 4, item 2: admins
// and managers (who hold rosters:plan) see the Planning group of set-up screens; staff do not.
describe('navigation by role', () => {
  const PLANNING = ['Roster periods', 'Cover needs', 'Staff', 'Shift types', 'Contracts', 'Skills'];
  const labels = (role: 'admin' | 'manager' | 'staff') =>
    navItemsFor(permissionsOf(role)).map((i) => i.label);

  it('gives administrators every administration page', () => {
    expect(labels('admin')).toEqual([
      'Overview',
      'People',
      'Units',
      'Organisation',
      'Mailbox',
      'Profile',
      ...PLANNING,
    ]);
  });

  it('gives managers the people of their units and no organisation settings', () => {
    expect(labels('manager')).toEqual(['Overview', 'People', 'Profile', ...PLANNING]);
    expect(navSectionsFor(permissionsOf('manager')).map((s) => s.title)).toEqual([
      'Workspace',
      'Planning',
      'Administration',
    ]);
  });

  it('gives staff no administration section at all', () => {
    expect(labels('staff')).toEqual(['Overview', 'Profile']);
    expect(navSectionsFor(permissionsOf('staff')).map((s) => s.title)).toEqual(['Workspace']);
  });

  it('protects each administration path with the permission of its item', () => {
    expect(permissionForPath(PATHS.users)).toBe('users:read');
    expect(permissionForPath(PATHS.mailboxMessage('abc'))).toBe('mailbox:read');
    expect(permissionForPath(PATHS.profile)).toBeUndefined();
    expect(permissionForPath(PATHS.coverNeeds)).toBe('rosters:plan');
    expect(permissionForPath(`${PATHS.staff}?unit=abc`)).toBe('rosters:plan');
  });
});
