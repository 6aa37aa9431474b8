/**
 * Contrast of every foreground/background pair the theme's tokens are used in, measured
 * with the WCAG 2.2 relative-luminance formula (tests/support/wcag-contrast.ts):
 * - text: SC 1.4.3 Contrast (Minimum), 4.5:1;
 * - large text (≥ 24 px, or ≥ 18.66 px bold): SC 1.4.3, 3:1;
 * - non-text: SC 1.4.11 Non-text Contrast, 3:1 for the marks, chart lines and points, the
 *   focus ring and the boundaries that identify a control;
 * - decorative: listed for the record, no requirement (SC 1.4.11 exempts what is not needed
 *   to understand the content: card edges, grid lines, the band's fill behind its edges,
 *   map fills whose standing the mark on top carries).
 * The table is printed sorted by ratio and kept in tests/artifacts/contrast-table.md.
 */
import fs from 'node:fs';
import path from 'node:path';

import { chartColors, colors, standingColors, toneColors } from '@/components/theme';
import { mapFill, mapInk } from '@/components/region/map-palette';
import type { Standing } from '@/contracts/estimates';

import { contrastRatio } from '../support/wcag-contrast';

type Kind = 'text' | 'large' | 'non-text' | 'decorative';
const REQUIRED: Record<Kind, number | null> = { text: 4.5, large: 3, 'non-text': 3, decorative: null };
type Pair = { pair: string; kind: Kind; fg: string; bg: string };

const STANDINGS = Object.keys(standingColors) as Standing[];

// Surfaces text and controls sit on (components/theme.ts `colors`).
const surfaces = {
  background: colors.background,
  surface: colors.surface,
  surfaceSunken: colors.surfaceSunken,
  selected: colors.selected,
} as const;
type SurfaceName = keyof typeof surfaces;
const on = (fgName: string, fg: string, kind: Kind, names: SurfaceName[]): Pair[] =>
  names.map((s) => ({ pair: `${fgName} on ${s}`, kind, fg, bg: surfaces[s] }));
const ALL: SurfaceName[] = ['background', 'surface', 'surfaceSunken', 'selected'];

const pairs: Pair[] = [
  // Text on the page's surfaces.
  ...on('text', colors.text, 'text', ALL),
  ...on('textMuted', colors.textMuted, 'text', ALL),
  ...on('placeholder', colors.placeholder, 'text', ['surface']),
  ...on('link', colors.link, 'text', ALL),
  ...on('danger text', colors.danger, 'text', ['background', 'surface']),
  { pair: 'danger text on dangerFill', kind: 'text', fg: colors.danger, bg: colors.dangerFill },
  { pair: 'text on dangerFill', kind: 'text', fg: colors.text, bg: colors.dangerFill },
  { pair: 'gapText on gapFill', kind: 'text', fg: colors.gapText, bg: colors.gapFill },
  // Buttons and chosen tiles (components/ui/button.tsx, components/form/choice-group.tsx).
  { pair: 'onAction (white) on action', kind: 'text', fg: colors.onAction, bg: colors.action },
  { pair: 'onAction on text (solid button, hovered)', kind: 'text', fg: colors.onAction, bg: colors.text },
  { pair: 'action text on selected (outline button, hovered)', kind: 'text', fg: colors.action, bg: colors.selected },
  // The header bar.
  { pair: 'headerText on headerBackground', kind: 'text', fg: colors.headerText, bg: colors.headerBackground },
  {
    pair: 'headerTextMuted on headerBackground',
    kind: 'text',
    fg: colors.headerTextMuted,
    bg: colors.headerBackground,
  },
  // Pills and notices: each tone's ink on its fill.
  ...Object.entries(toneColors).map(([tone, c]) => ({
    pair: `${tone} ink on ${tone} fill`,
    kind: 'text' as const,
    fg: c.ink,
    bg: c.fill,
  })),
  // Standing words (the mark's colour is also the word's).
  ...STANDINGS.flatMap((s) => on(`${s} word`, standingColors[s], 'text', ['background', 'surface', 'selected'])),
  // Chart text: tick labels and axis titles on the chart's surface.
  { pair: 'chart axis text on chart surface', kind: 'text', fg: chartColors.axis, bg: chartColors.surface },

  // Focus ring (drawn outside the element, on the surface around it; rows draw it inside).
  ...on('focus ring', colors.focus, 'non-text', ALL),
  { pair: 'focus ring on headerBackground', kind: 'non-text', fg: colors.focus, bg: colors.headerBackground },
  { pair: 'focus ring on dangerFill', kind: 'non-text', fg: colors.focus, bg: colors.dangerFill },
  // Boundaries that identify a control.
  ...on('controlBorder (text field edge)', colors.controlBorder, 'non-text', ['surface', 'background']),
  ...on('action (check box, outline button edge)', colors.action, 'non-text', ['surface', 'background']),
  ...on('danger (danger button edge)', colors.danger, 'non-text', ['surface']),
  ...on('selectedRule (chosen row, chosen chip)', colors.selectedRule, 'non-text', ['surface', 'selected']),
  // Standing marks: in lists and legends, and on the map on their own standing's fill.
  ...STANDINGS.flatMap((s) => on(`${s} mark`, standingColors[s], 'non-text', ['background', 'surface', 'selected'])),
  ...STANDINGS.map((s) => ({
    pair: `${s} mark on its map fill`,
    kind: 'non-text' as const,
    fg: standingColors[s],
    bg: mapFill[s],
  })),
  ...STANDINGS.map((s) => ({
    pair: `map highlight on ${s} fill`,
    kind: 'non-text' as const,
    fg: mapInk.highlight,
    bg: mapFill[s],
  })),
  // Chart marks on the chart surface, and over the threshold band where they cross it.
  ...(['curve', 'pooled', 'points', 'latest', 'threshold', 'projection', 'axis'] as const).flatMap((k) => [
    { pair: `chart ${k} on chart surface`, kind: 'non-text' as const, fg: chartColors[k], bg: chartColors.surface },
    ...(k === 'axis'
      ? []
      : [{ pair: `chart ${k} on the band`, kind: 'non-text' as const, fg: chartColors[k], bg: chartColors.band }]),
  ]),
  // Legend swatches sit on the page background.
  ...(['curve', 'pooled', 'points', 'latest', 'threshold', 'projection'] as const).map((k) => ({
    pair: `legend ${k} swatch on background`,
    kind: 'non-text' as const,
    fg: chartColors[k],
    bg: colors.background,
  })),

  // Decorative: listed, not required.
  { pair: 'border (card edges, hairlines) on surface', kind: 'decorative', fg: colors.border, bg: colors.surface },
  { pair: 'border on background', kind: 'decorative', fg: colors.border, bg: colors.background },
  { pair: 'chart grid on chart surface', kind: 'decorative', fg: chartColors.grid, bg: chartColors.surface },
  { pair: 'chart band fill on chart surface', kind: 'decorative', fg: chartColors.band, bg: chartColors.surface },
  { pair: 'mark (decorative strokes) on surface', kind: 'decorative', fg: colors.mark, bg: colors.surface },
  ...STANDINGS.map((s) => ({
    pair: `${s} map fill on the sea`,
    kind: 'decorative' as const,
    fg: mapFill[s],
    bg: mapInk.sea,
  })),
];

