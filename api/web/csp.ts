/**
 * The Content-Security-Policy's script hashes. The exported pages carry a few inline
 * scripts (Expo's hydration flag and the card's early data request, lib/early-fetch.ts);
 * instead of allowing every inline script ('unsafe-inline'), the policy lists the SHA-256
 * of each one (CSP Level 2 hash sources). The web build computes them from the exported
 * HTML and writes `csp-hashes.json` beside it, so they follow the scripts whenever those
 * change; the server reads that file (or, for an older build without it, computes the
 * same from the HTML) and serves them in `script-src`. No web build: no hashes.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

export const CSP_HASHES_FILE = 'csp-hashes.json';

function htmlFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...htmlFiles(p));
    else if (entry.name.endsWith('.html')) out.push(p);
  }
  return out;
}

/** The inline scripts of one HTML page (a <script> without src), their text exactly as written. */
export function inlineScripts(html: string): string[] {
  const out: string[] = [];
  for (const m of html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script\s*>/gi)) {
    if (/\bsrc\s*=/i.test(m[1])) continue;
    if (m[2].length > 0) out.push(m[2]);
  }
  return out;
}

/** A CSP hash source for a script's text: 'sha256-<base64>' of its UTF-8 bytes. */
export function scriptHash(text: string): string {
  return `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;
}

/** Every distinct inline-script hash of the exported pages, sorted. */
export function computeCspHashes(webDir: string): string[] {
  const hashes = new Set<string>();
  for (const file of htmlFiles(webDir))
    for (const s of inlineScripts(fs.readFileSync(file, 'utf8'))) hashes.add(scriptHash(s));
  return [...hashes].sort();
}

/** Writes `csp-hashes.json` into the web build (called by the web build). */
export function writeCspHashes(webDir: string): string[] {
  const hashes = computeCspHashes(webDir);
  fs.writeFileSync(path.join(webDir, CSP_HASHES_FILE), `${JSON.stringify({ scriptSrc: hashes }, null, 2)}\n`);
  return hashes;
}

/** The hashes to serve: from the build's file, else from its HTML, else none (no web build). */
export function loadCspHashes(webDir: string): string[] {
  const file = path.join(webDir, CSP_HASHES_FILE);
  if (fs.existsSync(file)) {
    const parsed = JSON.parse(fs.readFileSync(file, 'utf8')) as { scriptSrc?: unknown };
    if (
      !Array.isArray(parsed.scriptSrc) ||
      !parsed.scriptSrc.every((h) => typeof h === 'string' && /^'sha256-[A-Za-z0-9+/]+={0,2}'$/.test(h))
    ) {
      throw new Error(`${file} is not a list of sha256 hash sources: rebuild the web app`);
    }
    return parsed.scriptSrc as string[];
  }
  return fs.existsSync(webDir) ? computeCspHashes(webDir) : [];
}
