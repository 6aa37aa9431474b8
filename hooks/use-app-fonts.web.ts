// Web: useFonts registers the @font-face rules — in the pre-rendered HTML (with preload
// links) and again in the browser. The faces use font-display: swap, so text is readable
// in the system font until Inter arrives; holding the page back would only delay content
// the HTML already has, and would not match it while hydrating.
import { useFonts } from 'expo-font';
import { useEffect } from 'react';

import { fontSources } from '@/lib/font-sources';

/** Always true on web: the page draws at once and the fonts swap in. */
export function useAppFonts(): boolean {
  const [, error] = useFonts(fontSources);
  useEffect(() => {
    if (error) console.warn('Crestwatch: fonts failed to load, using the system font.', error);
  }, [error]);
  return true;
}
