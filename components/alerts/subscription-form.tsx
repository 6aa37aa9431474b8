import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { CheckBox } from '@/components/form/check-box';
import { ChoiceGroup } from '@/components/form/choice-group';
import { MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { searchDistricts } from '@/lib/district-search';
import { ALERT_KINDS, type AlertKind, type SubscriptionInput } from '@/contracts/alerts';
import type { TrackRef } from '@/contracts/tracks';
import { ALERT_KIND_LABEL } from '@/lib/estimate-words';

export const KIND_HINT: Record<AlertKind, string> = {
  crossing: 'the standing moves between approaching, at the turn and past the turn',
  threshold_shift: 'the threshold moves by more than the set percent',
  shape_change: 'the curve’s shape changes',
  significance_change: 'the U-test’s verdict on the turn flips',
};

/** Districts shown at once in the picker; the search narrows the rest. */
const PICKER_ROWS = 12;

export type SubscriptionFormProps = {
  districts: { code: string; name: string }[];
  /** open tracks to choose from (the headline first); none given: every track */
  tracks?: TrackRef[];
  onSubscribe: (input: SubscriptionInput) => Promise<unknown>;
};

/** Follow a district, a set of districts or the whole region: which alerts, how delivered, brief or not. */
export function SubscriptionForm({ districts, tracks = [], onSubscribe }: SubscriptionFormProps) {
  const [allTracks, setAllTracks] = useState(true);
  const [trackCodes, setTrackCodes] = useState<string[]>([]);
  const [scope, setScope] = useState<SubscriptionInput['scope']>('district');
  const [codes, setCodes] = useState<string[]>([]);
  const [query, setQuery] = useState('');
  const [kinds, setKinds] = useState<AlertKind[]>([...ALERT_KINDS]);
  const [delivery, setDelivery] = useState<SubscriptionInput['delivery']>('instant');
  const [attachBrief, setAttachBrief] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });

  const found = useMemo(() => searchDistricts(districts, query), [districts, query]);
  const shown = found.slice(0, PICKER_ROWS);
  const pick = (code: string, on: boolean) => {
    if (scope === 'district') setCodes(on ? [code] : []);
    else setCodes((c) => (on ? [...c, code] : c.filter((x) => x !== code)));
  };
  const changeScope = (s: SubscriptionInput['scope']) => {
    setScope(s);
    if (s === 'district') setCodes((c) => c.slice(0, 1));
    if (s === 'region') setCodes([]);
  };

  const submit = async () => {
    if (scope !== 'region' && codes.length === 0)
      return setProblem(scope === 'district' ? 'Choose the district.' : 'Choose at least one district.');
    if (!allTracks && trackCodes.length === 0) return setProblem('Choose at least one watched indicator.');
    if (kinds.length === 0) return setProblem('Choose at least one kind of alert.');
    setProblem(null);
    setState({ busy: true });
    try {
      await onSubscribe({
        tracks: allTracks ? 'all' : trackCodes,
        scope,
        districtCodes: scope === 'region' ? [] : codes,
        kinds,
        delivery,
        attachBrief: delivery === 'digest' && attachBrief,
      });
      setState({
        busy: false,
        success:
          scope === 'region'
            ? 'Subscribed to the whole region.'
            : `Subscribed to ${codes.length === 1 ? codes[0] : `${codes.length} districts`}.`,
      });
      setCodes([]);
    } catch (error) {
      setState({ busy: false, error });
    }
  };

  return (
    <View style={styles.box} testID="subscription-form">
      <ChoiceGroup
        label="Follow"
        choices={[
          { value: 'district', label: 'One district' },
          { value: 'districts', label: 'A set of districts' },
          { value: 'region', label: 'The whole region' },
        ]}
        value={scope}
        onChange={changeScope}
        testID="sub-scope"
      />
      {scope !== 'region' ? (
        <View style={styles.picker}>
          <TextField
            label="Find districts"
            value={query}
            onChangeText={setQuery}
            placeholder="Name or code"
            testID="sub-search"
          />
          <View>
            {shown.map((d) => (
              <CheckBox
                key={d.code}
                label={`${d.name} (${d.code})`}
                checked={codes.includes(d.code)}
                onChange={(on) => pick(d.code, on)}
                testID={`sub-district-${d.code}`}
              />
            ))}
          </View>
          <Text style={styles.note}>
            {found.length > shown.length ? `${found.length - shown.length} more match: narrow the search. ` : ''}
            {codes.length ? `Chosen: ${codes.join(', ')}.` : 'None chosen yet.'}
          </Text>
        </View>
      ) : null}
      {tracks.length > 0 ? (
        <View testID="sub-tracks">
          <Text style={styles.label}>Watched indicators</Text>
          <CheckBox
            label="All of them"
            hint="Includes indicators the agency starts watching later."
            checked={allTracks}
            onChange={setAllTracks}
            testID="sub-track-all"
          />
          {!allTracks
            ? tracks.map((t) => (
                <CheckBox
                  key={t.code}
                  label={t.name}
                  hint={t.indicator.unit}
                  checked={trackCodes.includes(t.code)}
                  onChange={(on) => setTrackCodes((c) => (on ? [...c, t.code] : c.filter((x) => x !== t.code)))}
                  testID={`sub-track-${t.code}`}
                />
              ))
            : null}
        </View>
      ) : null}
      <View>
        <Text style={styles.label}>Alert kinds</Text>
        {ALERT_KINDS.map((k) => (
          <CheckBox
            key={k}
            label={ALERT_KIND_LABEL[k]}
            hint={KIND_HINT[k]}
            checked={kinds.includes(k)}
            onChange={(on) => setKinds((ks) => (on ? [...ks, k] : ks.filter((x) => x !== k)))}
            testID={`sub-kind-${k}`}
          />
        ))}
      </View>
      <ChoiceGroup
        label="Delivery"
        choices={[
          { value: 'instant', label: 'One e-mail per alert' },
          { value: 'digest', label: 'One digest per publish' },
        ]}
        value={delivery}
        onChange={setDelivery}
        testID="sub-delivery"
      />
      <CheckBox
        label="Attach the region brief (PDF)"
        hint={delivery === 'digest' ? 'Sent with each digest.' : 'Available with the digest.'}
        checked={delivery === 'digest' && attachBrief}
        disabled={delivery !== 'digest'}
        onChange={setAttachBrief}
        testID="sub-brief"
      />
      {problem ? (
        <Text style={styles.error} accessibilityRole="alert">
          {problem}
        </Text>
      ) : null}
      <Button label="Subscribe" busy={state.busy} busyLabel="Saving…" onPress={() => void submit()} testID="sub-save" />
      <MutationNotice error={state.error} success={state.success} testID="sub" />
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.lg,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  picker: { gap: space.sm },
  label: { ...type.label, color: colors.text },
  note: { ...type.caption, color: colors.textMuted },
  error: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.danger },
});
