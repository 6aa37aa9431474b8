/**
 * The import graph of the server's feature folders (api/<feature>/), read from the source
 * text: every `import … from`, `export … from`, `import()` and `require()` with a relative
 * path. Type-only imports count too: a feature that needs another's types is coupled to it.
 *
 * Used by the lint rules in ./plugin.js and printable with `node eslint/import-graph.js`.
 */
const fs = require('node:fs');
const path = require('node:path');

const ROOT = path.resolve(__dirname, '..');
const API = path.join(ROOT, 'api');

/** Folders of api/ that are shared leaves, not features: they import no feature. */
const LEAF_FOLDERS = ['db', 'estimation', 'http', 'common'];

const IMPORT_RE =
  /(?:\bimport|\bexport)\s[^'";]*?\bfrom\s*['"]([^'"]+)['"]|\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)|\brequire\s*\(\s*['"]([^'"]+)['"]\s*\)|\bimport\s+['"]([^'"]+)['"]/g;

/** Relative import specifiers of one file's text. */
function importsOf(text) {
  const out = [];
  for (const m of text.matchAll(IMPORT_RE)) {
    const spec = m[1] ?? m[2] ?? m[3] ?? m[4];
    if (spec && spec.startsWith('.')) out.push(spec);
  }
  return out;
}

/** api-relative path ("alerts/service.ts") → its feature folder, or null for a top-level file. */
function folderOf(apiRelative) {
  const parts = apiRelative.split('/');
  return parts.length > 1 ? parts[0] : null;
}

const isStoreFile = (p) => /(^|\/)(store|[^/]*-store)\.ts$/.test(p);

/** Resolves a relative specifier from a file to an api-relative path (best effort, .ts files). */
function resolveSpec(fromApiRelative, spec) {
  const base = path.posix.normalize(path.posix.join(path.posix.dirname(fromApiRelative), spec));
  for (const candidate of [`${base}.ts`, `${base}.tsx`, `${base}/index.ts`, base]) {
    if (fs.existsSync(path.join(API, candidate)) && fs.statSync(path.join(API, candidate)).isFile()) return candidate;
  }
  return `${base}.ts`;
}

function listTs(dir, rel = '') {
  const out = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const r = rel ? `${rel}/${entry.name}` : entry.name;
    if (entry.isDirectory()) out.push(...listTs(path.join(dir, entry.name), r));
    else if (/\.tsx?$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name)) out.push(r);
  }
  return out;
}

/**
 * Every import edge that crosses api/ folders: { from, to, fromFolder, toFolder }, paths
 * relative to api/. Top-level files (app.ts, routes.ts, …) are the composition root and
 * have no folder.
 */
function crossFolderEdges(sources) {
  const edges = [];
  for (const [file, text] of sources) {
    const fromFolder = folderOf(file);
    if (!fromFolder) continue;
    for (const spec of importsOf(text)) {
      const to = resolveSpec(file, spec);
      if (to.startsWith('..')) continue;
      const toFolder = folderOf(to);
      if (toFolder && toFolder !== fromFolder) edges.push({ from: file, to, fromFolder, toFolder });
    }
  }
  return edges;
}

function readApiSources() {
  return new Map(listTs(API).map((f) => [f, fs.readFileSync(path.join(API, f), 'utf8')]));
}

/** Folder → set of folders it imports (leaf folders included). */
function folderGraph(edges) {
  const graph = new Map();
  for (const e of edges) {
    if (!graph.has(e.fromFolder)) graph.set(e.fromFolder, new Set());
    graph.get(e.fromFolder).add(e.toFolder);
  }
  return graph;
}

/** Pairs of feature folders that import each other, as "a<->b" with a < b. */
function mutualPairs(graph) {
  const pairs = new Set();
  for (const [a, targets] of graph) {
    for (const b of targets) if (graph.get(b)?.has(a)) pairs.add([a, b].sort().join('<->'));
  }
  return [...pairs].sort();
}

/** Edges from one feature into another feature's store. */
function foreignStoreEdges(edges) {
  return edges.filter((e) => !LEAF_FOLDERS.includes(e.toFolder) && isStoreFile(e.to));
}

/** Edges from a leaf folder into a feature. */
function leafToFeatureEdges(edges) {
  return edges.filter((e) => LEAF_FOLDERS.includes(e.fromFolder) && !LEAF_FOLDERS.includes(e.toFolder));
}

module.exports = {
  API,
  LEAF_FOLDERS,
  importsOf,
  isStoreFile,
  folderOf,
  resolveSpec,
  crossFolderEdges,
  readApiSources,
  folderGraph,
  mutualPairs,
  foreignStoreEdges,
  leafToFeatureEdges,
};

if (require.main === module) {
  const edges = crossFolderEdges(readApiSources());
  const graph = folderGraph(edges);
  console.log('api/ feature folders and the folders they import (leaves: ' + LEAF_FOLDERS.join(', ') + '):');
  for (const folder of [...graph.keys()].sort()) {
    if (LEAF_FOLDERS.includes(folder)) continue;
    const features = [...graph.get(folder)].filter((f) => !LEAF_FOLDERS.includes(f)).sort();
    console.log(`  ${folder} -> ${features.join(', ') || '(features: none)'}`);
  }
  console.log('\nfolders importing each other:', mutualPairs(graph).join(', ') || 'none');
  console.log("\nimports of another feature's store:");
  for (const e of foreignStoreEdges(edges)) console.log(`  api/${e.from} -> api/${e.to}`);
  const leaf = leafToFeatureEdges(edges);
  if (leaf.length) {
    console.log('\nleaf modules importing a feature:');
    for (const e of leaf) console.log(`  api/${e.from} -> api/${e.to}`);
  }
}
