// The track switcher of the region view: one option per open track, the headline first.
import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import type { Track } from '@/contracts/tracks';

import { Chip } from './chip';

export type TrackSwitcherProps = {
  tracks: Track[] | undefined;
  status: 'pending' | 'error' | 'success';
  /** the code on screen */
  chosen: string | null;
  onChoose: (code: string) => void;
  onRetry?: () => void;
};

/** "Watching: [CO₂ per person] [Fine particles] …"; the choice goes into the URL and the device's memory. */
export function TrackSwitcher({ tracks, status, chosen, onChoose, onRetry }: TrackSwitcherProps) {
  if (status === 'pending' && !tracks)
    return (
      <Text style={styles.note} testID="track-switcher-loading">
        Loading the watched indicators…
      </Text>
    );
  if (!tracks)
    return (
      <View style={styles.row} testID="track-switcher-error">
        <Text style={styles.note}>The watched indicators could not be loaded; showing the headline one.</Text>
        {onRetry ? <Button label="Try again" variant="outline" onPress={onRetry} /> : null}
      </View>
    );
  if (tracks.length === 0)
    return (
      <Text style={styles.note} testID="track-switcher-empty">
        No indicator is watched yet.
      </Text>
    );
  return (
    <View style={styles.wrap} testID="track-switcher">
      <Text style={styles.label} nativeID="track-switcher-label">
        Watching
      </Text>
      <View style={styles.row} role="radiogroup" aria-labelledby="track-switcher-label">
        {tracks.map((t) => (
          <Chip
            key={t.code}
            kind="radio"
            label={t.state === 'paused' ? `${t.name} (paused)` : t.name}
            accessibilityLabel={`${t.name}, in ${t.indicator.unit}${t.headline ? ', headline' : ''}${
              t.state === 'paused' ? ', paused' : ''
            }`}
            on={t.code === chosen}
            onPress={() => onChoose(t.code)}
            testID={`track-option-${t.code}`}
          />
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xxs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, alignItems: 'center' },
  label: { ...type.caption, color: colors.textMuted },
  note: { ...type.caption, color: colors.textMuted },
});
