/** People, audit and the demo mailbox: api/people, api/audit, api/mail. */
import * as z from './kit';
import { isoTime, nullableNumber, nullableString, RoleSchema } from './common';

export const PersonStatusSchema = z.enum(['active', 'invited', 'expired', 'deactivated']);
export type PersonStatus = z.infer<typeof PersonStatusSchema>;

export const PersonSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: nullableString,
  role: RoleSchema,
  active: z.boolean(),
  status: PersonStatusSchema,
  createdAt: isoTime,
  lastSignInAt: z.nullable(isoTime),
  invitedAt: z.nullable(isoTime),
  /** When an unused invitation lapses; null for accounts never sent one. */
  invitationExpiresAt: z.optional(z.nullable(isoTime)),
  /** Whether the account is pinned to a Google identity (set at the first sign-in). */
  identityPinned: z.optional(z.boolean()),
});
export type Person = z.infer<typeof PersonSchema>;

export const PeopleResponseSchema = z.object({ people: z.array(PersonSchema) });
export type PeopleResponse = z.infer<typeof PeopleResponseSchema>;

/** The body of POST /api/people/invitations. */
export const InviteInputSchema = z.object({ email: z.string(), role: RoleSchema, name: z.optional(z.string()) });
export type InviteInput = z.infer<typeof InviteInputSchema>;

export const InviteAnswerSchema = z.object({
  user: PersonSchema,
  mail: z.object({ sent: z.boolean(), error: z.optional(z.string()) }),
});
export type InviteAnswer = z.infer<typeof InviteAnswerSchema>;

/** The body of PATCH /api/people/:id. */
export const PersonPatchSchema = z.object({
  role: z.optional(RoleSchema),
  active: z.optional(z.boolean()),
  name: z.optional(z.string()),
});
export type PersonPatch = z.infer<typeof PersonPatchSchema>;
export const PersonAnswerSchema = z.object({ person: PersonSchema });
export type PersonAnswer = z.infer<typeof PersonAnswerSchema>;

/** DELETE /api/people/:id: the person's rows are gone or pseudonymised; what was done, per table. */
export const PersonDeletedSchema = z.object({ deleted: z.looseObject({ id: z.number() }) });

export const AuditEntrySchema = z.object({
  id: z.number(),
  at: isoTime,
  actorId: nullableNumber,
  actorEmail: nullableString,
  action: z.string(),
  targetType: z.string(),
  targetId: nullableString,
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEntry = z.infer<typeof AuditEntrySchema>;
export type AuditFilter = { action?: string; actor?: string; targetType?: string; since?: string; until?: string };
export const AuditResponseSchema = z.object({ entries: z.array(AuditEntrySchema) });
export type AuditResponse = z.infer<typeof AuditResponseSchema>;

export const CaughtMailSchema = z.object({
  id: z.number(),
  receivedAt: isoTime,
  from: nullableString,
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  attachments: z.nullable(z.array(z.object({ filename: nullableString, contentType: z.string(), size: z.number() }))),
});
export type CaughtMail = z.infer<typeof CaughtMailSchema>;
export const MailboxResponseSchema = z.object({ messages: z.array(CaughtMailSchema) });
export type MailboxResponse = z.infer<typeof MailboxResponseSchema>;
