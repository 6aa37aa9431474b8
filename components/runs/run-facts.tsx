import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { Pill } from '@/components/ui/pill';
import { COVARIANCE_LABEL, formatLevel, levelPercent, STANDING_LABEL } from '@/lib/estimate-words';
import type { Standing } from '@/contracts/estimates';
import { formatDateTime } from '@/lib/format-time';
import type { RunView } from '@/contracts/runs';

import { RUN_STATE, shapeWord, TRIGGER_LABEL } from './run-words';
import { formatCount } from '@/lib/format';

/** What a run is: its state, spec, data version and hash, software, times, and standing counts. */
export function RunFacts({ run }: { run: RunView }) {
  const state = RUN_STATE[run.state];
  const m = run.spec.model;
  const counts = run.standingCounts ? Object.entries(run.standingCounts) : [];
  return (
    <View style={styles.box} testID="run-facts">
      <View style={styles.stateLine}>
        <Pill label={state.label} tone={state.tone} testID="run-state" />
        <Text style={styles.meaning}>{state.meaning}</Text>
      </View>
      {run.state === 'failed' && run.error ? (
        <Text style={styles.error} accessibilityRole="alert">
          {run.error}
        </Text>
      ) : null}
      <View style={styles.facts}>
        <Fact label="Track" value={`${run.track.name} (${run.track.indicator.unit})`} />
        <Fact label="Spec" value={run.spec.name} />
        <Fact
          label="Model"
          value={`${m.transform === 'log' ? 'Log' : 'Level'} ${m.form}, ${COVARIANCE_LABEL[m.covariance] ?? m.covariance} errors, ${levelPercent(m.level)}, α = ${m.alpha}`}
        />
        <Fact label="How it started" value={TRIGGER_LABEL[run.trigger] ?? run.trigger} />
        <Fact label="Queued" value={formatDateTime(run.createdAt)} />
        {run.finishedAt ? <Fact label="Finished" value={formatDateTime(run.finishedAt)} /> : null}
        {run.publishedAt ? <Fact label="Published" value={formatDateTime(run.publishedAt)} /> : null}
        <Fact
          label="Data version"
          value={
            run.dataVersion === null
              ? 'not read yet'
              : `${run.dataVersion}${run.dataHash ? ` · ${run.dataHash.slice(0, 12)}…` : ''}`
          }
        />
        {run.dataRows !== null ? <Fact label="Rows read" value={formatCount(run.dataRows)} /> : null}
        <Fact label="Software" value={run.softwareVersion} />
      </View>
      {run.pooled?.status === 'ok' ? (
        <Text style={styles.line}>
          Regional pooled curve: {shapeWord(run.pooled.shape)}
          {run.pooled.threshold?.level != null ? `, threshold ${formatLevel(run.pooled.threshold.level)}` : ''}
          {run.pooled.districts ? ` over ${run.pooled.districts} districts` : ''}.
        </Text>
      ) : null}
      {counts.length ? (
        <View style={styles.counts} testID="run-standing-counts">
          {counts.map(([k, n]) => (
            <Text key={k} style={styles.count}>
              {STANDING_LABEL[k as Standing] ?? k}: <Text style={styles.countValue}>{n}</Text>
            </Text>
          ))}
        </View>
      ) : null}
      {run.reproduction ? (
        <Text style={styles.line} testID="run-reproduction">
          Reproduces run #{run.reproduction.of}:{' '}
          {run.reproduction.identical
            ? 'identical to the last digit.'
            : `${run.reproduction.differences} estimates differ.`}
          {run.reproduction.softwareChanged
            ? ` Software changed from version ${run.reproduction.originalSoftware} to ${run.softwareVersion}.`
            : ''}
        </Text>
      ) : null}
      {run.reproduction?.changedAnswers?.length ? (
        <View testID="run-reproduction-changes">
          <Text style={styles.line}>Published answers that change ({run.reproduction.changedAnswers.length}):</Text>
          {run.reproduction.changedAnswers.map((c) => (
            <Text key={c.code} style={styles.line}>
              {c.name} ({c.code}): {c.fields.join(', ')}
              {c.before && c.after && c.before.standing !== c.after.standing
                ? ` — ${STANDING_LABEL[c.before.standing as Standing] ?? c.before.standing} → ${STANDING_LABEL[c.after.standing as Standing] ?? c.after.standing}`
                : ''}
              {c.before?.threshold != null && c.after?.threshold != null && c.fields.includes('threshold')
                ? ` — threshold ${formatLevel(c.before.threshold)} → ${formatLevel(c.after.threshold)}`
                : ''}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <Text style={styles.factLabel}>{label}</Text>
      <Text style={styles.factValue}>{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.md,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  stateLine: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  meaning: { ...type.body, color: colors.text, flexShrink: 1 },
  error: { ...type.body, color: colors.danger },
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  fact: { gap: space.xxs, minWidth: 120, flexShrink: 1 },
  factLabel: { ...type.caption, color: colors.textMuted },
  factValue: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  line: { ...type.body, color: colors.textMuted },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  count: { ...type.body, color: colors.textMuted },
  countValue: { fontFamily: type.bodyStrong.fontFamily, color: colors.text },
});
