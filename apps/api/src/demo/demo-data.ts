import { type Role } from '@rotaplex/contracts';

/**
 * Invented demo data: a fictional organisation, two fictional units and 30 invented people.
 * Any resemblance to a real organisation or person is unintended.
 */
export const DEMO_PASSWORD = 'rotaplex-demo';

export const DEMO_ORGANISATION = 'Larkfield District Hospital & Services';

export const DEMO_UNITS = {
  ward: { name: 'Ward 7 Acute Medicine', timeZone: 'Europe/London' },
  contact: { name: 'Contact Centre North', timeZone: 'Europe/Dublin' },
} as const;

export type DemoUnitKey = keyof typeof DEMO_UNITS;

export interface DemoUser {
  email: string;
  displayName: string;
  role: Role;
  unit: DemoUnitKey | null;
  /** What the person does, for the README's sign-in table. */
  note: string;
}

const person = (name: string, unit: DemoUnitKey, note: string): DemoUser => ({
  email: `${name.toLowerCase().replace(/\s+/g, '.')}@example.com`,
  displayName: name,
  role: 'staff',
  unit,
  note,
});

/** Every demo sign-in; all use {@link DEMO_PASSWORD}. */
export const DEMO_USERS: readonly DemoUser[] = [
  {
    email: 'admin@example.com',
    displayName: 'Alex Carrow',
    role: 'admin',
    unit: null,
    note: 'Administrator',
  },
  {
    email: 'manager@example.com',
    displayName: 'Morgan Ashdown',
    role: 'manager',
    unit: 'ward',
    note: 'Ward manager',
  },
  {
    email: 'staff@example.com',
    displayName: 'Robin Tallis',
    role: 'staff',
    unit: 'ward',
    note: 'Staff nurse',
  },
  {
    email: 'manager2@example.com',
    displayName: 'Niamh Galloway',
    role: 'manager',
    unit: 'contact',
    note: 'Contact centre planner',
  },
  person('Priya Wendover', 'ward', 'Charge nurse'),
  person('Tomasz Kellaway', 'ward', 'Charge nurse'),
  person('Grace Holloway', 'ward', 'Staff nurse'),
  person('Declan Marsh', 'ward', 'Staff nurse'),
  person('Hannah Pryce', 'ward', 'Staff nurse'),
  person('Seun Adeyemi', 'ward', 'Staff nurse'),
  person('Beth Lindqvist', 'ward', 'Staff nurse'),
  person('Callum Reeves', 'ward', 'Staff nurse'),
  person('Mei Castell', 'ward', 'Staff nurse (nights)'),
  person('Fatima Qadir', 'ward', 'Staff nurse (nights)'),
  person('Owen Treharne', 'ward', 'Healthcare assistant'),
  person('Ines Moreau', 'ward', 'Healthcare assistant'),
  person('Kwame Asante', 'ward', 'Healthcare assistant'),
  person('Lucy Fenwick', 'ward', 'Healthcare assistant'),
  person('Ravi Chandran', 'ward', 'Healthcare assistant'),
  person('Agnieszka Nowak', 'ward', 'Healthcare assistant (nights)'),
  person('Ciaran Doherty', 'contact', 'Team lead'),
  person('Sofia Marin', 'contact', 'Agent (English, Spanish)'),
  person('Lukas Weber', 'contact', 'Agent (English, German)'),
  person('Chloe Dubois', 'contact', 'Agent (English, French)'),
  person('Eoin Kavanagh', 'contact', 'Agent (English, Irish)'),
  person('Ana Ferreira', 'contact', 'Agent (English, Portuguese)'),
  person('Jakub Kowal', 'contact', 'Agent (English, Polish)'),
  person('Siobhan Reilly', 'contact', 'Agent (English)'),
  person('Marco Bellini', 'contact', 'Agent (English, Italian)'),
  person('Yasmin Haddad', 'contact', 'Agent (English, Arabic)'),
];
