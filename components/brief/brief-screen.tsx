import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { space } from '@/components/theme';
import { ApiError } from '@/lib/api-client';
import type { BriefPaperSize } from '@/contracts/briefs';

import { BriefFrame } from './brief-frame';

export type BriefScreenProps<T extends { pdfPath: string; paperSize: BriefPaperSize }> = {
  query: QueryState<T>;
  /** "the district brief of D07", for titles and the PDF link */
  what: string;
  /** The PDF path, known before the content arrives (so the PDF link works while loading). */
  pdfPath: string;
  back?: ReactNode;
  children: (content: T) => ReactNode;
};

function BriefSkeleton() {
  return (
    <View role="progressbar" style={styles.skeleton} aria-label="Loading the brief" testID="brief-loading">
      <Skeleton width="40%" height={14} />
      <Skeleton width="70%" height={28} />
      <Skeleton width="100%" height={44} />
      <Skeleton width="100%" height={120} />
      <Skeleton width="100%" height={200} />
    </View>
  );
}

/** A brief's loading, empty and error states around its print view. */
export function BriefScreen<T extends { pdfPath: string; paperSize: BriefPaperSize }>({
  query,
  what,
  pdfPath,
  back,
  children,
}: BriefScreenProps<T>) {
  let body: ReactNode;
  if (query.status === 'pending') body = <BriefSkeleton />;
  else if (query.status === 'error') {
    const e = query.error;
    if (e instanceof ApiError && e.code === 'no_published_run') {
      body = (
        <StatePanel
          testID="brief-nothing-published"
          title="No brief yet"
          message="Briefs are made from published runs, and none has been published. Ask an analyst to publish a run."
        />
      );
    } else if (e instanceof ApiError && (e.code === 'not_found' || e.code === 'not_in_run')) {
      body = <StatePanel testID="brief-not-found" title={`No ${what}`} message={e.message} />;
    } else {
      body = (
        <QueryErrorPanel
          testID="brief-error"
          what={what}
          error={e}
          retrying={query.isFetching}
          onRetry={() => void query.refetch()}
        />
      );
    }
  } else if (query.data) body = children(query.data);
  return (
    <BriefFrame
      pdfPath={query.data?.pdfPath ?? pdfPath}
      what={what}
      paperSize={query.data?.paperSize ?? 'A4'}
      back={back}
    >
      {body}
    </BriefFrame>
  );
}

const styles = StyleSheet.create({
  skeleton: { gap: space.md },
});
