import type { Permission, Role } from '@rotaplex/contracts';

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  manager: 'Manager',
  staff: 'Staff',
};

export const ROLE_SUMMARIES: Record<Role, string> = {
  admin: 'You set up the organisation: units, people and their roles.',
  manager: 'You plan the rosters of the units you manage and approve changes to them.',
  staff: 'You see your unit and its published rosters, and manage your own requests.',
};

/** What each permission lets a person do, in their words. Typed so a new permission must be described. */
export const PERMISSION_TEXT: Record<Permission, string> = {
  'organisation:manage': 'Change the organisation and every unit in it',
  'units:read': 'See your units and their time zones',
  'units:write': 'Create units and change their names and time zones',
  'users:read': 'See people, their roles and units',
  'users:write': 'Invite people, change their roles and units, and deactivate accounts',
  'mailbox:read': 'Read the messages Rotaplex has sent',
  'rosters:plan': 'Plan, generate and publish rosters for your units',
  'rosters:read': 'See published rosters of your units',
  'requests:own': 'Enter your availability, shift requests and leave',
  'requests:approve': 'Approve leave, swaps and open-shift claims',
  'reports:read': 'Read reports on hours, cover and fairness',
};
