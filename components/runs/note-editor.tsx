import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { colors, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format-time';
import type { DistrictReview } from '@/contracts/runs';

const MAX = 600;

export type NoteEditorProps = {
  note: DistrictReview['note'];
  onSave: (note: string) => Promise<unknown>;
  /** A discarded or failed run takes no notes. */
  closed: boolean;
};

/** A short note on this district for the next brief. */
export function NoteEditor({ note, onSave, closed }: NoteEditorProps) {
  const [text, setText] = useState(note?.note ?? '');
  const [state, setState] = useState<{ busy: boolean; error?: unknown; saved?: boolean }>({ busy: false });
  // A note saved elsewhere (or another district's) replaces the text, adjusted while rendering.
  const [textFor, setTextFor] = useState(note?.note);
  if (textFor !== note?.note) {
    setTextFor(note?.note);
    setText(note?.note ?? '');
  }
  const trimmed = text.trim();
  const save = async () => {
    setState({ busy: true });
    try {
      await onSave(trimmed);
      setState({ busy: false, saved: true });
    } catch (error) {
      setState({ busy: false, error });
    }
  };
  if (closed) {
    return <Text style={styles.meta}>{note ? `Note: ${note.note}` : 'This run is closed; it takes no notes.'}</Text>;
  }
  return (
    <View style={styles.wrap}>
      <TextField
        label="Note for the next brief"
        value={text}
        onChangeText={setText}
        multiline
        maxLength={MAX}
        hint={`${trimmed.length} of ${MAX} characters. Shown with this district in the brief.`}
        testID="note-input"
      />
      {note ? (
        <Text style={styles.meta}>
          Last saved {formatDateTime(note.updatedAt)}
          {note.authorEmail ? ` by ${note.authorEmail}` : ''}.
        </Text>
      ) : null}
      <Button
        label="Save note"
        variant="outline"
        busy={state.busy}
        busyLabel="Saving…"
        disabled={trimmed.length === 0 || trimmed === (note?.note ?? '')}
        onPress={() => void save()}
        testID="note-save"
      />
      <MutationNotice error={state.error} success={state.saved ? 'Note saved.' : null} testID="note" />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  meta: { ...type.caption, color: colors.textMuted },
});
