/**
 * npm run bench:bundle — the JavaScript a first visit downloads, from the built web app
 * (dist/, `node --import tsx scripts/web-build.ts` first): for the region (index.html) and
 * the card (district/[code].html), every script the page loads (`<script src>` and script
 * preloads), raw and gzipped (zlib's default level, as `gzip -c`), and the total. Goal:
 * ≤ 300 KB gzipped for each first route.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { pageScripts } from '../scripts/web-build';

const dist = path.resolve(__dirname, '..', 'dist');
const PAGES = ['index.html', 'district/[code].html'];

function main(): void {
  if (!fs.existsSync(path.join(dist, 'index.html')))
    throw new Error('dist/index.html is missing: build the web app first');
  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  console.log(`first-route JavaScript of dist/ (load ${os.loadavg()[0].toFixed(2)})`);
  for (const page of PAGES) {
    const html = fs.readFileSync(path.join(dist, page), 'utf8');
    let raw = 0;
    let gz = 0;
    console.log(`\n${page}`);
    for (const src of pageScripts(html)) {
      const body = fs.readFileSync(path.join(dist, decodeURIComponent(src.split('?')[0])));
      const z = zlib.gzipSync(body).length;
      raw += body.length;
      gz += z;
      console.log(`  ${src.padEnd(90)} ${kb(body.length).padStart(10)} ${kb(z).padStart(10)} gz`);
    }
    console.log(
      `  total${' '.repeat(86)}${kb(raw).padStart(10)} ${kb(gz).padStart(10)} gz   (goal ≤ 300 KB gz: ${gz <= 300 * 1024 ? 'met' : 'not met'})`,
    );
  }
}

main();
