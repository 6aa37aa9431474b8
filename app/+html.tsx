// The root HTML of every exported web page (static rendering; runs in Node at build time,
// never in the browser). Beyond Expo's own template it declares the Inter faces per script
// subset with unicode-range (lib/web-fonts.ts), and links the web app manifest and icons
// the web build writes (scripts/web-offline/).
import { ScrollViewStyleReset, useServerDocumentContext } from 'expo-router/html';
import type { ReactNode } from 'react';

import { colors } from '@/components/theme';
import { webFontFaceCss } from '@/lib/web-fonts';

const FONT_FACES = webFontFaceCss();

export default function Root({ children }: { children: ReactNode }) {
  const { bodyAttributes, bodyNodes, htmlAttributes, headNodes } = useServerDocumentContext();
  return (
    <html lang="en" {...htmlAttributes}>
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, shrink-to-fit=no" />
        <meta name="theme-color" content={colors.headerBackground} />
        <link rel="manifest" href="/manifest.webmanifest" />
        <link rel="apple-touch-icon" href="/icons/icon-192.png" />
        <ScrollViewStyleReset />
        <style id="crestwatch-fonts" dangerouslySetInnerHTML={{ __html: FONT_FACES }} />
        {headNodes}
      </head>
      <body {...bodyAttributes}>
        {children}
        {bodyNodes}
      </body>
    </html>
  );
}
