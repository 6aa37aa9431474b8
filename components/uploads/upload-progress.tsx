import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import { formatBytes } from '@/lib/format-time';
import type { UploadPhase, UploadPhaseCounts, UploadProgress, UploadStop } from '@/contracts/uploads';

/** Bytes sent by the browser, then the server's progress (hooks/use-uploads.ts `UploadProgressView`). */
export type UploadProgressProps = {
  sent: { loaded: number; total: number } | null;
  server: UploadProgress | null;
  /** The file's own size, shown before the browser reports its first bytes. */
  fileSize: number | null;
  /** Committing: the merge phase follows the checks. */
  commit: boolean;
};

const PHASE_WORDS: Record<UploadPhase, string> = {
  reading: 'Reading and checking rows',
  checking: 'Checking against stored data',
  merging: 'Merging into the stored data',
};

const n = (x: number) => x.toLocaleString('en');

function phaseCounts(phase: UploadPhase, c: UploadPhaseCounts): string {
  if (phase === 'reading') {
    const share = c.bytesTotal ? ` (${Math.floor((100 * c.bytesRead) / c.bytesTotal)}% of the file)` : '';
    return `${n(c.rowsRead)} ${c.rowsRead === 1 ? 'row' : 'rows'}, ${n(c.values)} ${c.values === 1 ? 'value' : 'values'}${share}`;
  }
  if (c.insert === null) return `${n(c.values)} values`;
  const parts = `${n(c.insert)} new, ${n(c.change ?? 0)} changed, ${n(c.unchanged ?? 0)} unchanged`;
  if (phase === 'checking') return parts;
  return `writing ${n(c.insert)} new and ${n(c.change ?? 0)} changed values${c.derived ? `, ${n(c.derived)} derived` : ''}`;
}

/** "Stopped while checking against stored data, at line 3." */
export function stopWords(stop: UploadStop): string {
  return `Stopped while ${PHASE_WORDS[stop.phase].toLowerCase()}${stop.line !== null ? `, at line ${n(stop.line)}` : ''}.`;
}

/**
 * A running upload: a bar with the bytes sent ("12.4 MB of 40.0 MB"), then the server's
 * phases in order, each with its counts (done, under way, or still to come).
 */
export function UploadProgressPanel({ sent, server, fileSize, commit }: UploadProgressProps) {
  const total = sent?.total ?? fileSize ?? 0;
  // Once the server reports, every byte has arrived.
  const loaded = server ? total : (sent?.loaded ?? 0);
  const share = total ? Math.min(1, loaded / total) : 0;
  const bytesText = `${formatBytes(loaded)} of ${formatBytes(total)}`;
  const phases: UploadPhase[] = commit || server?.commit ? ['reading', 'checking', 'merging'] : ['reading', 'checking'];
  // Committing a kept preview starts at the checks: its rows were read before.
  const shown = server && server.phases[0]?.phase !== 'reading' ? phases.filter((p) => p !== 'reading') : phases;
  const at = server ? shown.indexOf(server.phase) : -1;
  // Committing a kept preview sends no file: no bar then.
  const showBytes = sent !== null || (fileSize ?? 0) > 0;
  return (
    <View style={styles.wrap} testID="upload-progress">
      {showBytes ? (
        <>
          <Text style={styles.words}>{loaded >= total && total > 0 ? 'File sent' : 'Sending the file'}</Text>
          <View
            style={styles.track}
            role="progressbar"
            aria-label="File sent"
            aria-valuemin={0}
            aria-valuemax={total}
            aria-valuenow={loaded}
            aria-valuetext={bytesText}
            testID="upload-bytes"
          >
            <View style={[styles.fill, { width: `${Math.round(share * 100)}%` }]} />
          </View>
          <Text style={styles.note} testID="upload-bytes-text">
            {bytesText}
          </Text>
        </>
      ) : null}
      <View style={styles.phases} accessibilityLiveRegion="polite">
        {shown.map((phase, i) => {
          const state = !server || i > at ? 'waiting' : i < at || server.state === 'done' ? 'done' : 'current';
          const failedHere = server?.state === 'failed' && i === at;
          const counts = server && state !== 'waiting' ? `: ${phaseCounts(phase, server.counts)}` : '';
          return (
            <Text
              key={phase}
              style={[styles.phase, state === 'waiting' ? styles.waiting : null, state === 'current' && styles.current]}
              testID={`upload-phase-${phase}`}
            >
              {failedHere ? 'Stopped — ' : state === 'done' ? 'Done — ' : state === 'current' ? 'Now — ' : 'Next — '}
              {PHASE_WORDS[phase]}
              {counts}
            </Text>
          );
        })}
      </View>
      {server?.stoppedAt ? (
        <Text style={styles.stopped} testID="upload-stopped">
          {stopWords(server.stoppedAt)}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  track: { height: 12, borderRadius: radius.pill, backgroundColor: colors.surfaceSunken, overflow: 'hidden' },
  fill: { height: '100%', backgroundColor: colors.action, borderRadius: radius.pill },
  words: { ...type.bodyStrong, color: colors.text },
  note: { ...type.caption, color: colors.textMuted },
  phases: { gap: space.xs },
  phase: { ...type.body, color: colors.text },
  current: { ...type.bodyStrong },
  waiting: { color: colors.textMuted },
  stopped: { ...type.bodyStrong, color: colors.danger },
});
