/**
 * Logs must not keep secrets that travel in URLs: the unsubscribe `token` and the OAuth
 * `code` and `state`. The request and error logs write a URL through this.
 */

/** Query parameters whose values are secrets, whatever the path. */
export const SECRET_QUERY_NAMES: ReadonlySet<string> = new Set(['token', 'code', 'state']);

/**
 * The path and query with every secret value replaced by `[redacted]`; other parameters
 * and the path stay as sent. Names are compared case-insensitively and after decoding, so
 * `?Token=` or `?%74oken=` is redacted too.
 */
export function redactUrl(url: string): string {
  const q = url.indexOf('?');
  if (q < 0) return url;
  const hash = url.indexOf('#', q);
  const query = url.slice(q + 1, hash < 0 ? undefined : hash);
  const parts = query.split('&').map((pair) => {
    const eq = pair.indexOf('=');
    const rawName = eq < 0 ? pair : pair.slice(0, eq);
    let name = rawName;
    try {
      name = decodeURIComponent(rawName.replace(/\+/g, ' '));
    } catch {
      name = rawName;
    }
    return SECRET_QUERY_NAMES.has(name.trim().toLowerCase()) ? `${rawName}=[redacted]` : pair;
  });
  return `${url.slice(0, q)}?${parts.join('&')}`;
}
