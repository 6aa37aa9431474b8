// Which saved spec each track's next run uses, and the change of it (staff). A track only
// takes up a spec of its own emissions indicator; the change takes effect at its next run.
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { MutationNotice } from '@/components/form/mutation-notice';
import type { QueryState } from '@/components/state/query-state';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { Pill } from '@/components/ui/pill';
import type { SavedSpec } from '@/contracts/settings';
import type { Track } from '@/contracts/tracks';
import { shownTracks } from '@/lib/track-choice';

export type TrackSpecsProps = {
  tracks: QueryState<Track[]>;
  specs: SavedSpec[];
  onChangeSpec: (code: string, specId: number) => Promise<unknown>;
};

/** "Tracks and their specs": one box per open track. */
export function TrackSpecs({ tracks, specs, onChangeSpec }: TrackSpecsProps) {
  if (tracks.status !== 'success' || !tracks.data) return null;
  const open = shownTracks(tracks.data);
  if (open.length === 0) return null;
  return (
    <View style={styles.list} testID="track-specs">
      <Text role="heading" aria-level={2} style={styles.title}>
        Tracks and their specs
      </Text>
      {open.map((t) => (
        <TrackSpecRow key={t.code} track={t} specs={specs} onChangeSpec={onChangeSpec} />
      ))}
    </View>
  );
}

function TrackSpecRow({
  track,
  specs,
  onChangeSpec,
}: {
  track: Track;
  specs: SavedSpec[];
  onChangeSpec: TrackSpecsProps['onChangeSpec'];
}) {
  const eligible = specs.filter((s) => !s.archived && s.emissionsIndicator === track.indicator.code);
  const [picked, setPicked] = useState<string>(String(track.specId));
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });
  const save = async () => {
    setState({ busy: true });
    try {
      await onChangeSpec(track.code, Number(picked));
      const name = eligible.find((s) => String(s.id) === picked)?.name ?? picked;
      setState({ busy: false, success: `${track.name} uses “${name}” from its next run.` });
    } catch (error) {
      setState({ busy: false, error });
    }
  };
  return (
    <View style={styles.item} testID={`track-spec-${track.code}`}>
      <View style={styles.head}>
        <Text style={styles.name}>{track.name}</Text>
        {track.headline ? <Pill label="Headline" tone="info" /> : null}
        {track.state === 'paused' ? <Pill label="Paused" tone="neutral" /> : null}
      </View>
      <Text style={styles.line}>
        {track.indicator.name} ({track.indicator.unit}) · next run uses “{track.specName}”
      </Text>
      {eligible.length > 1 ? (
        <>
          <ChoiceGroup
            label={`Spec for ${track.name}`}
            choices={eligible.map((s) => ({ value: String(s.id), label: s.name }))}
            value={picked}
            onChange={setPicked}
            testID={`track-spec-choice-${track.code}`}
          />
          <Button
            label="Use this spec"
            variant="outline"
            disabled={picked === String(track.specId)}
            busy={state.busy}
            busyLabel="Saving…"
            onPress={() => void save()}
            testID={`track-spec-save-${track.code}`}
          />
        </>
      ) : (
        <Text style={styles.hint}>No other saved spec watches {track.indicator.name}; save one to offer it here.</Text>
      )}
      <MutationNotice error={state.error} success={state.success} testID={`track-spec-${track.code}`} />
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  title: { ...type.label, color: colors.text },
  item: {
    gap: space.xs,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  name: { ...type.bodyStrong, color: colors.text },
  line: { ...type.caption, color: colors.text },
  hint: { ...type.caption, color: colors.textMuted },
});
