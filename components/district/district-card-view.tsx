import { useEffect, useState, type ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';

import { DistrictAlertsList } from '@/components/alerts/district-alerts-list';
import { SubscribeToggle, type SubscribeToggleProps } from '@/components/alerts/subscribe-toggle';
import { CurveChart } from '@/components/chart/curve-chart';
import { PathChart } from '@/components/chart/path-chart';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { StatePanel } from '@/components/state/state-panel';
import { colors, layout, radius, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { briefPdfPath } from '@/hooks/use-briefs';
import { ApiError } from '@/lib/api-client';
import { runUnits } from '@/lib/units';
import type { DistrictDetailResponse } from '@/contracts/districts';
import type { DistrictAlertsResponse } from '@/contracts/alerts';
import type { DistrictEstimateResponse, DistrictHistoryResponse } from '@/contracts/estimates';

import { CardTabs, type CardTab } from './card-tabs';
import { CautionNote } from './caution-note';
import { DistrictCardSkeleton } from './district-card-skeleton';
import { coverageText } from './district-summary-text';
import { ExternalLink } from './external-link';
import { FreshnessNotice, type Freshness } from './freshness-notice';
import { HeadlinePanel } from './headline-panel';
import { HistoryList } from './history-list';
import { KeyFigures } from './key-figures';
import { LocatorMap } from './locator-map';
import { TrackRows } from './track-rows';
import { SensitivityStrip } from './sensitivity-strip';
import { SeriesTable } from './series-table';

export type DistrictCardViewProps = {
  code: string;
  estimate: QueryState<DistrictEstimateResponse> & Freshness;
  detail: QueryState<DistrictDetailResponse>;
  history: QueryState<DistrictHistoryResponse>;
  alerts: QueryState<DistrictAlertsResponse>;
  subscribe: Omit<SubscribeToggleProps, 'code' | 'name'>;
  /** Phone layout: a link back to the region list above the content. */
  showBackLink: boolean;
  /** Show another track's full card (puts it in the URL and remembers it on the device). */
  onChooseTrack?: (code: string) => void;
  /** The Refresh control, at the top of the card. */
  refresh?: ReactNode;
};

/**
 * The district card: headline and standing, key figures and the model line, the curve and
 * path charts, the sensitivity strip, then data, history and alerts, and the cautions.
 */
export function DistrictCardView(props: DistrictCardViewProps) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} testID="district-detail-scroll">
      <View style={styles.column}>
        {props.showBackLink ? (
          <TextLink
            href={props.estimate.data ? { pathname: '/', params: { track: props.estimate.data.track.code } } : '/'}
            label="All districts"
            leading="← "
          />
        ) : null}
        {props.refresh}
        <CardBody {...props} />
      </View>
    </ScrollView>
  );
}

function CardBody(props: DistrictCardViewProps): ReactNode {
  const { code, estimate, showBackLink } = props;
  if (estimate.status === 'pending') {
    if (estimate.fetchStatus === 'paused') {
      return (
        <StatePanel
          testID="district-offline"
          title="Offline"
          message={`District ${code} has not been loaded on this device yet. It will load when the connection returns.`}
        />
      );
    }
    return <DistrictCardSkeleton />;
  }
  if (estimate.status === 'error' && !estimate.data) {
    if (estimate.error instanceof ApiError && estimate.error.code === 'not_found') {
      return (
        <StatePanel
          testID="district-not-found"
          title={`No district with code ${code}`}
          message={
            showBackLink
              ? 'The code may be mistyped, or the district was renamed. Find it in the region list.'
              : 'The code may be mistyped, or the district was renamed. Pick one from the list.'
          }
        >
          {showBackLink ? <TextLink href="/" label="Go to the region list" /> : null}
        </StatePanel>
      );
    }
    return (
      <QueryErrorPanel
        testID="district-detail-error"
        what={`district ${code}`}
        error={estimate.error}
        retrying={estimate.isFetching}
        onRetry={() => void estimate.refetch()}
      />
    );
  }
  const data = estimate.data;
  if (!data) return null;
  return <LoadedCard {...props} data={data} />;
}

