import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import type { EstimateRecord, PublishedRunMeta } from '@/contracts/estimates';
import {
  formatLevel,
  gapWords,
  intervalText,
  levelPercent,
  METHOD_LABEL,
  notBoundedText,
  yearWithRange,
} from '@/lib/estimate-words';
import { modelLine, runLine } from '@/lib/model-line';
import { runUnits, UNKNOWN_UNITS } from '@/lib/units';

/** Threshold with both intervals, income now and its gap, elasticity now, projected crossing; the model line. */
export function KeyFigures({ record, run }: { record: EstimateRecord; run: PublishedRunMeta | null }) {
  const t = record.threshold;
  const level = record.model.level;
  const pct = levelPercent(level);
  const used = record.standing.intervalMethod;
  const threshold = t?.level !== null && t?.level !== undefined && t.level > 0 ? t.level : null;
  const fieller = t
    ? t.fieller.kind === 'bounded'
      ? intervalText('bounded', t.fieller.levelLo, t.fieller.levelHi)
      : `${notBoundedText(level)} (${intervalText(t.fieller.kind, t.fieller.levelLo, t.fieller.levelHi)})`
    : null;
  const delta = t
    ? t.delta.levelLo !== null && t.delta.levelHi !== null
      ? intervalText('bounded', t.delta.levelLo, t.delta.levelHi)
      : 'not available'
    : null;
  const e = record.elasticity;
  const now = record.range;
  const p = record.projection;
  const u = runUnits(run);
  const incomeUnit = u.incomeUnit ? <Text style={styles.line}>{u.incomeUnit}</Text> : null;
  return (
    <View style={styles.wrap} testID="key-figures">
      <View style={styles.grid}>
        <Figure title="Threshold" testID="figure-threshold">
          <Text style={styles.big}>{threshold !== null ? formatLevel(threshold) : 'none'}</Text>
          {threshold !== null ? incomeUnit : null}
          {t && fieller ? (
            <>
              <Text style={styles.line}>
                Fieller {pct}: {fieller}
                {used === 'fieller' ? ' — sets the standing' : ''}
              </Text>
              <Text style={styles.line}>
                Delta method {pct}: {delta}
                {used === 'delta' ? ' — sets the standing' : ''}
              </Text>
            </>
          ) : (
            <Text style={styles.line}>No turning point in this fit.</Text>
          )}
          {t?.extrapolated ? <Text style={styles.flag}>Turn beyond observed range</Text> : null}
        </Figure>
        <Figure title="Income now" testID="figure-now">
          <Text style={styles.big}>
            {now ? `${formatLevel(now.levelNow)}${record.lastYear ? ` (${record.lastYear})` : ''}` : '—'}
          </Text>
          {now ? incomeUnit : null}
          <Text style={styles.line}>
            {record.gapPercent !== null && threshold !== null
              ? `${capital(gapWords(record.gapPercent))} the threshold`
              : 'No gap without a threshold'}
          </Text>
        </Figure>
        <Figure title="Elasticity now" testID="figure-elasticity">
          <Text style={styles.big}>{e?.value !== null && e?.value !== undefined ? signed(e.value) : '—'}</Text>
          {e?.value !== null && e?.value !== undefined ? (
            <>
              {e.lo !== null && e.hi !== null ? (
                <Text style={styles.line}>
                  {pct}: {signed(e.lo)} to {signed(e.hi)}
                </Text>
              ) : null}
              <Text style={styles.line}>
                1% more income goes with about {Math.abs(e.value).toFixed(2)}% {e.value >= 0 ? 'more' : 'less'}{' '}
                {u.emissionsName === UNKNOWN_UNITS.emissionsName ? 'emissions' : u.emissionsName} today.
              </Text>
            </>
          ) : null}
        </Figure>
        <Figure title="Projected crossing" testID="figure-crossing">
          <Text style={styles.big}>{crossingBig(p)}</Text>
          <Text style={styles.line}>{crossingLine(p, record)}</Text>
        </Figure>
      </View>
      <Text style={styles.model} testID="model-line">
        <Text style={styles.modelTerm}>Model: </Text>
        {modelLine(record)}
        {` · interval for the standing: ${METHOD_LABEL[used]}`}
      </Text>
      {run ? <Text style={styles.model}>{runLine(run)}</Text> : null}
    </View>
  );
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const signed = (v: number) => `${v < 0 ? '−' : v > 0 ? '+' : ''}${Math.abs(v).toFixed(2)}`;

function crossingBig(p: EstimateRecord['projection']): string {
  if (!p || p.status === 'no_threshold') return '—';
  if (p.status === 'not_on_current_trend') return 'Not on current trend';
  if (p.crossingYear === null) return '—';
  return yearWithRange(p.crossingYear, p.earliest, p.latest);
}

function crossingLine(p: EstimateRecord['projection'], r: EstimateRecord): string {
  const trend =
    r.trendPerYear !== null ? ` Income trend ${((Math.exp(r.trendPerYear) - 1) * 100).toFixed(1)}% a year.` : '';
  if (!p || p.status === 'no_threshold') return 'No positive threshold to reach.';
  if (p.status === 'not_on_current_trend') return `At the recent trend income does not reach the threshold.${trend}`;
  if (p.status === 'already_past') return `Income passed it around then (back-projected).${trend}`;
  const open = p.earliest === null || p.latest === null ? ' The range is open: the interval is not bounded.' : '';
  return `If the recent trend holds.${trend}${open}`;
}

function Figure({ title, testID, children }: { title: string; testID: string; children: React.ReactNode }) {
  return (
    <View style={styles.figure} testID={testID}>
      <Text style={styles.title}>{title}</Text>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  figure: {
    flexGrow: 1,
    flexBasis: 300,
    minWidth: 0,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.xxs,
  },
  title: { ...type.label, color: colors.textMuted },
  big: { ...type.title, color: colors.text },
  line: { ...type.caption, color: colors.text },
  flag: { ...type.label, color: colors.danger },
  model: { ...type.caption, color: colors.textMuted },
  modelTerm: { fontFamily: type.label.fontFamily, color: colors.text },
});
