// Web: the root HTML declares the Inter faces (app/+html.tsx, lib/web-fonts.ts) with
// font-display: swap, so text is readable in the system font until Inter arrives; holding
// the page back would only delay content the HTML already has.

/** Always true on web: the page draws at once and the fonts swap in. */
export function useAppFonts(): boolean {
  return true;
}
