/**
 * What a first visit downloads: the region and the card load their own code, and the staff
 * screens and print views are chunks fetched on demand (Metro moves code that two route
 * chunks share into a common chunk every page loads, so they sit behind one dynamic import
 * each). Read from the web build the browser tests use; bench:bundle prints the sizes.
 */
import fs from 'node:fs';
import path from 'node:path';
import { pageScripts } from '../../scripts/web-build';
import { webDir } from '../support/browser';

const jsDir = path.join(webDir, '_expo', 'static', 'js', 'web');
/**
 * Words found only in the staff screens and only in the print views: the first of each
 * from a route's own screen, the second from a piece two routes share (the spec editor,
 * the brief's frame), which used to land in the common chunk.
 */
const STAFF_MARKS = ['the runs screen', 'Save spec'];
const PRINT_MARKS = ['district brief of', 'brief-print'];

function chunkWith(mark: string): string[] {
  return fs
    .readdirSync(jsDir)
    .filter((f) => f.endsWith('.js') && fs.readFileSync(path.join(jsDir, f), 'utf8').includes(mark))
    .map((f) => `/_expo/static/js/web/${f}`);
}

it.each(['index.html', 'district/[code].html'])('%s loads neither staff screens nor print views', (page) => {
  const scripts = pageScripts(fs.readFileSync(path.join(webDir, page), 'utf8'));
  expect(scripts.length).toBeGreaterThan(2);
  // Each group is one chunk of its own, holding all its marks (so the marks still find it).
  const staff = STAFF_MARKS.map(chunkWith);
  const print = PRINT_MARKS.map(chunkWith);
  for (const found of [...staff, ...print]) expect(found).toHaveLength(1);
  expect(new Set(staff.flat()).size).toBe(1);
  expect(new Set(print.flat()).size).toBe(1);
  expect(staff[0][0]).not.toBe(print[0][0]);
  for (const src of scripts) {
    const body = fs.readFileSync(path.join(webDir, src), 'utf8');
    for (const mark of [...STAFF_MARKS, ...PRINT_MARKS])
      expect([src, mark, body.includes(mark)]).toEqual([src, mark, false]);
  }
});
