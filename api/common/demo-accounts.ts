/** The demo and test accounts (reserved `.example` domain), one per role plus a deactivated one. */
import type { Role } from '../http/routes';

export interface DemoAccount {
  email: string;
  name: string;
  role: Role;
  active: boolean;
}

export const DEMO_ACCOUNTS: DemoAccount[] = [
  { email: 'admin@crestwatch.example', name: 'Demo administrator', role: 'admin', active: true },
  { email: 'analyst@crestwatch.example', name: 'Demo analyst', role: 'analyst', active: true },
  { email: 'official@crestwatch.example', name: 'Demo official', role: 'official', active: true },
  { email: 'former@crestwatch.example', name: 'Former staff member', role: 'analyst', active: false },
];

/** The display name the stand-in gives an e-mail address. */
export function standInName(email: string): string {
  return DEMO_ACCOUNTS.find((a) => a.email === email.toLowerCase())?.name ?? email.split('@')[0];
}