type Row = Pair & { required: number | null; ratio: number; ok: boolean };
const rows: Row[] = pairs
  .map((p) => {
    const ratio = contrastRatio(p.fg, p.bg);
    const required = REQUIRED[p.kind];
    return { ...p, required, ratio, ok: required === null || ratio >= required };
  })
  .sort((a, b) => a.ratio - b.ratio);

function table(): string {
  const lines = [
    '| pair | kind | foreground | background | required | ratio | meets |',
    '| ---- | ---- | ---------- | ---------- | -------- | ----- | ----- |',
    ...rows.map(
      (r) =>
        `| ${r.pair} | ${r.kind} | ${r.fg} | ${r.bg} | ${r.required === null ? '—' : `${r.required}:1`} | ${r.ratio.toFixed(2)}:1 | ${r.required === null ? '—' : r.ok ? 'yes' : 'NO'} |`,
    ),
  ];
  return lines.join('\n');
}

describe('the WCAG contrast ratio', () => {
  it('matches known values', () => {
    // Black on white is the scale's maximum, 21:1 (WCAG 2.2, definition of contrast ratio).
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 10);
    expect(contrastRatio('#fff', '#fff')).toBe(1);
    // WebAIM's contrast checker: #777777 on #FFFFFF is 4.48:1, #767676 on #FFFFFF 4.54:1.
    expect(contrastRatio('#777777', '#FFFFFF')).toBeCloseTo(4.48, 2);
    expect(contrastRatio('#767676', '#FFFFFF')).toBeCloseTo(4.54, 2);
    // Order does not matter.
    expect(contrastRatio('#FFFFFF', '#777777')).toBe(contrastRatio('#777777', '#FFFFFF'));
  });
});

describe('the theme tokens', () => {
  it('meet WCAG 2.2 SC 1.4.3 (text) and SC 1.4.11 (non-text) on every surface they are used on', () => {
    const out = table();
    fs.mkdirSync(path.join(__dirname, '..', 'artifacts'), { recursive: true });
    fs.writeFileSync(path.join(__dirname, '..', 'artifacts', 'contrast-table.md'), `${out}\n`);
    console.log(`Contrast of the theme's pairs, lowest first:\n${out}`);
    // Every colour is a #rrggbb token: a named or transparent colour would be skipped silently.
    for (const p of pairs) {
      expect(p.fg).toMatch(/^#[0-9a-f]{6}$/i);
      expect(p.bg).toMatch(/^#[0-9a-f]{6}$/i);
    }
    expect(rows.filter((r) => !r.ok).map((r) => `${r.pair}: ${r.ratio.toFixed(2)}:1 < ${r.required}:1`)).toEqual([]);
  });

  it('keeps body text well above the minimum and white on the action colour readable', () => {
    // Body text is the most read pair: the theme's note promises 13:1 on paper.
    expect(contrastRatio(colors.text, colors.background)).toBeGreaterThanOrEqual(7); // SC 1.4.6 (AAA), 7:1
    expect(contrastRatio(colors.onAction, colors.action)).toBeGreaterThanOrEqual(4.5); // SC 1.4.3
  });
});
