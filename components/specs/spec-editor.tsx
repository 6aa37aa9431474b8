import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { CheckBox } from '@/components/form/check-box';
import { ChoiceGroup } from '@/components/form/choice-group';
import { fieldErrorsOf, MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-action';
import type { CatalogueIndicator, SavedSpec, SpecInput } from '@/contracts/settings';

import { draftOf, EMPTY_DRAFT, specInputOf, type SpecDraft } from './spec-form-model';

export type SpecEditorProps = {
  /** The saved spec being edited; null for a new one. */
  spec: SavedSpec | null;
  indicators: CatalogueIndicator[];
  onSave: (input: SpecInput) => Promise<SavedSpec>;
  onArchive: (() => Promise<unknown>) | null;
  onSaved: (spec: SavedSpec) => void;
};

/** Name, series, model and sample window of a saved spec, checked here and again by the server. */
export function SpecEditor({ spec, indicators, onSave, onArchive, onSaved }: SpecEditorProps) {
  const [draft, setDraft] = useState<SpecDraft>(spec ? draftOf(spec) : EMPTY_DRAFT);
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });
  // Another spec (or the saved one coming back) starts afresh, adjusted while rendering.
  const [editing, setEditing] = useState(spec);
  if (editing !== spec) {
    setEditing(spec);
    setDraft(spec ? draftOf(spec) : EMPTY_DRAFT);
    setProblems({});
    setState({ busy: false });
  }
  const set = <K extends keyof SpecDraft>(key: K, value: SpecDraft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  const choices = indicators.map((i) => ({ value: i.code, label: i.name || i.code, hint: i.unit }));
  const controlCandidates = indicators.filter(
    (i) => i.code !== draft.emissionsIndicator && i.code !== draft.driverIndicator,
  );

  const save = async () => {
    const { input, problems: p } = specInputOf(draft);
    setProblems(p);
    if (!input) return;
    setState({ busy: true });
    try {
      const saved = await onSave(input);
      setState({ busy: false, success: `Saved “${saved.name}”.` });
      onSaved(saved);
    } catch (error) {
      setProblems(fieldErrorsOf(error));
      setState({ busy: false, error });
    }
  };
  const archive = async () => {
    if (!onArchive) return;
    setState({ busy: true });
    try {
      await onArchive();
      setState({ busy: false });
    } catch (error) {
      setState({ busy: false, error });
    }
  };

  return (
    <View style={styles.form} testID="spec-editor">
      <Text role="heading" aria-level={2} style={styles.title}>
        {spec ? `Edit “${spec.name}”` : 'New spec'}
      </Text>
      <TextField
        label="Name"
        value={draft.name}
        onChangeText={(v) => set('name', v)}
        error={problems.name}
        autoCapitalize="sentences"
        maxLength={80}
        testID="spec-name"
      />
      <TextField
        label="Description"
        value={draft.description}
        onChangeText={(v) => set('description', v)}
        multiline
        maxLength={500}
        autoCapitalize="sentences"
        hint="What the spec is for, in a sentence."
        testID="spec-description"
      />
      <ChoiceGroup
        label="Emissions indicator"
        choices={choices}
        value={draft.emissionsIndicator}
        onChange={(v) => set('emissionsIndicator', v)}
        testID="spec-emissions"
      />
      <ChoiceGroup
        label="Driver"
        choices={choices}
        value={draft.driverIndicator}
        onChange={(v) => set('driverIndicator', v)}
        testID="spec-driver"
      />
      {problems.driverIndicator ? <Text style={styles.error}>{problems.driverIndicator}</Text> : null}
      <View style={styles.group}>
        <Text style={styles.label}>Controls</Text>
        {controlCandidates.map((i) => (
          <CheckBox
            key={i.code}
            label={i.name || i.code}
            hint={i.unit}
            checked={draft.controls.includes(i.code)}
            onChange={(on) =>
              set('controls', on ? [...draft.controls, i.code] : draft.controls.filter((c) => c !== i.code))
            }
            testID={`spec-control-${i.code}`}
          />
        ))}
        {problems.controls ? <Text style={styles.error}>{problems.controls}</Text> : null}
      </View>
      <ChoiceGroup
        label="Form"
        choices={[
          { value: 'quadratic', label: 'Quadratic', hint: 'one turning point' },
          { value: 'cubic', label: 'Cubic', hint: 'up to two' },
        ]}
        value={draft.form}
        onChange={(v) => set('form', v)}
      />
      <ChoiceGroup
        label="Scale"
        choices={[
          { value: 'log', label: 'Logs', hint: 'emissions, driver, controls' },
          { value: 'level', label: 'Levels', hint: 'raw values' },
        ]}
        value={draft.transform}
        onChange={(v) => set('transform', v)}
      />
      {draft.transform === 'log' && draft.controls.length ? (
        <View style={styles.group}>
          <Text style={styles.label}>Controls kept in levels</Text>
          {draft.controls.map((c) => (
            <CheckBox
              key={c}
              label={indicators.find((i) => i.code === c)?.name ?? c}
              checked={draft.levelControls.includes(c)}
              onChange={(on) =>
                set('levelControls', on ? [...draft.levelControls, c] : draft.levelControls.filter((x) => x !== c))
              }
            />
          ))}
        </View>
      ) : null}
      <ChoiceGroup
        label="Standard errors"
        choices={[
          { value: 'newey_west', label: 'Newey–West', hint: 'serially correlated years' },
          { value: 'hc1', label: 'HC1' },
          { value: 'hc3', label: 'HC3' },
          { value: 'classical', label: 'Classical' },
        ]}
        value={draft.covariance}
        onChange={(v) => set('covariance', v)}
        testID="spec-covariance"
      />
      {draft.covariance === 'newey_west' ? (
        <TextField
          label="Newey–West lag (rows)"
          value={draft.lag}
          onChangeText={(v) => set('lag', v)}
          keyboardType="number-pad"
          hint="Blank: floor(4·(n/100)^(2/9))."
          error={problems.lag}
        />
      ) : null}
      <ChoiceGroup
        label="Interval that sets the standing"
        choices={[
          { value: 'fieller', label: 'Fieller' },
          { value: 'delta', label: 'Delta method' },
        ]}
        value={draft.intervalMethod}
        onChange={(v) => set('intervalMethod', v)}
      />
      <View style={styles.row}>
        <View style={styles.cell}>
          <TextField
            label="First year"
            value={draft.firstYear}
            onChangeText={(v) => set('firstYear', v)}
            keyboardType="number-pad"
            hint="Blank: all years."
            error={problems.firstYear}
          />
        </View>
        <View style={styles.cell}>
          <TextField
            label="Last year"
            value={draft.lastYear}
            onChangeText={(v) => set('lastYear', v)}
            keyboardType="number-pad"
            hint="Blank: all years."
            error={problems.lastYear}
          />
        </View>
        <View style={styles.cell}>
          <TextField
            label="Minimum years"
            value={draft.minYears}
            onChangeText={(v) => set('minYears', v)}
            keyboardType="number-pad"
            hint="Blank: k + 5."
            error={problems.minYears}
          />
        </View>
      </View>
      <View style={styles.actions}>
        <Button
          label={spec ? 'Save changes' : 'Save spec'}
          busy={state.busy}
          busyLabel="Saving…"
          onPress={() => void save()}
          testID="spec-save"
        />
        {onArchive ? (
          <ConfirmAction
            label="Archive"
            question="Archive this spec? New runs cannot use it; past runs keep their copy."
            confirmLabel="Archive"
            variant="danger"
            onConfirm={() => void archive()}
            testID="spec-archive"
          />
        ) : null}
      </View>
      <MutationNotice error={state.error} success={state.success} testID="spec" />
    </View>
  );
}

const styles = StyleSheet.create({
  form: {
    gap: space.lg,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  title: { ...type.title, color: colors.text },
  group: { gap: space.xxs },
  label: { ...type.label, color: colors.text },
  error: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.danger },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  cell: { flexGrow: 1, flexBasis: 140 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-start' },
});
