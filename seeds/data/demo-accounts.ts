import type { Role } from '../../shared/schemas/auth';

/** The invented demo consultancy and its people. Passwords are for local use only. */
export const DEMO_ORGANISATION = { name: 'Corrie & Vell Hydrology' } as const;

export interface DemoAccount {
  role: Role;
  name: string;
  email: string;
  password: string;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { role: 'admin', name: 'Ilse Marrow', email: 'admin@corrievell.example', password: 'demo-admin-tarnish' },
  { role: 'consultant', name: 'Tomas Reel', email: 'consultant@corrievell.example', password: 'demo-consultant-tarnish' },
  { role: 'scientist', name: 'Dr Anouk Felder', email: 'scientist@corrievell.example', password: 'demo-scientist-tarnish' },
  { role: 'client', name: 'Rafe Okonna (Duskwater Power)', email: 'client@duskwater.example', password: 'demo-client-tarnish' },
];

/** The demo consultancy starts with an active monthly plan of this many seats. */
export const DEMO_SUBSCRIPTION = { seats: 5 } as const;
