// Web: the brief on screen with Print and PDF, and a print-only copy rendered straight under
// <body> (a portal), so the printed page holds the brief alone — no header, no navigation,
// no scroll box cutting it at the window's height. The print style sheet keeps blocks
// whole and turns the region table into a real table, whose header row the browser
// repeats on every printed page.
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { ExternalLink } from '@/components/district/external-link';
import { colors, layout, space } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { useHydrated } from '@/hooks/use-hydrated';

import type { BriefFrameProps } from './brief-frame.types';

// react-native-web renders through react-dom; the project carries no react-dom types, so
// the one function used here is typed where it is taken.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { createPortal } = require('react-dom') as {
  createPortal: (children: ReactNode, container: Element) => ReactNode;
};

const PRINT_ID = 'cw-brief-print';

function printCss(paper: 'A4' | 'LETTER'): string {
  return `
@media screen { #${PRINT_ID} { display: none; } }
@media print {
  @page { size: ${paper === 'LETTER' ? 'letter' : 'A4'}; margin: 14mm 13mm 16mm; }
  html, body { height: auto !important; overflow: visible !important; background: #fff !important; }
  body > *:not(#${PRINT_ID}) { display: none !important; }
  #${PRINT_ID} { display: block !important; }
  #${PRINT_ID} * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  [data-brief-block="keep"] { break-inside: avoid; }
  [data-brief-table="table"] { display: table !important; width: 100%; border-collapse: collapse; }
  [data-brief-table="thead"] { display: table-header-group !important; }
  [data-brief-table="tbody"] { display: table-row-group !important; }
  [data-brief-table="tr"] { display: table-row !important; break-inside: avoid; }
  [data-brief-table="td"] { display: table-cell !important; }
}`;
}

export function BriefFrame({ pdfPath, what, paperSize, back, children }: BriefFrameProps) {
  // The portal needs the document: rendered once hydrated (the static page has only the screen copy).
  const host = useHydrated();
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} testID="brief-frame">
      <style>{printCss(paperSize)}</style>
      <View style={styles.column}>
        {/* The links name the district from the URL, which the static page (one template for
            every code) cannot know: they appear once mounted, never hydrated with a stale href. */}
        <View style={styles.toolbar}>
          {host ? (
            <>
              {back}
              <View style={styles.actions}>
                <Button
                  label="Print"
                  onPress={() => window.print()}
                  accessibilityHint="Prints this brief as it is shown"
                  testID="brief-print"
                />
                <ExternalLink
                  path={pdfPath}
                  label="Open the PDF"
                  accessibilityLabel={`Open the PDF: the ${what}`}
                  testID="brief-pdf-link"
                />
              </View>
            </>
          ) : null}
        </View>
        <View style={styles.sheet}>{children}</View>
      </View>
      {host
        ? createPortal(
            <div id={PRINT_ID}>
              <View style={styles.printSheet}>{children}</View>
            </div>,
            document.body,
          )
        : null}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: layout.detailMaxWidth, gap: space.md },
  toolbar: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.sm,
    minHeight: layout.touchTarget,
  },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  sheet: { backgroundColor: colors.surface, borderRadius: 8, padding: space.lg },
  printSheet: { backgroundColor: colors.surface },
});
