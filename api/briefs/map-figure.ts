/**
 * The brief's maps as vector scenes, built from the same scene as the region view
 * (lib/map-scene.ts): the standings map (one path per standing, the borders, each
 * district's standing mark at its inside point, so the map reads in black and white) and
 * the district's locator (the district in its standing's tint, outlined, among its
 * neighbours). The PDF and the app's SVG draw them alike.
 */
import type { ChartItem, ChartScene } from '../../contracts/briefs';
import type { Standing } from '../../contracts/estimates';
import { buildMapScene, type BoundaryCollection } from '../../lib/map-scene';

const KNOWN: readonly Standing[] = ['approaching', 'at_turn', 'past_turn', 'no_turn', 'not_estimable'];
const asStanding = (s: string | undefined): Standing =>
  KNOWN.includes(s as Standing) ? (s as Standing) : 'not_estimable';

/** Each standing's mark as a path (the shapes of components/region/standing-mark.tsx). */
export function markPath(standing: Standing, x: number, y: number, size: number): { d: string; filled: boolean } {
  const h = size / 2;
  const f = (v: number) => Math.round(v * 10) / 10;
  switch (standing) {
    case 'approaching':
      return { d: `M${f(x - h)},${f(y + h)}L${f(x + h)},${f(y + h)}L${f(x)},${f(y - h)}Z`, filled: true };
    case 'past_turn':
      return { d: `M${f(x - h)},${f(y - h)}L${f(x + h)},${f(y - h)}L${f(x)},${f(y + h)}Z`, filled: true };
    case 'at_turn':
      return { d: `M${f(x)},${f(y - h)}L${f(x + h)},${f(y)}L${f(x)},${f(y + h)}L${f(x - h)},${f(y)}Z`, filled: true };
    case 'no_turn':
      return {
        d: `M${f(x - h)},${f(y - size / 6)}L${f(x + h)},${f(y - size / 6)}L${f(x + h)},${f(y + size / 6)}L${f(x - h)},${f(y + size / 6)}Z`,
        filled: true,
      };
    default:
      return {
        d: `M${f(x - h)},${f(y)}A${f(h)},${f(h)} 0 1,0 ${f(x + h)},${f(y)}A${f(h)},${f(h)} 0 1,0 ${f(x - h)},${f(y)}Z`,
        filled: false,
      };
  }
}

export function standingsMapScene(
  fc: BoundaryCollection,
  standings: Map<string, string>,
  width: number,
  height: number,
): ChartScene | null {
  if (!fc.features.length) return null;
  const scene = buildMapScene({
    collection: fc,
    standingOf: (c) => asStanding(standings.get(c)),
    width,
    height,
    pad: 4,
  });
  const items: ChartItem[] = [];
  for (const f of scene.fills) items.push({ kind: 'path', d: f.d, fill: `${f.standing}_fill` });
  items.push({ kind: 'path', d: scene.borders, stroke: 'sea', width: 0.6 });
  const size = Math.max(4, Math.min(7, Math.sqrt((width * height) / Math.max(1, scene.districts.length)) / 4));
  for (const d of scene.districts) {
    if (d.box[2] - d.box[0] < size * 1.6 || d.box[3] - d.box[1] < size * 1.6) continue;
    const m = markPath(d.standing, d.x, d.y, size);
    items.push(
      m.filled ? { kind: 'path', d: m.d, fill: d.standing } : { kind: 'path', d: m.d, stroke: d.standing, width: 1 },
    );
  }
  const counts = scene.fills.map((f) => `${f.count} ${f.standing.replace('_', ' ')}`).join(', ');
  return {
    width,
    height,
    title: 'Standings across the region',
    description: `Map of ${scene.districts.length} districts filled by standing, each with its standing's mark: ${counts}.`,
    items,
  };
}

export function locatorScene(
  fc: BoundaryCollection,
  code: string,
  standing: string,
  name: string,
  width: number,
  height: number,
): ChartScene | null {
  if (!fc.features.some((f) => f.properties.code === code)) return null;
  const s = asStanding(standing);
  const scene = buildMapScene({ collection: fc, standingOf: () => s, width, height, pad: 3, highlight: code });
  return {
    width,
    height,
    title: 'Where the district lies',
    description: `Map of the region with ${name} outlined among its ${scene.districts.length - 1} neighbours.`,
    items: [
      { kind: 'path', d: scene.borders, fill: 'land', stroke: 'sea', width: 0.5 },
      { kind: 'path', d: scene.highlight!, fill: `${s}_fill`, stroke: 'ink', width: 1.2 },
    ],
  };
}
