import Head from 'expo-router/head';

import { SpecsRouteBody } from './[id]';

/** The saved model specs, none open. */
export default function SpecsIndexRoute() {
  return (
    <>
      <Head>
        <title>Model specs · Crestwatch</title>
      </Head>
      <SpecsRouteBody selected={null} />
    </>
  );
}
