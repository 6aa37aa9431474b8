/**
 * Crestwatch's own lint rules (a local ESLint plugin):
 *
 * - `crestwatch/sql-in-stores`: SQL appears only in stores. Outside `store.ts` / `*-store.ts`
 *   (and outside migrations, scripts, tests and benchmarks, which the config leaves out) it
 *   reports a Knex value import (a type-only `import type { Knex }` is fine), a call of
 *   `db(…)` / `trx(…)`, any `.raw(…)` and a pg `.query(…)`.
 * - `crestwatch/feature-boundaries`: in api/, no feature imports another feature's store,
 *   no two feature folders import each other, and the shared leaf folders import no feature.
 *
 * Files that still break a rule are listed in ./pending.js, a list that only shrinks.
 */
const path = require('node:path');
const graph = require('./import-graph');
const pending = require('./pending');

const ROOT = path.resolve(__dirname, '..');
const rel = (filename) => path.relative(ROOT, filename).split(path.sep).join('/');

const QUERY_CALLEES = new Set(['db', 'trx']);
const QUERY_METHODS = new Set(['raw', 'query']);

const sqlInStores = {
  meta: {
    type: 'problem',
    docs: { description: 'SQL (Knex or pg) only in store.ts / *-store.ts files' },
    schema: [],
    messages: {
      knexImport:
        "Knex is imported as a value outside a store: move the SQL into the feature's store.ts (type-only `import type { Knex }` is allowed).",
      call: "`{{name}}(…)` runs SQL outside a store: move it into the feature's store.ts and call that.",
      method: "`.{{name}}(…)` runs SQL outside a store: move it into the feature's store.ts and call that.",
    },
  },
  create(context) {
    const file = rel(context.filename);
    if (graph.isStoreFile(file) || pending.SQL_OUTSIDE_STORES.includes(file)) return {};
    return {
      ImportDeclaration(node) {
        if (node.source.value !== 'knex' || node.importKind === 'type') return;
        const values = node.specifiers.filter((s) => s.importKind !== 'type');
        if (values.length) context.report({ node, messageId: 'knexImport' });
      },
      CallExpression(node) {
        const callee = node.callee;
        if (callee.type === 'Identifier' && QUERY_CALLEES.has(callee.name)) {
          context.report({ node, messageId: 'call', data: { name: callee.name } });
        } else if (callee.type === 'MemberExpression' && !callee.computed && callee.property.type === 'Identifier') {
          const name = callee.property.name;
          if (QUERY_CALLEES.has(name)) context.report({ node, messageId: 'call', data: { name: `.${name}` } });
          else if (QUERY_METHODS.has(name)) context.report({ node, messageId: 'method', data: { name } });
        }
      },
    };
  },
};

let edgesByFile = null;
/**
 * The folder pairs that import each other, with `apiFile` read from the text being linted
 * (an editor's unsaved text, or a test's) and every other file from disk, read once per run.
 */
function mutualPairsWith(apiFile, text) {
  if (!edgesByFile) {
    edgesByFile = new Map();
    for (const [file, source] of graph.readApiSources())
      edgesByFile.set(file, graph.crossFolderEdges(new Map([[file, source]])));
  }
  const edges = [];
  for (const [file, fileEdges] of edgesByFile) if (file !== apiFile) edges.push(...fileEdges);
  edges.push(...graph.crossFolderEdges(new Map([[apiFile, text]])));
  return new Set(graph.mutualPairs(graph.folderGraph(edges)));
}

const featureBoundaries = {
  meta: {
    type: 'problem',
    docs: {
      description:
        'api/ features talk through services: no foreign store imports, no mutual folder imports, leaves import no feature',
    },
    schema: [],
    messages: {
      foreignStore: "api/{{from}} imports another feature's store (api/{{to}}): call that feature's service instead.",
      mutual:
        'api/{{a}}/ and api/{{b}}/ import each other: one of them must stop (move the shared piece into a leaf module or pass the data in).',
      leaf: 'api/{{from}} is a shared leaf module and must not import a feature (api/{{to}}).',
    },
  },
  create(context) {
    const file = rel(context.filename);
    if (!file.startsWith('api/')) return {};
    const apiFile = file.slice('api/'.length);
    const fromFolder = apiFile.includes('/') ? apiFile.split('/')[0] : null;
    if (!fromFolder) return {};
    let mutual = null;
    const check = (node, spec) => {
      if (typeof spec !== 'string' || !spec.startsWith('.')) return;
      const to = graph.resolveSpec(apiFile, spec);
      const toFolder = graph.folderOf(to);
      if (to.startsWith('..') || !toFolder || toFolder === fromFolder) return;
      const edge = { from: apiFile, to, fromFolder, toFolder };
      mutual ??= mutualPairsWith(apiFile, context.sourceCode.text);
      const leaf = graph.LEAF_FOLDERS;
      if (leaf.includes(edge.fromFolder) && !leaf.includes(edge.toFolder)) {
        context.report({ node, messageId: 'leaf', data: { from: edge.from, to: edge.to } });
        return;
      }
      if (
        !leaf.includes(edge.toFolder) &&
        graph.isStoreFile(edge.to) &&
        !pending.FOREIGN_STORE_IMPORTS.includes(`api/${edge.from} -> api/${edge.to}`)
      ) {
        context.report({ node, messageId: 'foreignStore', data: { from: edge.from, to: edge.to } });
      }
      const pair = [edge.fromFolder, edge.toFolder].sort();
      const key = pair.join('<->');
      if (mutual.has(key) && !pending.MUTUAL_FOLDER_IMPORTS.includes(key)) {
        context.report({ node, messageId: 'mutual', data: { a: pair[0], b: pair[1] } });
      }
    };
    return {
      ImportDeclaration: (node) => check(node, node.source.value),
      ExportNamedDeclaration: (node) => node.source && check(node, node.source.value),
      ExportAllDeclaration: (node) => check(node, node.source.value),
      ImportExpression: (node) => node.source.type === 'Literal' && check(node, node.source.value),
    };
  },
};

module.exports = {
  meta: { name: 'crestwatch' },
  rules: { 'sql-in-stores': sqlInStores, 'feature-boundaries': featureBoundaries },
};
