// What each role may do in the app, mirroring the server's route table (api/http/routes.ts:
// ADMIN, STAFF, SIGNED_IN). The app hides what a role cannot use; the server still refuses
// with 403 whatever slips through, and screens show that refusal as it is.
import { ROLES, type Role } from '@/contracts/common';

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  analyst: 'Analyst',
  official: 'Official',
};

/** One line per role, for the People screen's role choice. */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'People, roles, settings and the schedule, plus all analyst work',
  analyst: 'Uploads, model specs, runs, publishing and notes',
  official: 'Reads district cards and briefs, manages own alerts',
};

export type Capability =
  | 'read' // district cards, the region, own alerts and subscriptions
  | 'upload' // load and revert series
  | 'specs' // manage model specs
  | 'runs' // start, review, publish, discard runs; notes
  | 'settings.read'
  | 'settings.write'
  | 'people' // invite, change roles, deactivate
  | 'audit'
  | 'mailbox';

const STAFF: readonly Capability[] = ['read', 'upload', 'specs', 'runs', 'settings.read'];

const CAPABILITIES: Record<Role, readonly Capability[]> = {
  official: ['read'],
  analyst: STAFF,
  admin: [...STAFF, 'settings.write', 'people', 'audit', 'mailbox'],
};

export function isRole(value: unknown): value is Role {
  return (ROLES as readonly unknown[]).includes(value);
}

/** Whether a role may use a capability; an unknown role may use none. */
export function can(role: string | null | undefined, capability: Capability): boolean {
  return isRole(role) && CAPABILITIES[role].includes(capability);
}

export function roleLabel(role: string): string {
  return isRole(role) ? ROLE_LABELS[role] : role;
}
