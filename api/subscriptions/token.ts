/**
 * Signed, expiring unsubscribe tokens for the link in each e-mail:
 * base64url(subscriptionId.expiresAtSeconds).HMAC-SHA256 with the session secret.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';

const DAY = 24 * 60 * 60;

export function unsubscribeToken(
  secret: string,
  subscriptionId: number,
  nowSeconds = Math.floor(Date.now() / 1000),
  ttlDays = 60,
): string {
  const payload = Buffer.from(`${subscriptionId}.${nowSeconds + ttlDays * DAY}`).toString('base64url');
  const mac = createHmac('sha256', secret).update(`unsubscribe:${payload}`).digest('base64url');
  return `${payload}.${mac}`;
}

export type TokenCheck =
  { ok: true; subscriptionId: number } | { ok: false; reason: 'malformed' | 'bad_signature' | 'expired' };

export function checkUnsubscribeToken(
  secret: string,
  token: string,
  nowSeconds = Math.floor(Date.now() / 1000),
): TokenCheck {
  const [payload, mac] = token.split('.');
  if (!payload || !mac) return { ok: false, reason: 'malformed' };
  const expected = createHmac('sha256', secret).update(`unsubscribe:${payload}`).digest();
  const given = Buffer.from(mac, 'base64url');
  if (given.length !== expected.length || !timingSafeEqual(given, expected))
    return { ok: false, reason: 'bad_signature' };
  const [id, exp] = Buffer.from(payload, 'base64url').toString().split('.').map(Number);
  if (!Number.isInteger(id) || !Number.isInteger(exp)) return { ok: false, reason: 'malformed' };
  if (exp < nowSeconds) return { ok: false, reason: 'expired' };
  return { ok: true, subscriptionId: id };
}
