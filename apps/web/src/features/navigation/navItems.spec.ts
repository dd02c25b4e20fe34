import { permissionsOf } from '@rotaplex/contracts';
import { navItemsFor, navSectionsFor, permissionForPath } from './navItems';
import { PATHS } from '@/app/paths';

// Issue 2, item 4: admin features are users, organisation and units (plus the mailbox of item 5);
// managers read the people in their units; staff see only their own things.
describe('navigation by role', () => {
  const labels = (role: 'admin' | 'manager' | 'staff') =>
    navItemsFor(permissionsOf(role)).map((i) => i.label);

  it('gives administrators every administration page', () => {
    expect(labels('admin')).toEqual(['Overview', 'People', 'Units', 'Organisation', 'Mailbox', 'Profile']);
  });

  it('gives managers the people of their units and no organisation settings', () => {
    expect(labels('manager')).toEqual(['Overview', 'People', 'Profile']);
  });

  it('gives staff no administration section at all', () => {
    expect(labels('staff')).toEqual(['Overview', 'Profile']);
    expect(navSectionsFor(permissionsOf('staff')).map((s) => s.title)).toEqual(['Workspace']);
  });

  it('protects each administration path with the permission of its item', () => {
    expect(permissionForPath(PATHS.users)).toBe('users:read');
    expect(permissionForPath(PATHS.mailboxMessage('abc'))).toBe('mailbox:read');
    expect(permissionForPath(PATHS.profile)).toBeUndefined();
  });
});
