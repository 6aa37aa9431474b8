// The tracks section of the settings screen: every track with its state; admins create,
// rename, pause, resume and archive tracks and choose the headline one.
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { Section } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { Pill } from '@/components/ui/pill';
import { isTrackCode, TRACK_CODE_RULE } from '@/contracts/patterns';
import type { SavedSpec } from '@/contracts/settings';
import type { Track, TrackCreateInput, TrackPatchInput } from '@/contracts/tracks';

export type TracksAdminProps = {
  tracks: QueryState<Track[]>;
  specs: SavedSpec[];
  /** null: read only (analysts see the tracks, admins change them) */
  onCreate: ((input: TrackCreateInput) => Promise<unknown>) | null;
  onPatch: ((code: string, patch: TrackPatchInput) => Promise<unknown>) | null;
};

const STATE_WORD = {
  active: 'Active',
  paused: 'Paused: no scheduled runs',
  archived: 'Archived: off officials’ screens',
};

export function TracksAdmin({ tracks, specs, onCreate, onPatch }: TracksAdminProps) {
  return (
    <Section title="Tracks">
      <Text style={styles.intro}>
        A track is one watched indicator with the spec its runs use. The headline track opens first for officials. A
        paused track keeps its published standings but gets no scheduled runs; an archived one leaves officials’ screens
        and its subscriptions stop (its history is kept).
      </Text>
      {tracks.status === 'pending' ? (
        <Skeleton width="100%" height={160} />
      ) : tracks.status === 'error' || !tracks.data ? (
        <QueryErrorPanel
          what="the tracks"
          error={tracks.error}
          retrying={tracks.isFetching}
          onRetry={() => void tracks.refetch()}
          testID="tracks-admin-error"
        />
      ) : (
        <View style={styles.list} testID="tracks-admin">
          {tracks.data.map((t) => (
            <TrackItem key={t.code} track={t} onPatch={onPatch} />
          ))}
        </View>
      )}
      {onCreate ? <NewTrack specs={specs} taken={(tracks.data ?? []).map((t) => t.code)} onCreate={onCreate} /> : null}
    </Section>
  );
}

function TrackItem({ track, onPatch }: { track: Track; onPatch: TracksAdminProps['onPatch'] }) {
  const [name, setName] = useState(track.name);
  const [state, setState] = useState<{ busy: string | null; error?: unknown; success?: string }>({ busy: null });
  const patch = async (what: string, p: TrackPatchInput, success: string) => {
    if (!onPatch) return;
    setState({ busy: what });
    try {
      await onPatch(track.code, p);
      setState({ busy: null, success });
    } catch (error) {
      setState({ busy: null, error });
    }
  };
  const archived = track.state === 'archived';
  return (
    <View style={styles.item} testID={`track-admin-${track.code}`}>
      <View style={styles.head}>
        <Text style={styles.name}>{track.name}</Text>
        <Text style={styles.code}>{track.code}</Text>
        {track.headline ? <Pill label="Headline" tone="info" /> : null}
        <Pill label={STATE_WORD[track.state]} tone={track.state === 'active' ? 'success' : 'neutral'} />
      </View>
      <Text style={styles.line}>
        {track.indicator.name} ({track.indicator.unit}) · spec “{track.specName}” ·{' '}
        {track.publishedRunId ? `published run #${track.publishedRunId}` : 'no published run yet'}
      </Text>
      {onPatch && !archived ? (
        <View style={styles.actions}>
          <View style={styles.rename}>
            <TextField label="Name" value={name} onChangeText={setName} testID={`track-name-${track.code}`} />
          </View>
          <Button
            label="Rename"
            variant="outline"
            disabled={name.trim() === '' || name.trim() === track.name}
            busy={state.busy === 'name'}
            busyLabel="Saving…"
            onPress={() => void patch('name', { name: name.trim() }, `Renamed to “${name.trim()}”.`)}
            testID={`track-rename-${track.code}`}
          />
          {!track.headline ? (
            <Button
              label="Make headline"
              variant="outline"
              busy={state.busy === 'headline'}
              busyLabel="Saving…"
              onPress={() => void patch('headline', { headline: true }, `${track.name} is the headline track.`)}
              testID={`track-headline-${track.code}`}
            />
          ) : null}
          <Button
            label={track.state === 'paused' ? 'Resume' : 'Pause'}
            variant="outline"
            busy={state.busy === 'state'}
            busyLabel="Saving…"
            onPress={() =>
              void patch(
                'state',
                { state: track.state === 'paused' ? 'active' : 'paused' },
                track.state === 'paused' ? 'Resumed: scheduled runs start again.' : 'Paused: no scheduled runs.',
              )
            }
            testID={`track-pause-${track.code}`}
          />
          {!track.headline ? (
            <ConfirmAction
              label="Archive"
              question={`Archive ${track.name}? Officials stop seeing it and its subscriptions stop.`}
              confirmLabel="Archive"
              variant="danger"
              busy={state.busy === 'archive'}
              busyLabel="Archiving…"
              onConfirm={() => void patch('archive', { state: 'archived' }, 'Archived; its history is kept.')}
              testID={`track-archive-${track.code}`}
            />
          ) : null}
        </View>
      ) : null}
      <MutationNotice error={state.error} success={state.success} testID={`track-admin-${track.code}`} />
    </View>
  );
}

