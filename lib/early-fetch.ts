// Data requests started by a small inline script in the page's <head>, while the browser is
// still parsing the pre-rendered HTML — seconds before the app's JavaScript has run on a
// slow phone. The query functions take the answer from here when it is there, and fall back
// to their ordinary request (and its error handling) when it is not or did not succeed.
import { safeParse, type Schema } from '@/contracts/kit';
import { TRACK_CODE } from '@/contracts/patterns';

import { TRACK_MEMORY_KEY } from './track-choice';

import { noteOfflineCopy } from './offline-copies';

type EarlyMap = Record<string, Promise<Response> | undefined>;

/**
 * The inline script for one route: `route` is a pattern for location.pathname, `api` turns
 * its first group into the API path. Runs only while the first HTML is parsing, so a head
 * update during client-side navigation starts nothing. The track goes along as `?track=`
 * exactly as the screen will ask for it before its track list arrives
 * (lib/track-choice.ts requestedTrack): the URL's code, else the device's remembered one.
 */
export function earlyFetchScript(route: RegExp, api: (group: string) => string): string {
  const apiExpr = api('"+encodeURIComponent(m[1])+"');
  const trackExpr =
    `var r=${TRACK_CODE.toString()},t=null,c=[new URLSearchParams(location.search).get("track")];` +
    `try{c.push(localStorage.getItem("${TRACK_MEMORY_KEY}"))}catch(e){}` +
    `for(var i=0;i<c.length;i++){if(c[i]&&r.test(c[i])){t=c[i];break}}` +
    `if(t)p+="?track="+encodeURIComponent(t);`;
  return (
    `(function(){try{if(document.readyState!=="loading")return;var m=location.pathname.match(${route.toString()});` +
    `if(!m)return;var p="${apiExpr}";${trackExpr}(window.__cwEarly=window.__cwEarly||{})[p]=` +
    `fetch(p,{credentials:"same-origin",headers:{Accept:"application/json"}});}catch(e){}})();`
  );
}

/** The early answer for `path` once, decoded and read through its contract; null when there is none to use. */
export async function earlyJson<T>(path: string, schema: Schema<T>): Promise<T | null> {
  const map = typeof window === 'undefined' ? undefined : (window as unknown as { __cwEarly?: EarlyMap }).__cwEarly;
  const pending = map?.[path];
  if (!pending) return null;
  delete map![path];
  try {
    const res = await pending;
    if (!res.ok) return null;
    const parsed = safeParse(schema, await res.json());
    if (!parsed.success) return null;
    noteOfflineCopy(parsed.data, res.headers);
    return parsed.data;
  } catch {
    return null;
  }
}
