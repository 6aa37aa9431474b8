/**
 * Serves the exported web build (`expo export -p web`, static output). Each route is an
 * HTML file: `/district/D07` maps to `district/D07.html` when it exists, else to the
 * dynamic template `district/[code].html`, else `+not-found.html` with 404. Falling back
 * to index.html would break hydration.
 */
import express, { type RequestHandler, Router } from 'express';
import fs from 'node:fs';
import path from 'node:path';

interface HtmlRoute {
  file: string;
  pattern: RegExp;
  /** Lower sorts first: static segments beat dynamic ones, catch-alls come last. */
  rank: number;
}

function listHtml(dir: string, prefix = ''): string[] {
  const out: string[] = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const rel = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) {
      if (entry.name === '_expo' || entry.name === 'assets') continue;
      out.push(...listHtml(path.join(dir, entry.name), rel));
    } else if (entry.name.endsWith('.html')) {
      out.push(rel);
    }
  }
  return out;
}

const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

export function htmlRoutes(webDir: string): HtmlRoute[] {
  const routes: HtmlRoute[] = [];
  for (const file of listHtml(webDir)) {
    if (file === '+not-found.html' || file.startsWith('_')) continue;
    const segments = file
      .replace(/\.html$/, '')
      .split('/')
      .filter((s) => !/^\(.*\)$/.test(s)); // route groups do not appear in URLs
    if (segments[segments.length - 1] === 'index') segments.pop();
    let rank = 0;
    const parts = segments.map((s) => {
      if (/^\[\.\.\..+\]$/.test(s)) {
        rank += 100;
        return '(?:/.+)';
      }
      if (/^\[.+\]$/.test(s)) {
        rank += 10;
        return '/[^/]+';
      }
      if (s.startsWith('+')) rank += 1000;
      return `/${escapeRe(s)}`;
    });
    routes.push({ file, pattern: new RegExp(`^${parts.join('') || '/'}/?$`), rank });
  }
  return routes.sort((a, b) => a.rank - b.rank || b.file.length - a.file.length);
}

export function webRouter(webDir: string): Router {
  const r = Router();
  const indexFile = path.join(webDir, 'index.html');
  if (!fs.existsSync(indexFile)) {
    r.use(((_req, res) => {
      res
        .status(503)
        .type('text/plain')
        .send('The web app has not been built yet. Run `npm start` (or `npm run build:web`) and reload.');
    }) as RequestHandler);
    return r;
  }
  const routes = htmlRoutes(webDir);
  const notFound = path.join(webDir, '+not-found.html');
  r.use('/_expo', express.static(path.join(webDir, '_expo'), { immutable: true, maxAge: '365d', fallthrough: false }));
  r.use('/assets', express.static(path.join(webDir, 'assets'), { maxAge: '7d', fallthrough: false }));
  // The service worker is checked for a new version on every visit: never from a cache.
  r.get('/sw.js', ((_req, res, next) => {
    const file = path.join(webDir, 'sw.js');
    if (!fs.existsSync(file)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.type('text/javascript').sendFile(file);
  }) as RequestHandler);
  r.use(express.static(webDir, { index: false, extensions: [], redirect: false }));
  r.get('/*splat', ((req, res) => {
    const url = decodeURIComponent(req.path);
    const hit = routes.find((route) => route.pattern.test(url));
    res.setHeader('Cache-Control', 'no-cache');
    if (hit) {
      res.sendFile(path.join(webDir, hit.file));
    } else if (fs.existsSync(notFound)) {
      res.status(404).sendFile(notFound);
    } else {
      res.status(404).type('text/plain').send('Not found');
    }
  }) as RequestHandler);
  r.get('/', ((_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  }) as RequestHandler);
  return r;
}
