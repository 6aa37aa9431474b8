import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { TextField } from '@/components/form/text-field';
import { cellText, DataTable, type Column } from '@/components/table/data-table';
import { colors, space, type } from '@/components/theme';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { formatLevel } from '@/lib/estimate-words';
import type { ReviewRow } from '@/contracts/runs';

import {
  matchesReviewFilter,
  matchesReviewSearch,
  percentShort,
  REVIEW_FILTERS,
  shapeWord,
  standingWord,
  type ReviewFilter,
} from './run-words';

export type ReviewTableProps = {
  runId: number;
  rows: ReviewRow[];
  /** The run compared with; null when nothing was published before. */
  previousRunId: number | null;
  /** The admin's threshold-shift percent: a bigger move counts as "threshold moved". */
  shiftPercent: number;
  selectedCode: string | null;
  /** The driver's unit from the catalogue, under the threshold header. */
  incomeUnit?: string;
};

function Changed({ on, label }: { on: boolean; label: string }) {
  return on ? <Pill label={label} tone="warning" /> : null;
}

/** Per district: this run against the last published one; filter by what changed, sort any column. */
export function ReviewTable({ runId, rows, previousRunId, shiftPercent, selectedCode, incomeUnit }: ReviewTableProps) {
  const [filter, setFilter] = useState<ReviewFilter>('all');
  const [query, setQuery] = useState('');
  const shown = useMemo(
    () => rows.filter((r) => matchesReviewFilter(r, filter, shiftPercent) && matchesReviewSearch(r, query)),
    [rows, filter, query, shiftPercent],
  );
  const changedCount = rows.filter((r) => matchesReviewFilter(r, 'changed', shiftPercent)).length;

  const columns: Column<ReviewRow>[] = [
    {
      key: 'district',
      header: 'District',
      flex: 2,
      render: (r) => (
        <View style={styles.stack}>
          <TextLink
            href={{ pathname: '/runs/[id]', params: { id: String(runId), district: r.code } }}
            label={r.name}
            accessibilityLabel={`${r.name} (${r.code}): open its review`}
          />
          <Text style={cellText.muted}>
            {r.code}
            {r.note ? ' · has a note' : ''}
            {r.status === 'substitute' ? ' · regional curve stands in' : ''}
          </Text>
        </View>
      ),
      sortValue: (r) => r.code,
    },
    {
      key: 'standing',
      header: 'Standing',
      subheader: previousRunId ? 'before → now' : 'now',
      flex: 1.8,
      render: (r) => (
        <View style={styles.stack}>
          <Text style={r.change.standingChanged ? cellText.strong : cellText.value}>
            {r.previous && r.change.standingChanged ? `${standingWord(r.previous.standing)} → ` : ''}
            {standingWord(r.standing)}
          </Text>
          <Changed on={r.change.standingChanged} label="moved" />
        </View>
      ),
      sortValue: (r) => Number(r.change.standingChanged) * -1,
    },
    {
      key: 'threshold',
      header: 'Threshold',
      subheader: incomeUnit ?? 'income',
      flex: 1.2,
      align: 'right',
      render: (r) => (r.threshold === null ? '—' : formatLevel(r.threshold)),
      sortValue: (r) => r.threshold,
    },
    {
      key: 'move',
      header: 'Moved',
      subheader: 'vs published',
      width: 96,
      align: 'right',
      render: (r) => (
        <Text
          style={
            r.change.thresholdPercent !== null && Math.abs(r.change.thresholdPercent) > shiftPercent
              ? cellText.strong
              : cellText.value
          }
        >
          {percentShort(r.change.thresholdPercent)}
        </Text>
      ),
      sortValue: (r) => (r.change.thresholdPercent === null ? null : -Math.abs(r.change.thresholdPercent)),
    },
    {
      key: 'shape',
      header: 'Shape',
      flex: 1.4,
      render: (r) => (
        <View style={styles.stack}>
          <Text style={cellText.value}>
            {r.previous && r.change.shapeChanged ? `${shapeWord(r.previous.shape)} → ` : ''}
            {shapeWord(r.shape)}
          </Text>
          <Changed on={r.change.shapeChanged} label="changed" />
        </View>
      ),
      sortValue: (r) => Number(r.change.shapeChanged) * -1,
    },
    {
      key: 'test',
      header: 'Turn test',
      subheader: 'U-test at α',
      flex: 1.2,
      render: (r) => (
        <View style={styles.stack}>
          <Text style={cellText.value}>
            {r.uTestRejects === null ? '—' : r.uTestRejects ? 'confirms a turn' : 'no turn shown'}
          </Text>
          <Changed on={r.change.significanceChanged} label="flipped" />
        </View>
      ),
      sortValue: (r) => Number(r.change.significanceChanged) * -1,
    },
  ];

  return (
    <View style={styles.wrap} testID="review">
      <Text style={styles.lead}>
        {previousRunId
          ? `Compared with published run #${previousRunId}: ${changedCount} of ${rows.length} districts changed (a threshold counts as moved beyond ${shiftPercent}%).`
          : `Nothing has been published before, so there is nothing to compare with: ${rows.length} districts fitted.`}
      </Text>
      <View style={styles.controls}>
        <ChoiceGroup label="Show" choices={REVIEW_FILTERS} value={filter} onChange={setFilter} testID="review-filter" />
        <View style={styles.search}>
          <TextField
            label="Find a district"
            value={query}
            onChangeText={setQuery}
            placeholder="Name or code"
            testID="review-search"
          />
        </View>
      </View>
      <Text style={styles.count} accessibilityLiveRegion="polite" testID="review-count">
        {shown.length === rows.length ? `${rows.length} districts` : `${shown.length} of ${rows.length} districts`}
      </Text>
      {shown.length ? (
        <DataTable
          label="Per-district changes in this run"
          columns={columns}
          rows={shown}
          rowKey={(r) => r.code}
          selectedKey={selectedCode}
          minWidth={680}
          initialSort={{ key: 'district', direction: 'asc' }}
          rowTestID={(r) => `review-row-${r.code}`}
          cardTitle={(r) => r.name}
          testID="review-table"
        />
      ) : (
        <Text style={styles.lead}>No district matches. Choose “All districts” or clear the search.</Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  lead: { ...type.body, color: colors.text },
  controls: { gap: space.md },
  search: { maxWidth: 360 },
  count: { ...type.caption, color: colors.textMuted },
  stack: { gap: space.xxs, alignItems: 'flex-start', minWidth: 0 },
});
