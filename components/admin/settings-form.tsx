import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { CheckBox } from '@/components/form/check-box';
import { ChoiceGroup } from '@/components/form/choice-group';
import { fieldErrorsOf, MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { Page, Section } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { colors, radius, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { formatDateTime, formatRelative } from '@/lib/format-time';
import type { Schedule, Settings, SettingsResponse } from '@/contracts/settings';

import { cronWords } from './cron-words';

type Draft = Record<
  | 'confidencePercent'
  | 'alpha'
  | 'thresholdShiftPercent'
  | 'uploadChangeFactor'
  | 'regionTimeZone'
  | 'regionLocale'
  | 'scheduleCron',
  string
> & {
  briefPaperSize: Settings['briefPaperSize'];
  scheduleEnabled: boolean;
};

/** A BCP 47 tag in its canonical spelling (the server also checks it has formats for it). */
function validLocale(tag: string): boolean {
  try {
    return tag !== '' && Intl.getCanonicalLocales(tag)[0] === tag;
  } catch {
    return false;
  }
}

/** "1,234.5 · 4 December 2026" in the tag's formats, or an empty sample while it is not valid. */
function localeSample(tag: string): string {
  if (!validLocale(tag.trim())) return 'not a valid tag yet';
  const day = new Intl.DateTimeFormat(tag.trim(), { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
  return `${new Intl.NumberFormat(tag.trim()).format(1234.5)} · ${day.format(Date.UTC(2026, 11, 4))}`;
}

const round = (v: number, d: number) => String(Math.round(v * 10 ** d) / 10 ** d);

function draftOf(s: Settings): Draft {
  return {
    confidencePercent: round(s.confidenceLevel * 100, 2),
    alpha: String(s.alpha),
    thresholdShiftPercent: String(s.thresholdShiftPercent),
    uploadChangeFactor: String(s.uploadChangeFactor),
    regionTimeZone: s.regionTimeZone,
    regionLocale: s.regionLocale ?? 'en-GB',
    scheduleCron: s.scheduleCron,
    briefPaperSize: s.briefPaperSize,
    scheduleEnabled: s.scheduleEnabled,
  };
}

/** The changed settings as the API wants them, or what to fix first. */
export function settingsPatch(
  saved: Settings,
  d: Draft,
): { patch: Partial<Settings>; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const num = (key: keyof Draft, text: string) => {
    const v = Number(text.trim().replace(',', '.'));
    if (text.trim() === '' || !Number.isFinite(v)) problems[key] = 'A number.';
    return v;
  };
  const level = num('confidencePercent', d.confidencePercent) / 100;
  const alpha = num('alpha', d.alpha);
  const shift = num('thresholdShiftPercent', d.thresholdShiftPercent);
  const factor = num('uploadChangeFactor', d.uploadChangeFactor);
  if (!problems.confidencePercent && (level < 0.5 || level > 0.999))
    problems.confidencePercent = 'Between 50 and 99.9.';
  if (!problems.alpha && (alpha < 0.001 || alpha > 0.5)) problems.alpha = 'Between 0.001 and 0.5.';
  if (!problems.thresholdShiftPercent && (shift < 0.1 || shift > 1000))
    problems.thresholdShiftPercent = 'Between 0.1 and 1000.';
  if (!problems.uploadChangeFactor && (factor < 1.01 || factor > 1000))
    problems.uploadChangeFactor = 'Between 1.01 and 1000.';
  if (!d.regionTimeZone.trim()) problems.regionTimeZone = 'An IANA time zone, such as Europe/Lisbon or UTC.';
  if (!validLocale(d.regionLocale.trim()))
    problems.regionLocale = 'A language tag with a region, such as en-GB, de-DE or fr-FR.';
  if (d.scheduleCron.trim().split(/\s+/).length !== 5)
    problems.scheduleCron = 'Five fields: minute hour day-of-month month day-of-week.';
  const next: Settings = {
    confidenceLevel: level,
    alpha,
    thresholdShiftPercent: shift,
    uploadChangeFactor: factor,
    regionTimeZone: d.regionTimeZone.trim(),
    regionLocale: d.regionLocale.trim(),
    briefPaperSize: d.briefPaperSize,
    scheduleCron: d.scheduleCron.trim().replace(/\s+/g, ' '),
    scheduleEnabled: d.scheduleEnabled,
  };
  const patch: Partial<Settings> = {};
  for (const key of Object.keys(next) as (keyof Settings)[]) {
    if (key === 'regionLocale' && saved.regionLocale === undefined && next.regionLocale === 'en-GB') continue;
    if (next[key] !== saved[key]) (patch as Record<string, unknown>)[key] = next[key];
  }
  return { patch, problems };
}

/** The scheduled job: when it runs, in words and as cron, and its next start. */
export function ScheduleCard({ schedule }: { schedule: Schedule }) {
  const words = cronWords(schedule.cron);
  return (
    <View style={styles.schedule} testID="schedule">
      <Text style={styles.scheduleTitle}>Quarterly re-estimation</Text>
      <Text style={styles.body}>
        {schedule.enabled ? 'Runs at ' : 'Switched off. When on, runs at '}
        {words ?? `cron “${schedule.cron}”`} ({schedule.timeZone}), one run per active track on its own spec.
      </Text>
      <Text style={styles.next} testID="schedule-next">
        {schedule.enabled && schedule.nextRunAt
          ? `Next start: ${formatDateTime(schedule.nextRunAt, schedule.timeZone)} — ${formatRelative(schedule.nextRunAt)}`
          : 'No start scheduled.'}
      </Text>
      <Text style={styles.hint}>Cron: {schedule.cron}</Text>
    </View>
  );
}

export type SettingsScreenProps = {
  settings: QueryState<SettingsResponse>;
  /** Null for roles that may read but not change them. */
  onSave: ((patch: Partial<Settings>) => Promise<SettingsResponse>) | null;
};

/** Every number the engine, alerts, uploads and briefs use, and the schedule; admins change them. */
export function SettingsScreen({ settings, onSave, children }: SettingsScreenProps & { children?: React.ReactNode }) {
  return (
    <Page
      title="Settings"
      intro="The numbers every run, alert, upload check and brief uses. Changes apply to the next run and are written to the audit log."
      testID="settings-screen"
    >
      {settings.status === 'pending' ? (
        <Skeleton width="100%" height={320} />
      ) : settings.status === 'error' || !settings.data ? (
        <QueryErrorPanel
          what="the settings"
          error={settings.error}
          retrying={settings.isFetching}
          onRetry={() => void settings.refetch()}
          testID="settings-error"
        />
      ) : (
        <SettingsBody data={settings.data} onSave={onSave} />
      )}
      {children}
    </Page>
  );
}

function SettingsBody({ data, onSave }: { data: SettingsResponse; onSave: SettingsScreenProps['onSave'] }) {
  const [draft, setDraft] = useState<Draft>(draftOf(data.settings));
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });
  // New settings from the server start a new draft (adjusted while rendering, not in an effect).
  const [draftFor, setDraftFor] = useState(data.settings);
  if (draftFor !== data.settings) {
    setDraftFor(data.settings);
    setDraft(draftOf(data.settings));
  }
  const set = <K extends keyof Draft>(k: K, v: Draft[K]) => setDraft((d) => ({ ...d, [k]: v }));
  const readOnly = onSave === null;
  const { patch } = settingsPatch(data.settings, draft);
  const dirty = Object.keys(patch).length > 0;

  const save = async () => {
    if (!onSave) return;
    const { patch: p, problems: found } = settingsPatch(data.settings, draft);
    setProblems(found);
    if (Object.keys(found).length || !Object.keys(p).length) return;
    setState({ busy: true });
    try {
      await onSave(p);
      setState({
        busy: false,
        success: `Saved: ${Object.keys(p).length} ${Object.keys(p).length === 1 ? 'setting' : 'settings'} changed.`,
      });
    } catch (error) {
      setProblems(
        Object.fromEntries(
          Object.entries(fieldErrorsOf(error)).map(([k, v]) => [k === 'confidenceLevel' ? 'confidencePercent' : k, v]),
        ),
      );
      setState({ busy: false, error });
    }
  };

  return (
    <>
      <Section title="Schedule">
        <ScheduleCard schedule={data.schedule} />
        <View style={styles.fields}>
          <TextField
            label="When (cron, in the region’s time zone)"
            value={draft.scheduleCron}
            onChangeText={(v) => set('scheduleCron', v)}
            hint="minute hour day-of-month month day-of-week; the default is 0 6 1 1,4,7,10 *"
            error={problems.scheduleCron}
            editable={!readOnly}
            testID="settings-cron"
          />
          <CheckBox
            label="Start scheduled runs"
            checked={draft.scheduleEnabled}
            onChange={(v) => set('scheduleEnabled', v)}
            disabled={readOnly}
            testID="settings-enabled"
          />
          <TextField
            label="Region time zone"
            value={draft.regionTimeZone}
            onChangeText={(v) => set('regionTimeZone', v)}
            hint="IANA name, e.g. Europe/Lisbon; also used for dates on briefs"
            error={problems.regionTimeZone}
            editable={!readOnly}
            testID="settings-tz"
          />
          <TextField
            label="Region locale"
            value={draft.regionLocale}
            onChangeText={(v) => set('regionLocale', v)}
            hint={`BCP 47 tag, e.g. en-GB, de-DE, fr-FR: number and date formats on every screen and brief (${localeSample(draft.regionLocale)})`}
            error={problems.regionLocale}
            editable={!readOnly}
            testID="settings-locale"
          />
        </View>
      </Section>
      <Section title="Estimation and alerts">
        <View style={styles.grid}>
          <Cell>
            <TextField
              label="Confidence level (%)"
              value={draft.confidencePercent}
              onChangeText={(v) => set('confidencePercent', v)}
              keyboardType="decimal-pad"
              hint="Intervals of thresholds; default 95"
              error={problems.confidencePercent}
              editable={!readOnly}
              testID="settings-level"
            />
          </Cell>
          <Cell>
            <TextField
              label="Test level α"
              value={draft.alpha}
              onChangeText={(v) => set('alpha', v)}
              keyboardType="decimal-pad"
              hint="U-test, Wald test and shapes; default 0.05"
              error={problems.alpha}
              editable={!readOnly}
              testID="settings-alpha"
            />
          </Cell>
          <Cell>
            <TextField
              label="Threshold shift alert (%)"
              value={draft.thresholdShiftPercent}
              onChangeText={(v) => set('thresholdShiftPercent', v)}
              keyboardType="decimal-pad"
              hint="Alert when a threshold moves more than this; default 10"
              error={problems.thresholdShiftPercent}
              editable={!readOnly}
              testID="settings-shift"
            />
          </Cell>
          <Cell>
            <TextField
              label="Upload change factor (×)"
              value={draft.uploadChangeFactor}
              onChangeText={(v) => set('uploadChangeFactor', v)}
              keyboardType="decimal-pad"
              hint="Warn when a stored value changes by more than this factor"
              error={problems.uploadChangeFactor}
              editable={!readOnly}
              testID="settings-factor"
            />
          </Cell>
        </View>
      </Section>
      <Section title="Briefs">
        <ChoiceGroup
          label="Paper size"
          choices={[
            { value: 'A4', label: 'A4' },
            { value: 'LETTER', label: 'US Letter' },
          ]}
          value={draft.briefPaperSize}
          onChange={(v) => set('briefPaperSize', v)}
          disabled={readOnly}
        />
      </Section>
      {readOnly ? (
        <Text style={styles.hint} testID="settings-read-only">
          Only admins change settings; ask one if a number should change.
        </Text>
      ) : (
        <View style={styles.actions}>
          <Button
            label="Save settings"
            busy={state.busy}
            busyLabel="Saving…"
            disabled={!dirty}
            onPress={() => void save()}
            testID="settings-save"
          />
          {dirty ? (
            <Button
              label="Undo changes"
              variant="outline"
              onPress={() => {
                setDraft(draftOf(data.settings));
                setProblems({});
              }}
            />
          ) : null}
        </View>
      )}
      <MutationNotice error={state.error} success={state.success} testID="settings" />
    </>
  );
}

function Cell({ children }: { children: React.ReactNode }) {
  return <View style={styles.cell}>{children}</View>;
}

const styles = StyleSheet.create({
  schedule: {
    gap: space.xs,
    backgroundColor: colors.selected,
    borderLeftWidth: 4,
    borderLeftColor: colors.selectedRule,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  scheduleTitle: { ...type.title, color: colors.text },
  body: { ...type.body, color: colors.text },
  next: { ...type.bodyStrong, color: colors.text },
  hint: { ...type.caption, color: colors.textMuted },
  fields: { gap: space.md, maxWidth: 560 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  cell: { flexGrow: 1, flexBasis: 240, maxWidth: 420 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
});
