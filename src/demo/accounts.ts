import type { Role } from '../lib/roles';

/** The fictional company the demo workspace belongs to. */
export const DEMO_COMPANY = 'Halvard Power Systems';
export const DEMO_PASSWORD = 'resetwise-demo';

export interface DemoAccount {
  id: string;
  email: string;
  displayName: string;
  role: Role;
}

/** Invented team members of the demo workspace; the sign-in page lists them in demo mode only. */
export const demoAccounts: DemoAccount[] = [
  { id: 'demo-admin', email: 'admin@resetwise.example', displayName: 'Ingrid Falk', role: 'admin' },
  { id: 'demo-architect', email: 'architect@resetwise.example', displayName: 'Mateo Ruiz', role: 'architect' },
  { id: 'demo-engineer', email: 'engineer@resetwise.example', displayName: 'Priya Raman', role: 'engineer' },
  { id: 'demo-engineer2', email: 'engineer2@resetwise.example', displayName: 'Tomasz Wójcik', role: 'engineer' },
  { id: 'demo-engineer3', email: 'engineer3@resetwise.example', displayName: 'Lena Okafor', role: 'engineer' },
  { id: 'demo-sales', email: 'sales@resetwise.example', displayName: 'Daniel Brandt', role: 'sales' },
];
