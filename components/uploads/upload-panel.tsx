import { useEffect, useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { CheckBox } from '@/components/form/check-box';
import { describeSendError, MutationNotice } from '@/components/form/mutation-notice';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import { formatBytes, formatDateTime } from '@/lib/format-time';
import type { PickedFile } from '@/lib/pick-file.types';
import type { UploadProgressView } from '@/hooks/use-uploads';
import { safeParse } from '@/contracts/kit';
import {
  UploadRejectionDetailsSchema,
  type UploadAnswer,
  type UploadOptions,
  type UploadRejectionDetails,
} from '@/contracts/uploads';

import { PreviewSummary } from './preview-summary';
import { ProblemsTable } from './problems-table';
import { stopWords, UploadProgressPanel } from './upload-progress';
import { changeWords, noopSummary, refusalSummary } from './upload-words';

export type UploadPanelProps = {
  /** The settings' change factor (a value moving by more than this is flagged); null until known. */
  changeFactor: number | null;
  pickFile: () => Promise<PickedFile | null>;
  /** Dry run: check the file, answer with its preview. */
  onPreview: (file: PickedFile, options: UploadOptions) => Promise<UploadAnswer>;
  /** Commit the kept preview with this upload id. */
  onCommit: (uploadId: number) => Promise<UploadAnswer>;
  /** The running check or load: bytes sent, then the server's phases (null when none runs). */
  progress?: UploadProgressView | null;
};

type Phase =
  | { step: 'idle' }
  | { step: 'checking'; file: PickedFile }
  | { step: 'checked'; file: PickedFile; answer: UploadAnswer }
  | { step: 'refused'; file: PickedFile | null; error: unknown; last?: UploadProgressView | null }
  | { step: 'committing'; file: PickedFile; answer: UploadAnswer }
  | { step: 'committed'; file: PickedFile; answer: UploadAnswer };

/** The refusal's fields (code `upload_rejected`), read through their contract. */
function rejection(error: unknown): UploadRejectionDetails | null {
  if (!(error instanceof ApiError) || error.code !== 'upload_rejected') return null;
  const parsed = safeParse(UploadRejectionDetailsSchema, error.details);
  return parsed.success ? parsed.data : null;
}

/**
 * Choose a CSV, see what it would change and every problem in it, then load it. The check
 * is a dry run on the server: nothing is written until "Load these values", and then all
 * or nothing.
 */
export function UploadPanel({ changeFactor, pickFile, onPreview, onCommit, progress = null }: UploadPanelProps) {
  // The last progress seen, for saying where a broken upload stopped.
  const lastProgress = useRef<UploadProgressView | null>(null);
  useEffect(() => {
    if (progress) lastProgress.current = progress;
  }, [progress]);
  const [options, setOptions] = useState<{ allowNewDistricts: boolean; decimalComma: boolean }>({
    allowNewDistricts: false,
    decimalComma: false,
  });
  const [phase, setPhase] = useState<Phase>({ step: 'idle' });
  const busy = phase.step === 'checking' || phase.step === 'committing';

  const choose = async () => {
    let file: PickedFile | null;
    try {
      file = await pickFile();
    } catch (error) {
      setPhase({ step: 'refused', file: null, error });
      return;
    }
    if (!file) return;
    setPhase({ step: 'checking', file });
    lastProgress.current = null;
    try {
      // The change factor is not sent: the server applies the admin setting itself.
      const answer = await onPreview(file, options);
      setPhase({ step: 'checked', file, answer });
    } catch (error) {
      setPhase({ step: 'refused', file, error, last: lastProgress.current });
    }
  };

  const commit = async (file: PickedFile, answer: UploadAnswer) => {
    setPhase({ step: 'committing', file, answer });
    lastProgress.current = null;
    try {
      const done = await onCommit(answer.upload.id);
      setPhase({ step: 'committed', file, answer: done });
    } catch (error) {
      setPhase({ step: 'refused', file, error, last: lastProgress.current });
    }
  };

  return (
    <View style={styles.wrap}>
      <View style={styles.chooser}>
        <Text style={styles.lead}>
          A CSV in the long layout (district_code, indicator, year, value) or the wide one (district_code, year, then
          one column per indicator). Comma or semicolon; UTF-8 with or without a byte-order mark.
        </Text>
        <View style={styles.options}>
          <CheckBox
            label="Allow new district codes"
            hint="Needs a district_name column; otherwise unknown codes are refused."
            checked={options.allowNewDistricts}
            onChange={(v) => setOptions((o) => ({ ...o, allowNewDistricts: v }))}
            testID="upload-allow-new"
          />
          <CheckBox
            label="Numbers use a decimal comma"
            hint="For files written as 7,84 rather than 7.84 (then fields are separated by semicolons)."
            checked={options.decimalComma}
            onChange={(v) => setOptions((o) => ({ ...o, decimalComma: v }))}
            testID="upload-decimal-comma"
          />
        </View>
        <Button
          label={phase.step === 'idle' ? 'Choose a CSV file' : 'Choose another file'}
          onPress={() => void choose()}
          busy={busy}
          busyLabel={phase.step === 'committing' ? 'Loading…' : 'Checking…'}
          variant={phase.step === 'checked' ? 'outline' : 'solid'}
          testID="upload-choose"
        />
        {changeFactor !== null ? (
          <Text style={styles.note}>
            A stored value changing by more than ×{changeFactor} is flagged as a warning (the admin setting).
          </Text>
        ) : null}
      </View>
      <PhaseView phase={phase} onCommit={commit} progress={progress} />
    </View>
  );
}

function FileLine({ file }: { file: PickedFile }) {
  return (
    <Text style={styles.fileLine} testID="upload-file">
      {file.name}
      {file.size !== null ? ` · ${formatBytes(file.size)}` : ''}
    </Text>
  );
}

/** Where an upload that broke off stopped: the server's phase and line, or the bytes sent so far. */
function stoppedWords(
  details: UploadRejectionDetails | null,
  last: UploadProgressView | null | undefined,
): string | null {
  if (details?.stoppedAt) return stopWords(details.stoppedAt);
  if (last?.server?.stoppedAt) return stopWords(last.server.stoppedAt);
  if (last?.server) return stopWords({ phase: last.server.phase, line: null });
  if (last?.sent && last.sent.loaded < last.sent.total)
    return `Stopped while sending the file, after ${formatBytes(last.sent.loaded)} of ${formatBytes(last.sent.total)}.`;
  return null;
}

function PhaseView({
  phase,
  onCommit,
  progress,
}: {
  phase: Phase;
  onCommit: (file: PickedFile, answer: UploadAnswer) => void;
  progress: UploadProgressView | null;
}) {
  switch (phase.step) {
    case 'idle':
      return null;
    case 'checking':
      return (
        <View style={styles.result} accessibilityLiveRegion="polite">
          <FileLine file={phase.file} />
          <Text style={styles.lead}>Checking every row… nothing is written yet.</Text>
          {progress ? <UploadProgressPanel {...progress} fileSize={phase.file.size} commit={false} /> : null}
        </View>
      );
    case 'refused': {
      const details = rejection(phase.error);
      const tooLarge = phase.error instanceof ApiError && phase.error.status === 413;
      const stopped = stoppedWords(details, phase.last);
      return (
        <View style={styles.result}>
          {phase.file ? <FileLine file={phase.file} /> : null}
          <StatePanel
            tone="alert"
            testID="upload-refused"
            title={
              details ? 'The file was not loaded' : tooLarge ? 'The file is too large' : 'The upload did not go through'
            }
            message={details ? `${refusalSummary(details)} Nothing was written.` : describeSendError(phase.error)}
          />
          {stopped ? (
            <Text style={styles.lead} testID="upload-stopped-at">
              {stopped}
            </Text>
          ) : null}
          {details ? (
            <ProblemsTable
              problems={details.problems}
              truncated={details.truncated}
              errorCount={details.errorCount}
              warningCount={details.warningCount}
            />
          ) : null}
          {details?.preview ? <PreviewSummary preview={details.preview} /> : null}
        </View>
      );
    }
    case 'checked':
    case 'committing': {
      const { answer, file } = phase;
      if (answer.noop) {
        return (
          <View style={styles.result}>
            <FileLine file={file} />
            <StatePanel testID="upload-noop" title="Already loaded" message={noopSummary(answer.upload)}>
              <TextLink
                href={{ pathname: '/uploads/[id]', params: { id: String(answer.upload.id) } }}
                label={`Open upload #${answer.upload.id}`}
              />
            </StatePanel>
          </View>
        );
      }
      const warnings = answer.problems.filter((p) => p.severity === 'warning').length;
      return (
        <View style={styles.result}>
          <FileLine file={file} />
          <View style={styles.ready} testID="upload-ready">
            <Text style={styles.readyTitle}>Checked: ready to load</Text>
            <Text style={styles.lead}>
              Loading writes {changeWords(answer.preview.totals)} in one step. Nothing changes until you press the
              button.
              {warnings ? ` Read the ${warnings === 1 ? 'warning' : `${warnings} warnings`} below first.` : ''}
            </Text>
            {answer.preview.expiresAt ? (
              <Text style={styles.note}>
                The checked rows are kept until {formatDateTime(answer.preview.expiresAt)}.
              </Text>
            ) : null}
            <Button
              label="Load these values"
              onPress={() => onCommit(file, answer)}
              busy={phase.step === 'committing'}
              busyLabel="Loading…"
              testID="upload-commit"
            />
            {phase.step === 'committing' && progress ? (
              <UploadProgressPanel {...progress} fileSize={null} commit />
            ) : null}
          </View>
          {answer.problems.length ? (
            <ProblemsTable problems={answer.problems} truncated={answer.problemsTruncated} />
          ) : null}
          <PreviewSummary preview={answer.preview} />
        </View>
      );
    }
    case 'committed': {
      const { answer, file } = phase;
      if (answer.noop) {
        return <MutationNotice success={noopSummary(answer.upload)} testID="upload-done" />;
      }
      const first = answer.preview.byDistrict.find((d) => d.insert + d.change > 0) ?? answer.preview.byDistrict[0];
      return (
        <View style={styles.result}>
          <FileLine file={file} />
          <MutationNotice
            testID="upload-done"
            success={`Loaded as upload #${answer.upload.id}: ${changeWords(answer.preview.totals)}. Data version ${answer.upload.version ?? '—'}.`}
          />
          <View style={styles.links}>
            {first ? (
              <TextLink
                href={{ pathname: '/district/[code]', params: { code: first.district } }}
                label={`See the values of ${first.name || first.district}`}
              />
            ) : null}
            <TextLink
              href={{ pathname: '/uploads/[id]', params: { id: String(answer.upload.id) } }}
              label={`Open upload #${answer.upload.id}`}
            />
          </View>
          <PreviewSummary preview={answer.preview} />
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
  options: { gap: space.xs },
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
