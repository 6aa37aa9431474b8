import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';

import { TextField } from '@/components/form/text-field';
import { Page } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { Button } from '@/components/ui/button';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { WORD_BREAK } from '@/components/ui/word-break';
import { formatDateTime } from '@/lib/format-time';
import type { AuditEntry, AuditFilter } from '@/contracts/people';

/** What an infinite query gives the screen. */
export type AuditPages = {
  status: 'pending' | 'error' | 'success';
  data: { pages: { entries: AuditEntry[] }[] } | undefined;
  error: unknown;
  isFetching: boolean;
  refetch: () => unknown;
  hasNextPage: boolean;
  isFetchingNextPage: boolean;
  fetchNextPage: () => unknown;
};

export type AuditLogScreenProps = {
  filter: AuditFilter;
  onFilter: (filter: AuditFilter) => void;
  entries: AuditPages;
};

/** Actions as words; unknown ones show their code. */
const ACTION_WORDS: Record<string, string> = {
  sign_in: 'Signed in',
  sign_out: 'Signed out',
  'demo.initial_publish': 'Demo: first run published',
  'person.invite': 'Invited a person',
  'person.update': 'Changed a person',
  'person.deactivate': 'Deactivated a person',
  'person.reactivate': 'Reactivated a person',
  'person.first_admin': 'First admin set',
  'person.invitation_resend': 'Re-sent an invitation',
  'person.identity_reset': 'Reset a Google identity',
  'sign_in.refused': 'Sign-in refused',
  'upload.commit': 'Loaded an upload',
  'upload.revert': 'Reverted an upload',
  'indicator.create': 'Added an indicator',
  'indicator.update': 'Changed an indicator',
  'spec.create': 'Saved a new spec',
  'spec.update': 'Changed a spec',
  'spec.archive': 'Archived a spec',
  'run.start': 'Started a run',
  'run.reproduce': 'Reproduced a run',
  'run.publish': 'Published a run',
  'run.discard': 'Discarded a run',
  'run.note': 'Added a note',
  'settings.update': 'Changed settings',
};

const QUICK: { label: string; filter: AuditFilter }[] = [
  { label: 'People', filter: { targetType: 'user' } },
  { label: 'Uploads', filter: { targetType: 'upload' } },
  { label: 'Specs', filter: { targetType: 'model_spec' } },
  { label: 'Runs', filter: { targetType: 'run' } },
  { label: 'Settings', filter: { targetType: 'settings' } },
];

/** Admin: who did what and when, with the state before and after; filter by action, person, kind and dates. */
export function AuditLogScreen({ filter, onFilter, entries }: AuditLogScreenProps) {
  const [draft, setDraft] = useState<AuditFilter>(filter);
  const set = (k: keyof AuditFilter, v: string) => setDraft((d) => ({ ...d, [k]: v }));
  const rows = entries.data?.pages.flatMap((p) => p.entries) ?? [];
  const apply = () =>
    onFilter(Object.fromEntries(Object.entries(draft).filter(([, v]) => v && v.trim())) as AuditFilter);
  return (
    <Page
      title="Audit log"
      intro="Every sign-out, invitation, role change, upload, revert, spec change, run, publish and setting change, newest first."
      testID="audit-screen"
    >
      <View style={styles.filters}>
        <View style={styles.quick}>
          {QUICK.map((q) => (
            <Button
              key={q.label}
              label={q.label}
              variant="outline"
              onPress={() => {
                setDraft(q.filter);
                onFilter(q.filter);
              }}
            />
          ))}
          <Button
            label="Everything"
            variant="outline"
            onPress={() => {
              setDraft({});
              onFilter({});
            }}
          />
        </View>
        <View style={styles.row}>
          <Cell>
            <TextField
              label="Action"
              value={draft.action ?? ''}
              onChangeText={(v) => set('action', v)}
              placeholder="e.g. person.invite"
              testID="audit-action"
              onSubmitEditing={apply}
            />
          </Cell>
          <Cell>
            <TextField
              label="Person (e-mail contains)"
              value={draft.actor ?? ''}
              onChangeText={(v) => set('actor', v)}
              placeholder="e.g. analyst"
              testID="audit-actor"
              onSubmitEditing={apply}
            />
          </Cell>
          <Cell>
            <TextField
              label="Kind of target"
              value={draft.targetType ?? ''}
              onChangeText={(v) => set('targetType', v)}
              placeholder="user, upload, model_spec, run, settings"
              testID="audit-target"
              onSubmitEditing={apply}
            />
          </Cell>
          <Cell>
            <TextField
              label="From (date)"
              value={draft.since ?? ''}
              onChangeText={(v) => set('since', v)}
              placeholder="YYYY-MM-DD"
              testID="audit-since"
              onSubmitEditing={apply}
            />
          </Cell>
          <Cell>
            <TextField
              label="Before (date)"
              value={draft.until ?? ''}
              onChangeText={(v) => set('until', v)}
              placeholder="YYYY-MM-DD"
              testID="audit-until"
              onSubmitEditing={apply}
            />
          </Cell>
        </View>
        <Button label="Filter" onPress={apply} testID="audit-apply" />
      </View>
      {entries.status === 'pending' ? (
        <Skeleton width="100%" height={240} />
      ) : entries.status === 'error' && rows.length === 0 ? (
        <QueryErrorPanel
          what="the audit log"
          error={entries.error}
          retrying={entries.isFetching}
          onRetry={() => void entries.refetch()}
          testID="audit-error"
        />
      ) : rows.length === 0 ? (
        <StatePanel testID="audit-empty" title="Nothing recorded" message="No entry matches these filters." />
      ) : (
        <View style={styles.list} testID="audit-list">
          {rows.map((e) => (
            <AuditRow key={e.id} entry={e} />
          ))}
          {entries.hasNextPage ? (
            <Button
              label="Show older entries"
              variant="outline"
              busy={entries.isFetchingNextPage}
              busyLabel="Loading…"
              onPress={() => void entries.fetchNextPage()}
            />
          ) : (
            <Text style={styles.end}>That is the oldest entry.</Text>
          )}
        </View>
      )}
    </Page>
  );
}

