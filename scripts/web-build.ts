/**
 * Builds the static web app (`expo export -p web`) into dist/ when its inputs changed
 * since the last build. The stamp file holds a hash of every input. Writes
 * dist/csp-hashes.json: the SHA-256 of every inline script of the exported pages, which
 * the server lists in its Content-Security-Policy. Then adds the offline and install files
 * (scripts/web-offline/): font subsets, web app manifest and icons, service worker.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { CSP_HASHES_FILE, writeCspHashes } from '../api/web/csp';
import { addOfflineFiles, OFFLINE_INPUTS } from './web-offline';

const root = path.resolve(__dirname, '..');
export const distDir = path.join(root, 'dist');
const stampFile = path.join(distDir, '.build-stamp');
const inputDirs = ['app', 'components', 'contracts', 'hooks', 'lib', 'assets', ...OFFLINE_INPUTS];
const inputFiles = ['app.json', 'babel.config.js', 'metro.config.js', 'package-lock.json', 'tsconfig.json'];

function hashTree(h: ReturnType<typeof createHash>, dir: string): void {
  if (!fs.existsSync(dir)) return;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
    const p = path.join(dir, entry.name);
    if (entry.isDirectory()) hashTree(h, p);
    else h.update(path.relative(root, p)).update(fs.readFileSync(p));
  }
}

export function webInputsHash(): string {
  const h = createHash('sha256');
  for (const d of inputDirs) hashTree(h, path.join(root, d));
  for (const f of inputFiles)
    if (fs.existsSync(path.join(root, f))) h.update(f).update(fs.readFileSync(path.join(root, f)));
  return h.digest('hex');
}

export function buildWebIfStale(log: (m: string) => void = (m) => process.stderr.write(`[web] ${m}\n`)): boolean {
  const hash = webInputsHash();
  if (
    fs.existsSync(stampFile) &&
    fs.readFileSync(stampFile, 'utf8') === hash &&
    fs.existsSync(path.join(distDir, 'index.html'))
  ) {
    // A build from before the hashes file: add it (it is read from the HTML, no rebuild needed).
    if (!fs.existsSync(path.join(distDir, CSP_HASHES_FILE)))
      log(`wrote ${writeCspHashes(distDir).length} inline-script hashes for the CSP`);
    return false;
  }
  log('building the web app (expo export -p web)…');
  const started = Date.now();
  const r = spawnSync(
    process.execPath,
    [path.join(root, 'node_modules', 'expo', 'bin', 'cli'), 'export', '-p', 'web', '--output-dir', 'dist'],
    {
      cwd: root,
      stdio: ['ignore', 'inherit', 'inherit'],
      env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1', EXPO_OFFLINE: '1' },
    },
  );
  if (r.status !== 0) throw new Error(`expo export failed with exit code ${r.status}`);
  // Offline and install step (scripts/web-offline/): fonts, manifest, icons, service worker.
  addOfflineFiles(distDir);
  // The CSP's script-src lists these hashes (api/web/csp.ts), so they follow the scripts.
  log(`wrote ${writeCspHashes(distDir).length} inline-script hashes for the CSP`);
  fs.writeFileSync(stampFile, hash);
  log(`web app built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return true;
}

if (require.main === module) {
  try {
    buildWebIfStale();
  } catch (err) {
    console.error(String((err as Error).message));
    process.exit(1);
  }
}

/** The scripts a page of the build loads at once: `<script src>` and script preloads (site paths). */
export function pageScripts(html: string): string[] {
  const out = new Set<string>();
  for (const m of html.matchAll(/<script\b[^>]*\bsrc="([^"]+)"/g)) out.add(m[1]);
  for (const m of html.matchAll(/<link\b[^>]*\brel="(?:preload|modulepreload)"[^>]*>/g)) {
    if (!/\bas="script"/.test(m[0]) && !/modulepreload/.test(m[0])) continue;
    const href = /\bhref="([^"]+)"/.exec(m[0]);
    if (href) out.add(href[1]);
  }
  return [...out].filter((s) => s.startsWith('/'));
}
