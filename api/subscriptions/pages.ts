/** The plain pages behind the unsubscribe link: a confirm page and its answer. */
const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(title)} · Crestwatch</title>
<style>body{font-family:system-ui,sans-serif;background:#f4f1ea;color:#1d2a2e;margin:0;padding:24px}main{max-width:440px;margin:0 auto}
button{padding:10px 16px;border:0;border-radius:8px;background:#1f6f78;color:#fff;font:inherit}a{color:#1f6f78}</style></head>
<body><main><h1>${esc(title)}</h1>${body}</main></body></html>`;
}

export function confirmPage(token: string): string {
  return page(
    'Stop these alert e-mails?',
    `<p>Confirm to remove this alert subscription. You can subscribe again from the app at any time.</p>
<form method="post" action="/api/subscriptions/unsubscribe"><input type="hidden" name="token" value="${esc(token)}">
<button type="submit">Unsubscribe</button></form>`,
  );
}

export function resultPage(ok: boolean, message: string): string {
  return page(ok ? 'Unsubscribed' : 'Link not valid', `<p>${esc(message)}</p><p><a href="/">Open Crestwatch</a></p>`);
}