function Cell({ children }: { children: React.ReactNode }) {
  return <View style={styles.cell}>{children}</View>;
}

function summaryOfChange(before: unknown, after: unknown): string[] {
  const b = (before && typeof before === 'object' ? before : {}) as Record<string, unknown>;
  const a = (after && typeof after === 'object' ? after : {}) as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])];
  const show = (v: unknown) => (v === undefined ? '—' : typeof v === 'string' ? v : JSON.stringify(v));
  return keys
    .filter((k) => JSON.stringify(b[k]) !== JSON.stringify(a[k]))
    .map((k) => (before ? `${k}: ${show(b[k])} → ${show(a[k])}` : `${k}: ${show(a[k])}`));
}

function AuditRow({ entry }: { entry: AuditEntry }) {
  const [open, setOpen] = useState(false);
  const changes = summaryOfChange(entry.before, entry.after);
  const action = ACTION_WORDS[entry.action] ?? entry.action;
  const meta = `${formatDateTime(entry.at)} · ${entry.actorEmail ?? 'system'} · ${entry.targetType}${entry.targetId ? ` #${entry.targetId}` : ''}`;
  const toggle = changes.length ? (open ? 'Hide' : 'Details') : null;
  return (
    <View style={styles.entry} testID={`audit-${entry.id}`}>
      <Pressable
        accessibilityRole="button"
        aria-expanded={open}
        // Starts with the words the row shows, in order (WCAG 2.2 SC 2.5.3 Label in Name).
        accessibilityLabel={`${action}, ${meta}${toggle ? `, ${toggle}: ${open ? 'hide' : 'show'} the changes` : ''}`}
        onPress={() => setOpen((o) => !o)}
        disabled={changes.length === 0}
        style={(s: InteractionState) => [styles.entryHead, s.hovered && styles.hover, focusOutline(s, 'inside')]}
      >
        <View style={styles.entryWords}>
          <Text style={styles.action}>
            {action} <Text style={styles.code}>({entry.action})</Text>
            {WORD_BREAK}
          </Text>
          <Text style={styles.meta}>
            {meta}
            {WORD_BREAK}
          </Text>
        </View>
        {toggle ? <Text style={styles.toggle}>{toggle}</Text> : null}
      </Pressable>
      {open ? (
        <View style={styles.details}>
          {changes.map((c, i) => (
            <Text key={i} style={styles.change} numberOfLines={3}>
              {c}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.md },
  quick: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  cell: { flexGrow: 1, flexBasis: 180 },
  list: { gap: space.xs },
  entry: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  entryHead: { flexDirection: 'row', alignItems: 'center', gap: space.md, padding: space.md, minHeight: 56 },
  hover: { backgroundColor: colors.selected },
  entryWords: { flex: 1, gap: space.xxs },
  action: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  code: { ...type.caption, color: colors.textMuted },
  meta: { ...type.caption, color: colors.textMuted },
  toggle: { ...type.label, color: colors.link, textDecorationLine: 'underline' },
  details: { paddingHorizontal: space.md, paddingBottom: space.md, gap: space.xxs },
  change: { ...type.caption, fontVariant: ['tabular-nums'], color: colors.text },
  end: { ...type.caption, color: colors.textMuted, paddingVertical: space.sm },
});
