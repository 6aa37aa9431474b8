/**
 * Shapes every feature shares: the roles, the one error body, and the marker for answers
 * that are not JSON (a PDF, a CSV, an HTML page, a redirect or no content at all).
 */
import { z } from 'zod/mini';

export const ROLES = ['admin', 'analyst', 'official'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

export const ApiErrorBodySchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), details: z.optional(z.unknown()) }),
});
/** The one error shape every API failure answers with. */
export type ApiErrorBody = z.infer<typeof ApiErrorBodySchema>;

/** An answer that is not a JSON body: its status and media type (none for 204 and redirects). */
export type OtherAnswer = { status: 204 | 302; mediaType?: undefined } | { status: 200; mediaType: string };

export const NO_CONTENT: OtherAnswer = { status: 204 };
export const REDIRECT: OtherAnswer = { status: 302 };
export const pdfAnswer: OtherAnswer = { status: 200, mediaType: 'application/pdf' };
export const csvAnswer: OtherAnswer = { status: 200, mediaType: 'text/csv' };
export const htmlAnswer: OtherAnswer = { status: 200, mediaType: 'text/html' };

/** ISO 8601 timestamps travel as strings. */
export const isoTime = z.string();
export const nullableNumber = z.nullable(z.number());
export const nullableString = z.nullable(z.string());
