/**
 * Shapes every feature shares: the roles, the one error body, and the markers for answers
 * without a JSON body (no content, a redirect).
 */
import * as z from './kit';

export const ROLES = ['admin', 'analyst', 'official'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

export const ApiErrorBodySchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), details: z.optional(z.unknown()) }),
});
/** The one error shape every API failure answers with. */
export type ApiErrorBody = z.infer<typeof ApiErrorBodySchema>;

/** A route that answers 204 with no body. */
export const NO_CONTENT = { noContent: true } as const;
/** A route that answers by sending the browser elsewhere (sign-in with Google and its callback). */
export const REDIRECT = { redirect: true } as const;

/** ISO 8601 timestamps travel as strings. */
export const isoTime = z.string();
export const nullableNumber = z.nullable(z.number());
export const nullableString = z.nullable(z.string());

/** GET /api/openapi.json: this API described as OpenAPI 3.1. */
export const OpenApiDocumentSchema = z.looseObject({
  openapi: z.string(),
  info: z.object({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.record(z.string(), z.unknown())),
});
