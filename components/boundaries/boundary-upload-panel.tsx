import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { CheckBox } from '@/components/form/check-box';
import { describeSendError, MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import { formatBytes } from '@/lib/format-time';
import type { PickedFile } from '@/lib/pick-file.types';
import { safeParse } from '@/contracts/kit';
import {
  BoundaryUploadAnswerSchema,
  type BoundaryUploadAnswer,
  type BoundaryUploadOptions,
} from '@/contracts/boundaries';

import { BoundaryPreview } from './boundary-preview';
import { BoundaryProblems } from './boundary-problems';
import { committedWords, readyWords, refusalSummary, repairable } from './boundary-words';

/** The settings a check was made with (a commit sends the same ones). */
type Settings = Pick<BoundaryUploadOptions, 'codeProperty' | 'repair'>;

export type BoundaryUploadPanelProps = {
  pickFile: () => Promise<PickedFile | null>;
  /** Sends the file: a dry run, or with `commit` the write of the whole file. */
  onSend: (file: PickedFile, options: BoundaryUploadOptions) => Promise<BoundaryUploadAnswer>;
};

type Phase =
  | { step: 'idle' }
  | { step: 'checking'; file: PickedFile; settings: Settings }
  | { step: 'checked'; file: PickedFile; settings: Settings; answer: BoundaryUploadAnswer }
  | { step: 'committing'; file: PickedFile; settings: Settings; answer: BoundaryUploadAnswer }
  | { step: 'committed'; file: PickedFile; answer: BoundaryUploadAnswer }
  | { step: 'refused'; file: PickedFile | null; settings: Settings | null; error: unknown };

/** A refused commit (422 `boundaries_rejected`) carries the check's answer as its details. */
function rejection(error: unknown): BoundaryUploadAnswer | null {
  if (!(error instanceof ApiError) || error.code !== 'boundaries_rejected') return null;
  const parsed = safeParse(BoundaryUploadAnswerSchema, error.details);
  return parsed.success ? parsed.data : null;
}

const same = (a: Settings, b: Settings) => a.codeProperty.trim() === b.codeProperty.trim() && a.repair === b.repair;

/**
 * Choose a GeoJSON file of district boundaries, see every problem by feature and the
 * districts it would draw, then load it. The check is a dry run on the server; nothing is
 * written until "Load these boundaries", and then only when the whole file is accepted.
 * Crossing rings are repaired with ST_MakeValid only when the analyst ticks the box.
 */
export function BoundaryUploadPanel({ pickFile, onSend }: BoundaryUploadPanelProps) {
  const [settings, setSettings] = useState<Settings>({ codeProperty: 'code', repair: false });
  const [phase, setPhase] = useState<Phase>({ step: 'idle' });
  const busy = phase.step === 'checking' || phase.step === 'committing';
  const codeMissing = settings.codeProperty.trim() === '';

  const check = async (file: PickedFile, used: Settings) => {
    setPhase({ step: 'checking', file, settings: used });
    try {
      const answer = await onSend(file, { ...used, commit: false });
      setPhase({ step: 'checked', file, settings: used, answer });
    } catch (error) {
      setPhase({ step: 'refused', file, settings: used, error });
    }
  };

  const choose = async () => {
    let file: PickedFile | null;
    try {
      file = await pickFile();
    } catch (error) {
      setPhase({ step: 'refused', file: null, settings: null, error });
      return;
    }
    if (file) await check(file, settings);
  };

  const commit = async (file: PickedFile, used: Settings, answer: BoundaryUploadAnswer) => {
    setPhase({ step: 'committing', file, settings: used, answer });
    try {
      const done = await onSend(file, { ...used, commit: true });
      setPhase({ step: 'committed', file, answer: done });
    } catch (error) {
      setPhase({ step: 'refused', file, settings: used, error });
    }
  };

  // The file in hand and whether the settings moved since it was checked.
  const held = phase.step !== 'idle' && phase.step !== 'committed' ? phase.file : null;
  const checkedWith = 'settings' in phase ? phase.settings : null;
  const stale = held !== null && checkedWith !== null && !same(checkedWith, settings);

  return (
    <View style={styles.wrap}>
      <View style={styles.chooser}>
        <Text style={styles.lead}>
          A GeoJSON FeatureCollection of Polygon or MultiPolygon features in WGS 84 longitude and latitude, one feature
          per district, each with the district&apos;s code in a property.
        </Text>
        <TextField
          label="Property holding the district code"
          value={settings.codeProperty}
          onChangeText={(v) => setSettings((s) => ({ ...s, codeProperty: v }))}
          hint="The name of the feature property whose value is the district code, e.g. code or district_id."
          error={codeMissing ? 'Name the property that holds the district code.' : null}
          maxLength={100}
          testID="boundary-code-property"
        />
        <CheckBox
          label="Repair crossing rings with ST_MakeValid"
          hint="Only when you have looked at them: the repair keeps the polygonal parts, which may not be what was meant."
          checked={settings.repair}
          onChange={(v) => setSettings((s) => ({ ...s, repair: v }))}
          testID="boundary-repair"
        />
        <View style={styles.buttons}>
          <Button
            label={phase.step === 'idle' ? 'Choose a GeoJSON file' : 'Choose another file'}
            onPress={() => void choose()}
            busy={busy}
            busyLabel={phase.step === 'committing' ? 'Loading…' : 'Checking…'}
            disabled={codeMissing}
            variant={phase.step === 'checked' && phase.answer.accepted && !stale ? 'outline' : 'solid'}
            testID="boundary-choose"
          />
          {held && stale && !busy ? (
            <Button
              label="Check this file again"
              onPress={() => void check(held, settings)}
              disabled={codeMissing}
              testID="boundary-recheck"
            />
          ) : null}
        </View>
        {stale ? (
          <Text style={styles.note} testID="boundary-stale">
            The settings changed since the file was checked: check it again before loading it.
          </Text>
        ) : null}
      </View>
      <PhaseView
        phase={phase}
        stale={stale}
        onCommit={commit}
        onRepair={(file) => {
          const next = { ...settings, repair: true };
          setSettings(next);
          void check(file, next);
        }}
      />
    </View>
  );
}

function FileLine({ file }: { file: PickedFile }) {
  return (
    <Text style={styles.fileLine} testID="boundary-file">
      {file.name}
      {file.size !== null ? ` · ${formatBytes(file.size)}` : ''}
    </Text>
  );
}

type PhaseViewProps = {
  phase: Phase;
  stale: boolean;
  onCommit: (file: PickedFile, settings: Settings, answer: BoundaryUploadAnswer) => void;
  onRepair: (file: PickedFile) => void;
};

function PhaseView({ phase, stale, onCommit, onRepair }: PhaseViewProps) {
  switch (phase.step) {
    case 'idle':
      return null;
    case 'checking':
      return (
        <View style={styles.result} accessibilityLiveRegion="polite">
          <FileLine file={phase.file} />
          <Text style={styles.lead}>Checking every feature… nothing is written yet.</Text>
        </View>
      );
    case 'refused': {
      const details = rejection(phase.error);
      const tooLarge = phase.error instanceof ApiError && phase.error.status === 413;
      return (
        <View style={styles.result}>
          {phase.file ? <FileLine file={phase.file} /> : null}
          <StatePanel
            tone="alert"
            testID="boundary-refused"
            title={
              details
                ? 'The boundaries were not loaded'
                : tooLarge
                  ? 'The file is too large'
                  : 'The file did not go through'
            }
            message={details ? `${refusalSummary(details)} Nothing was written.` : describeSendError(phase.error)}
          />
          {details ? (
            <BoundaryProblems
              problems={details.problems}
              errors={details.counts.errors}
              warnings={details.counts.warnings}
            />
          ) : null}
        </View>
      );
    }
    case 'checked':
    case 'committing': {
      const { answer, file, settings } = phase;
      const problems = answer.problems.length ? (
        <BoundaryProblems problems={answer.problems} errors={answer.counts.errors} warnings={answer.counts.warnings} />
      ) : null;
      if (!answer.accepted) {
        return (
          <View style={styles.result}>
            <FileLine file={file} />
            <StatePanel
              tone="alert"
              testID="boundary-not-accepted"
              title="This file cannot be loaded as it is"
              message={`${refusalSummary(answer)} Nothing was written; the whole file loads only when every error is fixed.`}
            >
              {repairable(answer) && !settings.repair && !stale ? (
                <Button
                  label="Check again, repairing crossing rings"
                  variant="outline"
                  onPress={() => onRepair(file)}
                  testID="boundary-repair-again"
                />
              ) : null}
            </StatePanel>
            {problems}
            <BoundaryPreview answer={answer} />
          </View>
        );
      }
      const warnings = answer.counts.warnings;
      return (
        <View style={styles.result}>
          <FileLine file={file} />
          <View style={styles.ready} testID="boundary-ready">
            <Text style={styles.readyTitle}>Checked: ready to load</Text>
            <Text style={styles.lead}>
              Loading writes {readyWords(answer)}, as a new boundary version and an entry of the upload history. Nothing
              changes until you press the button.
              {warnings ? ` Read the ${warnings === 1 ? 'warning' : `${warnings} warnings`} below first.` : ''}
            </Text>
            <Button
              label="Load these boundaries"
              onPress={() => onCommit(file, settings, answer)}
              busy={phase.step === 'committing'}
              busyLabel="Loading…"
              disabled={stale}
              testID="boundary-commit"
            />
          </View>
          {problems}
          <BoundaryPreview answer={answer} />
        </View>
      );
    }
    case 'committed': {
      const { answer, file } = phase;
      return (
        <View style={styles.result}>
          <FileLine file={file} />
          <MutationNotice testID="boundary-done" success={committedWords(answer)} />
          <View style={styles.links}>
            <TextLink href="/" label="See the region map" />
            {answer.uploadId !== null ? (
              <TextLink
                href={{ pathname: '/uploads/[id]', params: { id: String(answer.uploadId) } }}
                label={`Open upload #${answer.uploadId}`}
              />
            ) : null}
          </View>
          {answer.problems.length ? (
            <BoundaryProblems
              problems={answer.problems}
              errors={answer.counts.errors}
              warnings={answer.counts.warnings}
            />
          ) : null}
        </View>
      );
    }
  }
}

const styles = StyleSheet.create({
  wrap: { gap: space.xl },
  chooser: {
    gap: space.md,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  lead: { ...type.body, color: colors.text },
  note: { ...type.caption, color: colors.textMuted },
  result: { gap: space.lg },
  fileLine: { ...type.bodyStrong, color: colors.text },
  ready: {
    gap: space.sm,
    backgroundColor: colors.selected,
    borderRadius: radius.lg,
    padding: space.lg,
    borderLeftWidth: 4,
    borderLeftColor: colors.selectedRule,
  },
  readyTitle: { ...type.title, color: colors.text },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
});
