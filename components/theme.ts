// Crestwatch's design tokens: the only place colours, spacing and type sizes are written.
// Components import `theme` (or a piece of it) and never write a literal colour.
//
// Palette "field notebook": warm paper, slate-teal ink, a ridge blue-green for action and
// selection, a clay accent for marks that need attention. Text pairs meet WCAG AA
// (≥ 4.5:1) on the surfaces they sit on; the ratios beside each colour were computed
// with the WCAG 2 relative-luminance formula, and tests/components/contrast.test.ts checks
// every pair the components use (text 4.5:1, marks, lines, focus ring and field edges 3:1).
import type { TextStyle } from 'react-native';

import { fontFamilies } from '@/lib/font-sources';
import { textSize } from '@/lib/text-size';

const palette = {
  paper: '#F5F2EA', // page background
  chalk: '#FFFFFF', // raised surfaces (cards, table)
  sand: '#E9E3D6', // sunken fills, skeleton blocks
  dune: '#D5CDBC', // hairlines and borders
  slate900: '#1E2B2F', // primary text (13.0:1 on paper)
  slate600: '#4D5E63', // secondary text, placeholders (6.1:1 on paper, 5.3:1 on sand)
  slate500: '#6E7C80', // the pooled reference curve (4.3:1 on chalk, 3.2:1 on the band's fill)
  slate400: '#7D8B8F', // decorative marks, text fields' edges (3.5:1 on chalk, 3.2:1 on paper: not for text)
  ridge700: '#1F5A60', // links, selected row rule, primary button (7.0:1 on paper; white on it 7.8:1)
  ridge100: '#DCEBEA', // selected row fill
  clay700: '#9A4523', // warnings, error text (5.8:1 on paper, 5.2:1 on clay100)
  clay100: '#F6E3D8', // error panel fill
  amber600: '#B06A00', // keyboard focus ring (≥ 3:1 non-text contrast on every surface here)
  hatch: '#EFE7D5', // "no data" cell fill
  hatchInk: '#6E5B35', // "no data" cell text (5.3:1 on hatch)
  // Status pills of the staff screens (run states, upload status, people, alerts): each
  // pairs a light fill with an ink that reads at ≥ 4.5:1 on it.
  moss100: '#DDEBDD', // done / published fill
  moss800: '#22553A', // its ink (7.0:1 on moss100)
  amber100: '#F8E8C8', // attention fill (warnings, in review)
  amber800: '#6B4300', // its ink (7.1:1 on amber100)
  slate100: '#E4E8E8', // neutral fill (queued, archived); slate900 on it 11.8:1
  // Standings: each also has its own shape (components/region/standing-mark.tsx), so colour
  // is never the only cue. All read as text: ≥ 5.2:1 on paper, chalk and ridge100.
  kiln: '#A0421A', // approaching (5.7:1 on paper)
  heather: '#6A3F8F', // at the turn; the threshold line and its band edge (6.9:1 on paper)
  fir: '#22663F', // past the turn (6.2:1 on paper)
  peat: '#5C5346', // not estimable (6.8:1 on paper)
  heather100: '#E4DAF0', // the threshold band's fill (behind marks only, never under text)
} as const;

/** Pill and notice tones: a fill and the ink that reads on it. */
export const toneColors = {
  neutral: { fill: palette.slate100, ink: palette.slate900 },
  info: { fill: palette.ridge100, ink: palette.ridge700 },
  success: { fill: palette.moss100, ink: palette.moss800 },
  warning: { fill: palette.amber100, ink: palette.amber800 },
  danger: { fill: palette.clay100, ink: palette.clay700 },
} as const;
export type Tone = keyof typeof toneColors;

export const colors = {
  background: palette.paper,
  surface: palette.chalk,
  surfaceSunken: palette.sand,
  border: palette.dune,
  text: palette.slate900,
  textMuted: palette.slate600,
  placeholder: palette.slate600,
  mark: palette.slate400, // decorative strokes only, never text
  /** The edge that shows where a text field is (WCAG 2.2 SC 1.4.11: 3:1 on the field and the page). */
  controlBorder: palette.slate400,
  link: palette.ridge700,
  action: palette.ridge700,
  onAction: palette.chalk,
  selected: palette.ridge100,
  selectedRule: palette.ridge700,
  danger: palette.clay700,
  dangerFill: palette.clay100,
  focus: palette.amber600,
  skeleton: palette.sand,
  gapFill: palette.hatch,
  gapText: palette.hatchInk,
  headerBackground: palette.slate900,
  headerText: palette.chalk,
  /** Secondary text and links on the header (11.9:1 on slate900). */
  headerTextMuted: palette.ridge100,
  transparent: 'transparent',
} as const;

