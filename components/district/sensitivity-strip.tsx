import { StyleSheet, Text, View } from 'react-native';

import { chartColors, colors, radius, space, type } from '@/components/theme';
import type { EstimateRecord, VariantSummary } from '@/contracts/estimates';
import { textSize } from '@/lib/text-size';
import { formatLevel, levelPercent } from '@/lib/estimate-words';
import { sensitivityRows, stripDomain, stripPosition, type SensitivityRow } from '@/lib/sensitivity';

export type SensitivityStripProps = { main: EstimateRecord; variants: VariantSummary[] };

/**
 * The threshold under the published spec and its variants (without controls, cubic, last
 * 20 years only, level form), each with its interval on one shared log scale, and today's
 * income as a thin line: how far the number moves when the model does.
 */
export function SensitivityStrip({ main, variants }: SensitivityStripProps) {
  const rows = sensitivityRows(main, variants);
  const now = main.range?.levelNow ?? null;
  const domain = stripDomain(rows, now);
  return (
    <View style={styles.wrap} testID="sensitivity-strip">
      <Text style={styles.intro}>
        Threshold (income per person) under other specifications, with {levelPercent(main.model.level)} intervals.
        {now !== null ? ` The amber line is today’s income (${formatLevel(now)}).` : ''}
      </Text>
      {rows.map((row) => (
        <StripRow key={row.key} row={row} domain={domain} now={now} />
      ))}
      {domain ? (
        <View style={styles.scale} aria-hidden>
          <Text style={styles.scaleText}>{formatLevel(domain[0])}</Text>
          <Text style={styles.scaleText}>log scale</Text>
          <Text style={styles.scaleText}>{formatLevel(domain[1])}</Text>
        </View>
      ) : null}
    </View>
  );
}

function StripRow({ row, domain, now }: { row: SensitivityRow; domain: [number, number] | null; now: number | null }) {
  const has = domain !== null && row.threshold !== null && row.threshold > 0;
  const pct = (v: number) => `${(stripPosition(v, domain!) * 100).toFixed(2)}%`;
  return (
    <View
      style={styles.row}
      testID={`sensitivity-${row.key}`}
      accessible
      accessibilityLabel={`${row.label}: ${row.text}`}
    >
      <Text style={[styles.label, row.key === 'main' && styles.mainLabel]}>{row.label}</Text>
      <View style={styles.track} aria-hidden>
        <View style={styles.axis} />
        {has && row.bounded && row.lo !== null && row.hi !== null ? (
          <View
            testID={`sensitivity-band-${row.key}`}
            style={[
              styles.band,
              {
                left: pct(row.lo) as `${number}%`,
                width:
                  `${Math.max(1, (stripPosition(row.hi, domain!) - stripPosition(row.lo, domain!)) * 100).toFixed(2)}%` as `${number}%`,
              },
            ]}
          />
        ) : null}
        {has && !row.bounded ? <View style={styles.unbounded} testID={`sensitivity-unbounded-${row.key}`} /> : null}
        {domain && now !== null ? <View style={[styles.now, { left: pct(now) as `${number}%` }]} /> : null}
        {has ? <View style={[styles.point, { left: pct(row.threshold!) as `${number}%` }]} /> : null}
      </View>
      <Text style={styles.value}>{row.text}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  intro: { ...type.caption, color: colors.textMuted },
  row: { gap: space.xxs },
  label: { ...type.label, color: colors.text },
  mainLabel: { color: colors.link },
  track: { height: 22, justifyContent: 'center' },
  axis: { position: 'absolute', left: 0, right: 0, height: 1, backgroundColor: colors.border },
  band: {
    position: 'absolute',
    height: 14,
    backgroundColor: chartColors.band,
    borderColor: chartColors.threshold,
    borderLeftWidth: 2,
    borderRightWidth: 2,
    borderRadius: radius.sm,
  },
  unbounded: {
    position: 'absolute',
    left: 0,
    right: 0,
    height: 0,
    borderTopWidth: 2,
    borderStyle: 'dashed',
    borderColor: chartColors.threshold,
  },
  now: { position: 'absolute', width: 2, height: 22, marginLeft: -1, backgroundColor: chartColors.latest },
  point: {
    position: 'absolute',
    width: 10,
    height: 10,
    marginLeft: -5,
    backgroundColor: chartColors.threshold,
    transform: [{ rotate: '45deg' }],
  },
  value: { ...type.numeric, fontSize: textSize(13), color: colors.text },
  scale: { flexDirection: 'row', justifyContent: 'space-between' },
  scaleText: { ...type.caption, color: colors.textMuted },
});
