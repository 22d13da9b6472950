import type { StudioRole } from '../../shared/api/auth';

export interface DemoAccount {
  email: string;
  password: string;
  name: string;
  /** Role in the demo studio, or 'admin' for the site administrator (who is in no studio). */
  role: StudioRole | 'admin';
}

/** One password for every demo account: it is printed at start-up and only ever used on demo data. */
export const DEMO_PASSWORD = 'shuttle-and-reed';
export const DEMO_STUDIO_NAME = 'Riverbend Weaving Studio';

// Invented people for an invented studio.
export const demoAccounts: DemoAccount[] = [
  { email: 'lead@shedwright.test', password: DEMO_PASSWORD, name: 'Hazel Marsh', role: 'owner' },
  { email: 'assistant@shedwright.test', password: DEMO_PASSWORD, name: 'Owen Tally', role: 'editor' },
  { email: 'student1@shedwright.test', password: DEMO_PASSWORD, name: 'Ivy Brook', role: 'viewer' },
  { email: 'student2@shedwright.test', password: DEMO_PASSWORD, name: 'Theo Finch', role: 'viewer' },
  { email: 'admin@shedwright.test', password: DEMO_PASSWORD, name: 'Site Admin', role: 'admin' },
];
