/** The demo-mode page that lets a person choose who to sign in as through the stand-in. */
import { DEMO_ACCOUNTS } from '../common/demo-accounts';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function standInPage(): string {
  const rows = DEMO_ACCOUNTS.map(
    (a) => `<li><a class="acct" href="/api/auth/google?login_hint=${encodeURIComponent(a.email)}">
      <strong>${esc(a.name)}</strong><span>${esc(a.email)}</span><em>${a.active ? esc(a.role) : 'deactivated'}</em></a></li>`,
  ).join('\n');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Local sign-in stand-in · Crestwatch</title>
<style>
  body{font-family:system-ui,sans-serif;background:#f4f1ea;color:#1d2a2e;margin:0;padding:24px}
  main{max-width:440px;margin:0 auto}
  h1{font-size:1.3rem;margin:0 0 4px} p{color:#4a5a5e;line-height:1.4}
  ul{list-style:none;padding:0;margin:16px 0}
  li{margin:0 0 10px}
  a.acct{display:grid;grid-template-columns:1fr auto;gap:2px 12px;padding:12px 14px;border:1px solid #c9c2b2;border-radius:10px;background:#fff;color:inherit;text-decoration:none}
  a.acct:focus-visible,a.acct:hover{outline:3px solid #1f6f78;outline-offset:1px}
  a.acct span{grid-column:1;color:#4a5a5e;font-size:.9rem} a.acct em{grid-row:1/3;grid-column:2;align-self:center;font-style:normal;font-size:.85rem;padding:2px 8px;border-radius:99px;background:#e5efe9}
  form{display:flex;gap:8px} input{flex:1;padding:10px;border:1px solid #c9c2b2;border-radius:8px;font:inherit}
  button{padding:10px 14px;border:0;border-radius:8px;background:#1f6f78;color:#fff;font:inherit}
</style></head><body><main>
<h1>Local sign-in stand-in</h1>
<p>This demo runs offline: instead of Google, a local stand-in signs you in as the account you choose. Production uses Google's real sign-in.</p>
<ul>${rows}</ul>
<p>Or sign in as another address (for an invitation you sent):</p>
<form method="get" action="/api/auth/google"><label for="hint" hidden>E-mail address</label>
<input id="hint" name="login_hint" type="email" required placeholder="name@crestwatch.example"><button type="submit">Sign in</button></form>
</main></body></html>`;
}
