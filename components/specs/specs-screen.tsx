import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { Page } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, layout, radius, space, type } from '@/components/theme';
import { Pill } from '@/components/ui/pill';
import { TextLink } from '@/components/ui/text-link';
import { COVARIANCE_LABEL } from '@/lib/estimate-words';
import type { CatalogueIndicator, SavedSpec, SpecInput, SpecsResponse } from '@/contracts/settings';
import type { Track } from '@/contracts/tracks';

import { SpecEditor } from './spec-editor';
import { TrackSpecs } from './track-specs';

export type SpecsScreenProps = {
  specs: QueryState<SpecsResponse>;
  indicators: QueryState<CatalogueIndicator[]>;
  /** 'new', a spec id, or null (the list alone on a phone). */
  selected: 'new' | number | null;
  wide: boolean;
  onSave: (id: number | null, input: SpecInput) => Promise<SavedSpec>;
  onArchive: (spec: SavedSpec) => Promise<unknown>;
  onSaved: (spec: SavedSpec) => void;
  /** Said above the list after a spec was archived (it leaves the list). */
  notice?: string | null;
  /** The tracks, each naming the spec its next run uses (staff change it here). */
  tracks?: QueryState<Track[]>;
  onChangeTrackSpec?: (code: string, specId: number) => Promise<unknown>;
};

export function specLine(s: SavedSpec): string {
  const controls = s.controls.length ? `controls ${s.controls.join(', ')}` : 'no controls';
  return `${s.transform === 'log' ? 'Log' : 'Level'} ${s.form} in ${s.driverIndicator}, ${controls}, ${COVARIANCE_LABEL[s.covariance] ?? s.covariance} errors`;
}

/** The saved specs (those a track uses first) and the editor for one; side by side when wide. */
export function SpecsScreen({
  specs,
  indicators,
  selected,
  wide,
  onSave,
  onArchive,
  onSaved,
  notice,
  tracks,
  onChangeTrackSpec,
}: SpecsScreenProps) {
  const usedBy = new Map<number, string[]>();
  for (const t of tracks?.data ?? [])
    if (t.state !== 'archived') usedBy.set(t.specId, [...(usedBy.get(t.specId) ?? []), t.name]);
  const list = (
    <View style={styles.stack}>
      {notice ? <MutationNotice success={notice} testID="specs-notice" /> : null}
      {tracks && onChangeTrackSpec ? (
        <TrackSpecs tracks={tracks} specs={specs.data?.specs ?? []} onChangeSpec={onChangeTrackSpec} />
      ) : null}
      <SpecList specs={specs} selected={selected} usedBy={usedBy} />
    </View>
  );
  let editor = null;
  if (selected !== null) {
    if (specs.status === 'pending' || indicators.status === 'pending') editor = <Skeleton width="100%" height={400} />;
    else if (indicators.status === 'error' || !indicators.data)
      editor = (
        <QueryErrorPanel
          what="the indicator catalogue"
          error={indicators.error}
          retrying={indicators.isFetching}
          onRetry={() => void indicators.refetch()}
        />
      );
    else {
      const spec = selected === 'new' ? null : (specs.data?.specs.find((s) => s.id === selected) ?? null);
      editor =
        selected !== 'new' && !spec ? (
          <StatePanel
            testID="spec-not-found"
            title={`No spec #${selected}`}
            message="It may have been archived or mistyped."
          >
            <TextLink href="/specs" label="All specs" />
          </StatePanel>
        ) : (
          <SpecEditor
            spec={spec}
            indicators={indicators.data}
            onSave={(input) => onSave(spec?.id ?? null, input)}
            onArchive={spec && !spec.archived && !usedBy.get(spec.id)?.length ? () => onArchive(spec) : null}
            onSaved={onSaved}
          />
        );
    }
  }
  return (
    <Page
      title="Model specs"
      intro="A spec names the series and the model every district is fitted with. Runs record the spec they used, so changing one never rewrites a past run."
      actions={<TextLink href={{ pathname: '/specs/[id]', params: { id: 'new' } }} label="New spec" leading="+ " />}
      testID="specs-screen"
    >
      {wide ? (
        <View style={styles.split}>
          <View style={styles.listColumn}>{list}</View>
          <View style={styles.editorColumn}>
            {editor ?? <Text style={styles.hint}>Choose a spec to edit it, or start a new one.</Text>}
          </View>
        </View>
      ) : selected !== null ? (
        <View style={styles.stack}>
          <TextLink href="/specs" label="All specs" leading="← " />
          {editor}
        </View>
      ) : (
        list
      )}
    </Page>
  );
}

function SpecList({
  specs,
  selected,
  usedBy,
}: {
  specs: QueryState<SpecsResponse>;
  selected: 'new' | number | null;
  usedBy: Map<number, string[]>;
}) {
  if (specs.status === 'pending') return <Skeleton width="100%" height={160} />;
  if (specs.status === 'error' || !specs.data)
    return (
      <QueryErrorPanel
        what="the specs"
        error={specs.error}
        retrying={specs.isFetching}
        onRetry={() => void specs.refetch()}
        testID="specs-error"
      />
    );
  const used = (id: number) => Number(Boolean(usedBy.get(id)?.length));
  const rows = [...specs.data.specs].sort((a, b) => used(b.id) - used(a.id) || a.name.localeCompare(b.name));
  if (!rows.length)
    return <StatePanel testID="specs-empty" title="No saved specs" message="Start one with “New spec”." />;
  return (
    <View style={styles.list} testID="specs-list">
      {rows.map((s) => (
        <View key={s.id} style={[styles.item, selected === s.id && styles.itemSelected]} testID={`spec-row-${s.id}`}>
          <View style={styles.itemHead}>
            <TextLink href={{ pathname: '/specs/[id]', params: { id: String(s.id) } }} label={s.name} />
            {s.id === specs.data?.headlineSpecId ? <Pill label="Headline track’s spec" tone="info" /> : null}
            {s.archived ? <Pill label="Archived" tone="neutral" /> : null}
          </View>
          <Text style={styles.itemLine}>{specLine(s)}</Text>
          {usedBy.get(s.id) ? (
            <Text style={styles.itemLine} testID={`spec-row-${s.id}-tracks`}>
              Used by {usedBy.get(s.id)!.join(', ')}
            </Text>
          ) : null}
          {s.description ? <Text style={styles.itemLine}>{s.description}</Text> : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  split: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xl },
  listColumn: { width: layout.sidePanelWidth },
  editorColumn: { flex: 1, minWidth: 0 },
  stack: { gap: space.md },
  hint: { ...type.body, color: colors.textMuted },
  list: { gap: space.sm },
  item: {
    gap: space.xxs,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  itemSelected: { backgroundColor: colors.selected, borderColor: colors.selectedRule },
  itemHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  itemLine: { ...type.caption, color: colors.textMuted },
});