function LoadedCard({
  code,
  estimate,
  detail,
  history,
  alerts,
  subscribe,
  data,
  onChooseTrack,
}: DistrictCardViewProps & { data: DistrictEstimateResponse }) {
  const [tab, setTab] = useState<CardTab>('data');
  // The headline and figures paint first; the sections below the fold (sensitivity strip,
  // tabs with the yearly table) join one frame later, so they never delay the headline.
  const [lower, setLower] = useState(false);
  useEffect(() => {
    const id = requestAnimationFrame(() => setLower(true));
    return () => cancelAnimationFrame(id);
  }, []);
  const main = data.main;
  // From the answer: the main record's model, else the published run's; none without a run.
  const level = main?.model.level ?? data.run?.model.level ?? null;
  const district = detail.data?.district;
  const track = data.track;
  const units = runUnits(data.run);
  const actions = (
    <>
      <ExternalLink
        path={briefPdfPath.district(code, track.code)}
        label={`Brief: ${track.name} (PDF)`}
        accessibilityLabel={`Brief: ${track.name}, for ${data.district.name}, PDF`}
        testID="district-brief-link"
      />
      {data.tracks.length > 1 ? (
        <ExternalLink
          path={briefPdfPath.summary(code)}
          label="All indicators (PDF)"
          accessibilityLabel={`All indicators: summary brief for ${data.district.name}, PDF`}
          testID="district-summary-brief-link"
        />
      ) : null}
      <SubscribeToggle code={code} name={data.district.name} {...subscribe} />
    </>
  );
  return (
    <>
      <View style={styles.header}>
        <View style={styles.titleLine}>
          <Text role="heading" aria-level={1} style={styles.name} testID="district-name">
            {data.district.name}
          </Text>
          <View style={styles.codeBadge}>
            <Text style={styles.code} accessibilityLabel={`code ${code}`}>
              {code}
            </Text>
          </View>
        </View>
        <Text style={styles.coverage}>{district ? coverageText(district) : ' '}</Text>
      </View>
      <FreshnessNotice freshness={estimate} what="this district’s figures" />
      <TrackRows rows={data.tracks} chosen={track.code} onChoose={(c) => onChooseTrack?.(c)} />
      <Text role="heading" aria-level={2} style={styles.trackTitle} testID="card-track">
        {`${track.name} · ${track.indicator.unit}`}
      </Text>
      <LocatorMap code={code} name={data.district.name} standing={main?.standing.standing ?? 'not_estimable'} />
      {main ? (
        <>
          <HeadlinePanel
            record={main}
            actions={actions}
            incomeUnit={units.incomeUnit}
            pressure={data.run ? units.emissionsName : undefined}
          />
          {data.correction ? (
            <View style={styles.analystNote} testID="correction-notice">
              <Text style={styles.noteTerm}>Correction</Text>
              <Text style={styles.noteText}>{data.correction.text}</Text>
            </View>
          ) : null}
          {data.note ? (
            <View style={styles.analystNote} testID="analyst-note">
              <Text style={styles.noteTerm}>Analyst’s note</Text>
              <Text style={styles.noteText}>{data.note.note}</Text>
            </View>
          ) : null}
          <KeyFigures record={main} run={data.run} />
          <CurveChart record={main} units={units} />
          <PathChart record={main} units={units} />
          {lower ? (
            <Section title="How fragile is the threshold?">
              <SensitivityStrip main={main} variants={data.variants} />
            </Section>
          ) : null}
        </>
      ) : (
        <StatePanel
          testID="no-published-estimate"
          title={data.run ? 'No published estimate yet' : `No published run for ${track.name} yet`}
          message={
            data.run
              ? `This district was not part of ${track.name}’s latest published run. Its yearly values are below.`
              : `${track.name} has no published run yet. Once an analyst reviews and publishes one, its standing, threshold and charts appear here.`
          }
        >
          <SubscribeToggle code={code} name={data.district.name} {...subscribe} />
        </StatePanel>
      )}
      {lower ? (
        <View style={styles.section}>
          <CardTabs
            current={tab}
            onChange={setTab}
            counts={{ history: history.data?.history.length, alerts: alerts.data?.alerts.length }}
          />
          <View role="tabpanel" testID={`tabpanel-${tab}`}>
            {tab === 'data' ? <DataSection code={code} detail={detail} /> : null}
            {tab === 'history' ? <HistoryList history={history} level={level} /> : null}
            {tab === 'alerts' ? <DistrictAlertsList alerts={alerts} /> : null}
          </View>
        </View>
      ) : null}
      <CautionNote />
    </>
  );
}

function DataSection({ code, detail }: { code: string; detail: QueryState<DistrictDetailResponse> }) {
  if (detail.status === 'pending') return <Text style={styles.muted}>Loading the yearly values…</Text>;
  if (detail.status === 'error' && !detail.data) {
    return (
      <QueryErrorPanel
        testID="district-series-error"
        what={`the yearly values of ${code}`}
        error={detail.error}
        retrying={detail.isFetching}
        onRetry={() => void detail.refetch()}
      />
    );
  }
  const data = detail.data!;
  if (data.series.length === 0) {
    return (
      <StatePanel
        testID="district-series-empty"
        title="No yearly values yet"
        message="This district is registered but has no observations. They appear once an upload with its series is applied."
      />
    );
  }
  return <SeriesTable districtName={data.district.name} series={data.series} indicators={data.indicators} />;
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.section}>
      <Text role="heading" aria-level={2} style={styles.sectionTitle}>
        {title}
      </Text>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: layout.detailMaxWidth, gap: space.xl },
  header: { gap: space.xs },
  titleLine: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.md },
  name: { ...type.display, color: colors.text },
  codeBadge: {
    borderColor: colors.action,
    borderWidth: 1,
    borderRadius: radius.pill,
    paddingHorizontal: space.sm,
    paddingVertical: space.xxs,
  },
  code: { ...type.label, color: colors.action },
  coverage: { ...type.body, color: colors.textMuted },
  section: { gap: space.md },
  trackTitle: { ...type.title, color: colors.text },
  sectionTitle: { ...type.title, color: colors.text },
  analystNote: { borderLeftWidth: 3, borderLeftColor: colors.action, paddingLeft: space.md, gap: space.xxs },
  noteTerm: { ...type.label, color: colors.text },
  noteText: { ...type.body, color: colors.text },
  muted: { ...type.body, color: colors.textMuted },
});
