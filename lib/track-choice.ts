// Which track the region view and the district card show. The URL's `?track=` wins over
// the track remembered on this device, which wins over the headline track. A code that is
// not (or no longer) an open track is passed over.
import { isTrackCode } from '@/contracts/patterns';
import type { Track } from '@/contracts/tracks';

/** The key under which the device remembers the last chosen track (the page's head script reads it too). */
export const TRACK_MEMORY_KEY = 'crestwatch.track';

/** Tracks officials see: active and paused ones (archived tracks leave their screens), the headline first. */
export function shownTracks(tracks: readonly Track[]): Track[] {
  return tracks.filter((t) => t.state !== 'archived').sort((a, b) => Number(b.headline) - Number(a.headline));
}

function clean(code: string | null | undefined): string | null {
  return typeof code === 'string' && isTrackCode(code) ? code : null;
}

/**
 * The track to ask the API for. Before the track list has arrived, the URL's or the
 * device's code is used as it stands (null: the server's headline track), so the card's
 * request can start at once; once the list is known, only an open track's code is kept.
 */
export function requestedTrack(
  url: string | null | undefined,
  device: string | null | undefined,
  tracks: readonly Track[] | undefined,
): string | null {
  const candidates = [clean(url), clean(device)];
  if (!tracks) return candidates.find((c) => c !== null) ?? null;
  const open = new Set(shownTracks(tracks).map((t) => t.code));
  return candidates.find((c) => c !== null && open.has(c)) ?? null;
}

/** The track on screen: the requested one, else the headline track, else the first open one. */
export function chosenTrack(
  url: string | null | undefined,
  device: string | null | undefined,
  tracks: readonly Track[],
): Track | null {
  const open = shownTracks(tracks);
  const wanted = requestedTrack(url, device, tracks);
  return open.find((t) => t.code === wanted) ?? open.find((t) => t.headline) ?? open[0] ?? null;
}

/** `path` with `?track=` (or `&track=`) added when a track is chosen. */
export function withTrack(path: string, track: string | null | undefined): string {
  if (!track) return path;
  return `${path}${path.includes('?') ? '&' : '?'}track=${encodeURIComponent(track)}`;
}
