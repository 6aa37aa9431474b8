/**
 * The project's own lint rules (eslint/plugin.js) through the real config (eslint.config.js):
 * SQL only in stores, and api/ features talking through services. Each case lints a small
 * source text as if it were a file of the tree, so the file globs and the pending lists
 * are part of what is checked.
 */
import { ESLint } from 'eslint';
import fs from 'node:fs';
import path from 'node:path';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const graph = require('../../eslint/import-graph');
// eslint-disable-next-line @typescript-eslint/no-require-imports
const pending = require('../../eslint/pending');

const root = path.resolve(__dirname, '..', '..');
// The config object itself: ESLint's own loader uses a dynamic import, which jest's VM refuses.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const eslint = new ESLint({ cwd: root, overrideConfigFile: true, overrideConfig: require('../../eslint.config.js') });

/** The ids of the Crestwatch rules that fire on `code` placed at `file`. */
async function ours(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result.messages.filter((m) => m.ruleId?.startsWith('crestwatch/')).map((m) => `${m.ruleId}:${m.line}`);
}

describe('crestwatch/sql-in-stores', () => {
  const knexType = `import type { Knex } from 'knex';\n`;

  it('fails a Knex query in a service and accepts it in the store', async () => {
    const code = `${knexType}export const all = (db: Knex) => db('alerts').select('id');\n`;
    expect(await ours('api/alerts/service.ts', code)).toEqual(['crestwatch/sql-in-stores:2']);
    expect(await ours('api/alerts/store.ts', code)).toEqual([]);
    expect(await ours('api/runs/data-store.ts', code)).toEqual([]);
  });

  it('fails trx(…), .raw(…) and a pg .query(…) outside stores, in routers too', async () => {
    const code = [
      knexType,
      `export async function f(db: Knex, conn: { query(sql: string): Promise<unknown> }) {`,
      `  await db.transaction(async (trx) => trx('outbox').del());`,
      `  await db.raw('SELECT 1');`,
      `  await conn.query('SELECT 1');`,
      `}`,
    ].join('\n');
    expect(await ours('api/health/router.ts', code)).toEqual([
      'crestwatch/sql-in-stores:4',
      'crestwatch/sql-in-stores:5',
      'crestwatch/sql-in-stores:6',
    ]);
  });

  it('fails a Knex value import but not a type-only one', async () => {
    expect(await ours('api/specs/service.ts', `import knex from 'knex';\nexport const k = knex;\n`)).toEqual([
      'crestwatch/sql-in-stores:1',
    ]);
    expect(await ours('api/specs/service.ts', `import { type Knex } from 'knex';\nexport type K = Knex;\n`)).toEqual(
      [],
    );
    expect(await ours('api/specs/service.ts', `${knexType}export type K = Knex;\n`)).toEqual([]);
  });

  it('leaves migrations, scripts, tests and benchmarks alone', async () => {
    const code = `${knexType}export const all = (db: Knex) => db('alerts').select('id');\n`;
    for (const file of [
      'migrations/20990101000000_add_thing.ts',
      'scripts/db.ts',
      'tests/api/x.test.ts',
      'bench/run.ts',
    ]) {
      expect(await ours(file, code)).toEqual([]);
    }
  });
});

describe('crestwatch/feature-boundaries', () => {
  it("fails an import of another feature's store and accepts its service", async () => {
    expect(
      await ours('api/alerts/service.ts', `import * as s from '../subscriptions/store';\nexport const x = s;\n`),
    ).toEqual(['crestwatch/feature-boundaries:1']);
    expect(
      await ours('api/alerts/service.ts', `import * as s from '../subscriptions/service';\nexport const x = s;\n`),
    ).toEqual([]);
  });

  it('fails an import that makes two feature folders import each other', async () => {
    // estimates/service.ts imports districts/service.ts on disk, so districts may not import estimates.
    expect(
      await ours(
        'api/districts/service.ts',
        `import { region } from '../estimates/service';\nexport const r = region;\n`,
      ),
    ).toEqual(['crestwatch/feature-boundaries:1']);
  });

  it('fails a shared leaf module that imports a feature', async () => {
    expect(
      await ours(
        'api/http/params.ts',
        `import { districtByCode } from '../districts/service';\nexport const f = districtByCode;\n`,
      ),
    ).toEqual(['crestwatch/feature-boundaries:1']);
  });
});

describe('pending lists (they only shrink: an entry whose file was fixed must go)', () => {
  const edges = graph.crossFolderEdges(graph.readApiSources());
  const folders = graph.folderGraph(edges);

  it('lists nothing: every api/ file keeps its SQL in stores and talks to other features through their services', () => {
    expect(pending.SQL_OUTSIDE_STORES).toEqual([]);
    expect(pending.FOREIGN_STORE_IMPORTS).toEqual([]);
    expect(pending.MUTUAL_FOLDER_IMPORTS).toEqual([]);
    expect(graph.mutualPairs(folders)).toEqual([]);
  });

  it('an entry added back must still break its rule', () => {
    for (const file of pending.SQL_OUTSIDE_STORES as string[]) {
      expect(fs.readFileSync(path.join(root, file), 'utf8')).toMatch(/\b(db|trx)\(|\.(raw|query)\(/);
    }
    for (const entry of pending.FOREIGN_STORE_IMPORTS as string[]) {
      const [from, to] = entry.split(' -> ').map((p) => p.replace(/^api\//, ''));
      expect(edges.some((e: { from: string; to: string }) => e.from === from && e.to === to)).toBe(true);
    }
    for (const pair of pending.MUTUAL_FOLDER_IMPORTS as string[]) expect(graph.mutualPairs(folders)).toContain(pair);
  });
});