function NewTrack({
  specs,
  taken,
  onCreate,
}: {
  specs: SavedSpec[];
  taken: string[];
  onCreate: (input: TrackCreateInput) => Promise<unknown>;
}) {
  const available = specs.filter((s) => !s.archived);
  const [code, setCode] = useState('');
  const [name, setName] = useState('');
  const [specId, setSpecId] = useState<string | null>(null);
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });
  const create = async () => {
    const found: Record<string, string> = {};
    if (!isTrackCode(code)) found.code = `Code: ${TRACK_CODE_RULE}.`;
    else if (taken.includes(code)) found.code = `Code: ${code} is already a track.`;
    if (name.trim() === '') found.name = 'Name: give the track a name officials will read.';
    if (specId === null) found.spec = 'Spec: choose the saved spec the track starts with.';
    setProblems(found);
    if (Object.keys(found).length) return;
    setState({ busy: true });
    try {
      await onCreate({ code, name: name.trim(), specId: Number(specId) });
      setState({ busy: false, success: `Created ${name.trim()}. Start its first run on the Runs screen.` });
      setCode('');
      setName('');
    } catch (error) {
      setState({ busy: false, error });
    }
  };
  return (
    <View style={styles.item} testID="track-new">
      <Text style={styles.name}>New track</Text>
      <TextField
        label="Code"
        hint="Used in links, e.g. pm25"
        value={code}
        onChangeText={setCode}
        error={problems.code}
        testID="track-new-code"
      />
      <TextField label="Name" value={name} onChangeText={setName} error={problems.name} testID="track-new-name" />
      <ChoiceGroup
        label="Starts with the spec"
        hint="The track watches this spec’s emissions indicator."
        choices={available.map((s) => ({ value: String(s.id), label: s.name, hint: s.emissionsIndicator }))}
        value={specId}
        onChange={setSpecId}
        testID="track-new-spec"
      />
      {problems.spec ? <Text style={styles.error}>{problems.spec}</Text> : null}
      <Button
        label="Create track"
        busy={state.busy}
        busyLabel="Creating…"
        onPress={() => void create()}
        testID="track-new-save"
      />
      <MutationNotice error={state.error} success={state.success} testID="track-new" />
    </View>
  );
}

const styles = StyleSheet.create({
  intro: { ...type.body, color: colors.textMuted },
  list: { gap: space.sm },
  item: {
    gap: space.sm,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  name: { ...type.bodyStrong, color: colors.text },
  code: { ...type.label, color: colors.textMuted },
  line: { ...type.caption, color: colors.text },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: space.sm },
  rename: { minWidth: 200, flexGrow: 1 },
  error: { ...type.caption, color: colors.danger },
});
