import { QueryClientProvider } from '@tanstack/react-query';
import { Slot, useGlobalSearchParams, usePathname, useRouter, type ErrorBoundaryProps } from '@/lib/router';
import { useState } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';

import { AlertsFeedColumn } from '@/components/alerts/alerts-feed-column';
import { DistrictListPanel } from '@/components/district/district-list-panel';
import { HeaderArea } from '@/components/layout/header-area';
import { isRegionRoute } from '@/components/layout/nav-items';
import { RegionShell } from '@/components/layout/region-shell';
import { TrackSwitcher } from '@/components/region/track-switcher';
import { ServerNotice } from '@/components/layout/server-notice';
import { UpdateNotice } from '@/components/layout/update-notice';
import { StatePanel } from '@/components/state/state-panel';
import { colors, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { useAlertFeedQuery, useMarkAlertReadMutation } from '@/hooks/use-alerts';
import { useAppFonts } from '@/hooks/use-app-fonts';
import { useAuthOptionsQuery, useMeQuery, useSignOutMutation } from '@/hooks/use-auth';
import { useHealthQuery } from '@/hooks/use-health';
import { useLayoutMode, useThirdColumn } from '@/hooks/use-layout-mode';
import { usePublishedWatch } from '@/hooks/use-published';
import { usePublishedRunQuery, useRegionDistrictsQuery } from '@/hooks/use-region';
import { useRegionLocale } from '@/hooks/use-region-locale';
import { useTrackChoice } from '@/hooks/use-tracks';
import { createQueryClient } from '@/lib/query-client';

export default function RootLayout() {
  const [queryClient] = useState(createQueryClient);
  const fontsReady = useAppFonts();
  if (!fontsReady) return <View style={styles.blank} />;
  return (
    <QueryClientProvider client={queryClient}>
      <Frame />
    </QueryClientProvider>
  );
}

function Frame() {
  const mode = useLayoutMode();
  const health = useHealthQuery();
  const me = useMeQuery();
  const authOptions = useAuthOptionsQuery();
  const pathname = usePathname();
  const router = useRouter();
  const signOut = useSignOutMutation();
  const badgeFeed = useAlertFeedQuery(me.status === 'success');
  // A run published on another device refreshes what this one shows (on focus, and each minute).
  usePublishedWatch(me.status === 'success');
  const thirdColumn = useThirdColumn();
  const { code } = useGlobalSearchParams<{ code?: string }>();
  // The list sits beside the region and its districts; staff screens and the sign-in pages
  // need the whole width (tables) or stand alone (a list there could only repeat "sign in").
  const withList = isRegionRoute(pathname);
  const withFeed = withList && mode === 'wide' && thirdColumn;
  const feed = useAlertFeedQuery(withFeed);
  const markRead = useMarkAlertReadMutation();
  // The list shows beside routes only in the wide layout; on a phone the home route has its own.
  const listShown = withList && mode === 'wide';
  // The list follows the chosen track (?track=, else the device's, else the headline).
  const choice = useTrackChoice({ enabled: listShown });
  const districts = useRegionDistrictsQuery({ enabled: listShown, track: choice.request });
  const run = usePublishedRunQuery({ enabled: listShown, track: choice.request });
  // Numbers and dates follow the region's locale (the admin setting GET /api/me carries).
  const locale = useRegionLocale();
  return (
    <RegionShell
      key={locale}
      mode={mode}
      header={
        <>
          <HeaderArea
            mode={mode}
            pathname={pathname}
            me={me}
            demo={authOptions.data?.provider === 'stand-in'}
            unreadAlerts={badgeFeed.data?.unread}
            signingOut={signOut.isPending}
            onSignOut={() => signOut.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })}
          />
          <ServerNotice health={health} />
          <UpdateNotice />
        </>
      }
      list={
        withList ? (
          <DistrictListPanel
            districts={districts}
            selectedCode={code}
            level={run.data?.model.level ?? null}
            track={choice.request}
            header={
              <TrackSwitcher
                tracks={choice.tracks}
                status={choice.status}
                chosen={choice.chosen?.code ?? null}
                onChoose={choice.choose}
              />
            }
          />
        ) : null
      }
      aside={withFeed ? <AlertsFeedColumn feed={feed} onRead={markRead.mutate} /> : null}
    >
      <Slot />
    </RegionShell>
  );
}

/** Shown instead of the whole app when rendering throws; needs no provider or font. */
export function ErrorBoundary({ error, retry }: ErrorBoundaryProps) {
  return (
    <ScrollView style={styles.blank} contentContainerStyle={styles.errorContent}>
      <Text style={styles.errorBrand}>Crestwatch</Text>
      <StatePanel
        tone="alert"
        title="This screen stopped working"
        message={`Something went wrong while drawing it: ${error.message}`}
      >
        <Button label="Try again" onPress={() => void retry()} />
      </StatePanel>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  blank: { flex: 1, backgroundColor: colors.background },
  errorContent: { padding: space.xl, gap: space.lg, maxWidth: 640 },
  errorBrand: { ...type.title, color: colors.text },
});
