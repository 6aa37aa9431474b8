// Native: type sizes stay numbers; iOS and Android scale them by the system text size
// themselves (allowFontScaling is on by default).

/** A type size from the scale, in the unit this platform scales with the reader's setting. */
export function textSize(px: number): number {
  return px;
}
