/**
 * The demo region's boundaries (assets/demo-data/boundaries.geojson, made by
 * geography.ts), loaded through the boundary upload itself as the demo's first boundary
 * upload, when the region has districts and no boundaries yet.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { awaitsFirstBoundaries, receiveBoundaries } from '../boundaries/service';
import { DEMO_BOUNDARY_FILE } from './geography';

export async function seedDemoBoundariesIfEmpty(
  db: Knex,
  maxVertices = 100_000,
): Promise<{ seeded: boolean; districts: number }> {
  if (!(await awaitsFirstBoundaries(db))) return { seeded: false, districts: 0 };
  const bytes = fs.readFileSync(DEMO_BOUNDARY_FILE);
  const answer = await receiveBoundaries(
    db,
    {
      path: DEMO_BOUNDARY_FILE,
      originalName: path.basename(DEMO_BOUNDARY_FILE),
      size: bytes.length,
      checksum: createHash('sha256').update(bytes).digest('hex'),
    },
    { codeProperty: 'code', commit: true, repair: false },
    { id: null, email: null },
    { maxVertices },
  );
  return { seeded: answer.committed, districts: answer.counts.matched };
}
