import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { Pill } from '@/components/ui/pill';
import type { Diagnostics } from '@/contracts/runs';

type Line = { key: string; test: string; stat: string; p: number | null; flagged: string };

const f = (v: number | null | undefined, digits = 2) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits);
const pText = (p: number | null) => (p === null ? 'p —' : p < 0.001 ? 'p < 0.001' : `p = ${p.toFixed(3)}`);

/** The residual checks of a district fit, each with its statistic, p-value and what a small p means. */
export function DiagnosticsList({ diagnostics, alpha }: { diagnostics: Diagnostics; alpha: number }) {
  const bg = diagnostics.breuschGodfrey[0];
  const lines: Line[] = [
    {
      key: 'dw',
      test: 'Durbin–Watson',
      stat: `d = ${f(diagnostics.durbinWatson.statistic)}`,
      p: diagnostics.durbinWatson.pValue,
      flagged: 'serial correlation',
    },
    ...(bg
      ? [
          {
            key: 'bg',
            test: `Breusch–Godfrey (order ${bg.order})`,
            stat: `LM = ${f(bg.statistic)}`,
            p: bg.pValue,
            flagged: 'serial correlation',
          },
        ]
      : []),
    {
      key: 'bp',
      test: 'Breusch–Pagan',
      stat: `LM = ${f(diagnostics.breuschPagan.statistic)}`,
      p: diagnostics.breuschPagan.pValue,
      flagged: 'changing variance',
    },
    {
      key: 'jb',
      test: 'Jarque–Bera',
      stat: `JB = ${f(diagnostics.jarqueBera.statistic)}`,
      p: diagnostics.jarqueBera.pValue,
      flagged: 'non-normal residuals',
    },
  ];
  return (
    <View style={styles.wrap} testID="diagnostics">
      {lines.map((l) => {
        const hit = l.p !== null && l.p < alpha;
        return (
          <View key={l.key} style={styles.row}>
            <View style={styles.name}>
              <Text style={styles.test}>{l.test}</Text>
              <Text style={styles.stat}>
                {l.stat}, {pText(l.p)}
              </Text>
            </View>
            {hit ? (
              <Pill label={`Sign of ${l.flagged}`} tone="warning" />
            ) : (
              <Pill label="No sign at α" tone="neutral" />
            )}
          </View>
        );
      })}
      {diagnostics.largestLeverage ? (
        <Text style={styles.stat}>
          Most influential year: {diagnostics.largestLeverage.year} (leverage {f(diagnostics.largestLeverage.value, 3)}
          ).
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  name: { flexShrink: 1, gap: space.xxs },
  test: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  stat: { ...type.caption, fontVariant: ['tabular-nums'], color: colors.textMuted },
});
