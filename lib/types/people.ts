// Shapes of the people, audit and mailbox APIs (api/people, api/audit, api/mail).
import type { Role } from '@/lib/roles';

export type PersonStatus = 'active' | 'invited' | 'expired' | 'deactivated';

export type Person = {
  id: number;
  email: string;
  name: string | null;
  role: Role;
  active: boolean;
  status: PersonStatus;
  createdAt: string;
  lastSignInAt: string | null;
  invitedAt: string | null;
  /** When an unused invitation lapses; null for accounts never sent one. */
  invitationExpiresAt?: string | null;
  /** Whether the account is pinned to a Google identity (set at the first sign-in). */
  identityPinned?: boolean;
};

export type PeopleResponse = { people: Person[] };

export type InviteInput = { email: string; role: Role; name?: string };

export type InviteAnswer = { user: Person; mail: { sent: boolean; error?: string } };

export type PersonPatch = { role?: Role; active?: boolean; name?: string };

export type AuditEntry = {
  id: number;
  at: string;
  actorId: number | null;
  actorEmail: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  before: unknown;
  after: unknown;
};

export type AuditFilter = { action?: string; actor?: string; targetType?: string; since?: string; until?: string };

export type AuditResponse = { entries: AuditEntry[] };

export type CaughtMail = {
  id: number;
  receivedAt: string;
  from: string | null;
  to: string[];
  subject: string;
  text: string;
  attachments: { filename: string | null; contentType: string; size: number }[] | null;
};

export type MailboxResponse = { messages: CaughtMail[] };