/** Colour of each standing's mark and word (the mark's shape carries the same meaning). */
export const standingColors = {
  approaching: palette.kiln,
  at_turn: palette.heather,
  past_turn: palette.fir,
  no_turn: palette.slate600,
  not_estimable: palette.peat,
} as const;

/** Chart inks. Lines and marks need 3:1 against the chart surface (chalk); text uses colors. */
export const chartColors = {
  surface: palette.chalk,
  grid: palette.dune,
  axis: palette.slate600,
  points: palette.slate600,
  /** The district's fitted curve (7.8:1 on chalk). */
  curve: palette.ridge700,
  /** The regional pooled curve, dashed; also the stand-in curve, so 3:1 even over the band. */
  pooled: palette.slate500,
  /** The latest year's point, ringed (4.3:1 on chalk). */
  latest: palette.amber600,
  threshold: palette.heather,
  band: palette.heather100,
  /** The projected path, dashed. */
  projection: palette.kiln,
} as const;

/** 4-point spacing scale. */
export const space = {
  xxs: 2,
  xs: 4,
  sm: 8,
  md: 12,
  lg: 16,
  xl: 24,
  xxl: 32,
  xxxl: 48,
} as const;

export const radius = {
  sm: 4,
  md: 8,
  lg: 12,
  pill: 999,
} as const;

export const fonts = fontFamilies;

/**
 * Type scale (size / line height), a 1.2 ratio rounded to whole pixels. Each step names a
 * role, not a size, so screens say what a text is for. Sizes go through textSize, so they
 * follow the reader's text size setting (rem on web; the system scale on phones).
 */
export const type = {
  caption: { fontFamily: fonts.regular, fontSize: textSize(12), lineHeight: textSize(16) },
  label: { fontFamily: fonts.semibold, fontSize: textSize(13), lineHeight: textSize(18) },
  body: { fontFamily: fonts.regular, fontSize: textSize(15), lineHeight: textSize(22) },
  bodyStrong: { fontFamily: fonts.semibold, fontSize: textSize(15), lineHeight: textSize(22) },
  numeric: {
    fontFamily: fonts.regular,
    fontSize: textSize(14),
    lineHeight: textSize(20),
    fontVariant: ['tabular-nums'],
  },
  title: { fontFamily: fonts.semibold, fontSize: textSize(18), lineHeight: textSize(24) },
  heading: { fontFamily: fonts.bold, fontSize: textSize(22), lineHeight: textSize(28) },
  display: { fontFamily: fonts.bold, fontSize: textSize(28), lineHeight: textSize(34) },
} satisfies Record<string, TextStyle>;

/** Window widths where the layout changes. */
export const breakpoints = {
  /** Below this width a data table folds into a list of cards. */
  fold: 600,
  /** At or above this width the list and the detail sit side by side. */
  wide: 1024,
  /** At or above this width a third column shows the caller's alerts. */
  full: 1440,
} as const;

export const layout = {
  /** Width of the list column in the wide layout. */
  listColumnWidth: 380,
  /** Widest the detail column's content grows, so table rows stay readable. */
  detailMaxWidth: 760,
  /** Fixed height of one district row; the skeleton rows use the same height. */
  districtRowHeight: 84,
  /** Minimum touch target (WCAG 2.5.8 asks for 24; phones are easier at 44). */
  touchTarget: 44,
  /** Widest a staff screen's content grows (tables need more room than the district detail). */
  pageMaxWidth: 1200,
  /** Width of the side panel beside a staff table in the wide layout (run review, specs). */
  sidePanelWidth: 440,
  /** Width of the alerts column at ≥ 1440 px. */
  alertsColumnWidth: 340,
  /** Heights of the card's charts; their placeholders take the same room. */
  curveChartHeight: 280,
  pathChartHeight: 220,
} as const;

/** Keyboard focus outline shared by every focusable element on web. */
export const focusRing = {
  outlineColor: colors.focus,
  outlineStyle: 'solid',
  outlineWidth: 3,
  outlineOffset: 2,
} as const;

/** The same ring drawn inside the element, for full-bleed rows a scroll view would clip. */
export const focusRingInset = { ...focusRing, outlineOffset: -3 } as const;

export const theme = {
  colors,
  toneColors,
  standingColors,
  chartColors,
  space,
  radius,
  fonts,
  type,
  breakpoints,
  layout,
  focusRing,
  focusRingInset,
} as const;
export type Theme = typeof theme;
