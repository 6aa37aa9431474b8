import Head from 'expo-router/head';
import { useEffect, useState, type ReactElement } from 'react';
import { StyleSheet, View } from 'react-native';

import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { space } from '@/components/theme';
import { Button } from '@/components/ui/button';

import { Page } from './page';

/**
 * Where a group of screens comes from: `ready` where they ship with the app (native, the
 * component tests), `load` where they are a chunk fetched on demand (web).
 */
export type PageSource<P> = { ready: P } | { load: () => Promise<P> };

type Loaded<P> = { pages: P } | { error: unknown };

/** One fetch per source, shared by every route that uses it; a failed fetch is forgotten. */
const fetches = new WeakMap<object, Promise<unknown>>();
const loaded = new WeakMap<object, unknown>();

function fetchPages<P>(source: { load: () => Promise<P> }): Promise<P> {
  let pending = fetches.get(source) as Promise<P> | undefined;
  if (!pending) {
    pending = source.load().then(
      (pages) => {
        loaded.set(source, pages);
        return pages;
      },
      (error: unknown) => {
        fetches.delete(source);
        throw error;
      },
    );
    fetches.set(source, pending);
  }
  return pending;
}

/**
 * The route component for screen `name` of a group. Where the group ships with the app it
 * is the screen itself. Where it loads on demand, the route shows the screen's title and a
 * loading placeholder until the chunk arrives (also what the static page holds), then the
 * screen; a failed fetch says so and offers to try again. Once a group has loaded, its
 * other screens render at once.
 */
/** A route's screen: a component of no props. */
export type Screen = () => ReactElement;

export function onDemandPage<K extends string, P extends Record<K, Screen>>(
  source: PageSource<P>,
  name: K,
  title: string,
): Screen {
  if ('ready' in source) return source.ready[name];
  const from = source;
  function OnDemandPage() {
    const [state, setState] = useState<Loaded<P> | null>(() =>
      loaded.has(from) ? { pages: loaded.get(from) as P } : null,
    );
    useEffect(() => {
      if (state) return;
      let live = true;
      fetchPages(from).then(
        (pages) => live && setState({ pages }),
        (error: unknown) => live && setState({ error }),
      );
      return () => {
        live = false;
      };
    }, [state]);
    if (state && 'pages' in state) {
      const Loaded: Screen = state.pages[name];
      return <Loaded />;
    }
    return (
      <>
        <Head>
          <title>{`${title} · Crestwatch`}</title>
        </Head>
        <Page title={title}>
          {state ? (
            <StatePanel
              tone="alert"
              title="This screen could not be loaded"
              message="Its code did not arrive. Check the connection, then try again."
              testID="on-demand-failed"
            >
              <Button label="Try again" onPress={() => setState(null)} />
            </StatePanel>
          ) : (
            <View
              role="progressbar"
              aria-label={`Loading ${title.toLowerCase()}`}
              style={styles.loading}
              testID="on-demand-loading"
            >
              <Skeleton width="100%" height={120} />
            </View>
          )}
        </Page>
      </>
    );
  }
  OnDemandPage.displayName = `OnDemandPage(${String(name)})`;
  return OnDemandPage;
}

const styles = StyleSheet.create({
  loading: { gap: space.md },
});
