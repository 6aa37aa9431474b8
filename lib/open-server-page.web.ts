// Web: server pages (the sign-in flow) replace the app in the same tab; the server sends
// the browser back to the app when it is done.

/** Leave the app for a page the server renders itself, e.g. `/api/auth/stand-in`. */
export function openServerPage(path: string): void {
  window.location.assign(path);
}
