/**
 * The web build's offline and install step, run on dist/ after `expo export`
 * (scripts/web-build.ts calls it through ./index.ts):
 * 1. copies the Inter subset files the root HTML declares (lib/web-fonts.ts) from
 *    @fontsource/inter, with their licence, into dist/fonts/;
 * 2. draws the icons and writes the web app manifest, in the theme's colours;
 * 3. bundles the service worker (./service-worker.ts) and lets workbox-build's
 *    injectManifest write the precache list into dist/sw.js.
 * Usage: node --import tsx scripts/web-offline/build.ts <dist dir>
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { build } from 'esbuild';
import { getManifest, injectManifest } from 'workbox-build';
import { htmlRoutes } from '../../api/web/static-routes';
import { PRECACHED_FONT_SUBSETS, WEB_FONT_DIR, WEB_FONT_WEIGHTS, webFontFile, webFontFiles } from '../../lib/web-fonts';
import { iconPng, iconSvg, type IconColours } from './icons';

const root = path.resolve(__dirname, '..', '..');

// ---- Fonts ----------------------------------------------------------------------------------

export function copyFonts(distDir: string): number {
  const from = path.dirname(require.resolve('@fontsource/inter/package.json', { paths: [root] }));
  const to = path.join(distDir, WEB_FONT_DIR);
  fs.mkdirSync(to, { recursive: true });
  for (const file of webFontFiles()) fs.copyFileSync(path.join(from, 'files', file), path.join(to, file));
  fs.copyFileSync(path.join(from, 'LICENSE'), path.join(to, 'LICENSE.txt'));
  return webFontFiles().length;
}

// ---- Manifest and icons ---------------------------------------------------------------------

/**
 * A colour token of components/theme.ts (`colors.<name>: palette.<swatch>`), read from its
 * source: the theme module imports the app's platform files, which Node cannot load.
 */
export function themeColour(name: string): string {
  const file = path.join(root, 'components', 'theme.ts');
  const source = fs.readFileSync(file, 'utf8');
  const swatch = new RegExp(`^\\s+${name}: palette\\.(\\w+),`, 'm').exec(source)?.[1];
  const hex = swatch ? new RegExp(`^\\s+${swatch}: '(#[0-9A-Fa-f]{6})'`, 'm').exec(source)?.[1] : undefined;
  if (!hex) throw new Error(`${file}: no colour token "${name}" of the form "${name}: palette.<swatch>,"`);
  return hex;
}

export function writeManifestAndIcons(distDir: string): void {
  const colours: IconColours = {
    background: themeColour('action'),
    crest: themeColour('background'),
    ground: themeColour('selected'),
    dot: themeColour('danger'),
  };
  const icons = path.join(distDir, 'icons');
  fs.mkdirSync(icons, { recursive: true });
  fs.writeFileSync(path.join(icons, 'icon.svg'), iconSvg(colours));
  for (const size of [192, 512]) fs.writeFileSync(path.join(icons, `icon-${size}.png`), iconPng(size, colours));
  const manifest = {
    name: 'Crestwatch',
    short_name: 'Crestwatch',
    description: 'District emissions–income curves, thresholds, alerts and briefs',
    lang: 'en',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    theme_color: themeColour('headerBackground'),
    background_color: themeColour('background'),
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
    ],
  };
  fs.writeFileSync(path.join(distDir, 'manifest.webmanifest'), `${JSON.stringify(manifest, null, 2)}\n`);
}

// ---- Service worker -------------------------------------------------------------------------

/** What the worker precaches: the app shell (pages, scripts, styles, images) and the Latin fonts. */
export function precacheGlobs(): string[] {
  const fonts = WEB_FONT_WEIGHTS.flatMap(({ weight }) =>
    PRECACHED_FONT_SUBSETS.map((s) => `${WEB_FONT_DIR}/${webFontFile(s, weight)}`),
  );
  return ['**/*.{html,js,css,png,svg,ico,webmanifest}', ...fonts];
}

export async function buildServiceWorker(distDir: string): Promise<{ count: number; size: number; version: string }> {
  const globs = { globDirectory: distDir, globPatterns: precacheGlobs(), globIgnores: ['sw.js'] };
  const listed = await getManifest(globs);
  const version = createHash('sha256')
    .update(listed.manifestEntries.map((e) => `${e.url} ${e.revision ?? ''}`).join('\n'))
    .digest('hex')
    .slice(0, 16);
  const routes = htmlRoutes(distDir).map((r): [string, string] => [r.pattern.source, r.file]);
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-sw-'));
  try {
    const swSrc = path.join(tmp, 'sw.js');
    await build({
      entryPoints: [path.join(__dirname, 'service-worker.ts')],
      outfile: swSrc,
      bundle: true,
      format: 'iife',
      platform: 'browser',
      target: 'es2020',
      minify: true,
      legalComments: 'none',
      logLevel: 'warning',
      define: {
        'process.env.NODE_ENV': '"production"',
        CW_HTML_ROUTES: JSON.stringify(routes),
        CW_BUILD_VERSION: JSON.stringify(version),
      },
    });
    const result = await injectManifest({
      ...globs,
      swSrc,
      swDest: path.join(distDir, 'sw.js'),
      // The first route's scripts are a few hundred KB; the limit only guards against surprises.
      maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
    });
    for (const w of result.warnings) process.stderr.write(`[web] service worker: ${w}\n`);
    return { count: result.count, size: result.size, version };
  } finally {
    fs.rmSync(tmp, { recursive: true, force: true });
  }
}

async function main(distDir: string): Promise<void> {
  const log = (m: string) => process.stderr.write(`[web] ${m}\n`);
  log(`copied ${copyFonts(distDir)} font files (Latin, Latin Extended, Greek, Cyrillic)`);
  writeManifestAndIcons(distDir);
  log('wrote the web app manifest and its icons');
  const sw = await buildServiceWorker(distDir);
  log(`service worker ${sw.version}: ${sw.count} files precached (${(sw.size / 1024).toFixed(0)} KB)`);
}

if (require.main === module) {
  const distDir = process.argv[2];
  if (!distDir) {
    console.error('usage: node --import tsx scripts/web-offline/build.ts <dist dir>');
    process.exit(2);
  }
  main(path.resolve(distDir)).catch((err: Error) => {
    console.error(`offline step of the web build failed: ${err.message}`);
    process.exit(1);
  });
}
