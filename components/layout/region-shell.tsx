import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { colors, layout } from '@/components/theme';
import type { LayoutMode } from '@/hooks/use-layout-mode';

export type RegionShellProps = {
  mode: LayoutMode;
  header: ReactNode;
  /** The region list, shown as a left column in the wide layout only; null for none. */
  list: ReactNode | null;
  /** The caller's alerts, a third column at ≥ 1440 px (wide layout only); null for none. */
  aside?: ReactNode | null;
  /** The current route. */
  children: ReactNode;
};

/**
 * Frame around every route. Phone: the header, then the route full width (the home route
 * is the list itself). Wide: the list stays mounted in a left column while routes change on
 * the right, so its search and scroll position survive opening districts.
 */
export function RegionShell({ mode, header, list, aside = null, children }: RegionShellProps) {
  return (
    <View style={styles.screen}>
      {header}
      {mode === 'wide' && list !== null ? (
        <View style={styles.columns}>
          <View style={styles.listColumn} role="navigation" aria-label="Districts">
            {list}
          </View>
          <View style={styles.detailColumn} role="main">
            {children}
          </View>
          {aside !== null ? (
            <View style={styles.asideColumn} role="complementary" aria-label="Your alerts">
              {aside}
            </View>
          ) : null}
        </View>
      ) : (
        <View style={styles.single} role="main">
          {children}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  screen: { flex: 1, backgroundColor: colors.background },
  columns: { flex: 1, flexDirection: 'row' },
  listColumn: {
    width: layout.listColumnWidth,
    borderRightWidth: 1,
    borderRightColor: colors.border,
  },
  detailColumn: { flex: 1, minWidth: 0 },
  asideColumn: {
    width: layout.alertsColumnWidth,
    borderLeftWidth: 1,
    borderLeftColor: colors.border,
  },
  single: { flex: 1 },
});
