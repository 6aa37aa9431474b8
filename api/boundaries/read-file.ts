/**
 * Reading a boundary file, the part that needs no database: parse the JSON in slices with
 * its limits (json-reader.ts), then the GeoJSON checks (check-features.ts). Plain data in
 * and out, so it runs in a compute pool thread (api/compute/tasks.ts, task
 * 'boundary-read') and a hostile file never holds the event loop that answers every
 * other request; the demo seed calls it inline.
 */
import { checkFeatures, type FeatureCheck } from './check-features';
import { JsonReadError, readJsonFile } from './json-reader';

export type BoundaryRead =
  | { ok: true; check: FeatureCheck }
  /** the file is not readable JSON, or breaks a reader limit; `reason` names the line and column */
  | { ok: false; reason: string };

export async function readBoundaryFile(path: string, codeProperty: string, maxVertices: number): Promise<BoundaryRead> {
  let root: unknown;
  try {
    root = await readJsonFile(path);
  } catch (err) {
    if (err instanceof JsonReadError) return { ok: false, reason: err.message };
    throw err;
  }
  return { ok: true, check: checkFeatures(root, codeProperty, maxVertices) };
}
