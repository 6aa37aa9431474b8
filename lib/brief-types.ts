// The contract of a brief's content: what GET /api/briefs/district/:code and
// GET /api/briefs/region answer, and what the server's PDF renderer draws. The server
// builds it once (api/briefs/*-content.ts, every figure already rounded for reading by
// api/briefs/format.ts); the PDF and the print-friendly HTML view both render this object,
// so they cannot say different things. Types only: imported by the API and by the app.

/** Semantic colours of a chart; each renderer maps them to its own palette. */
export type BriefTone =
  | 'ink'
  | 'muted'
  | 'grid'
  | 'curve'
  | 'pooled'
  | 'band'
  | 'threshold'
  | 'latest'
  | 'point'
  | 'projection'
  // the region map: a standing's mark, its fill (a light tint), the land of other districts, the sea
  | 'approaching'
  | 'at_turn'
  | 'past_turn'
  | 'no_turn'
  | 'not_estimable'
  | 'approaching_fill'
  | 'at_turn_fill'
  | 'past_turn_fill'
  | 'no_turn_fill'
  | 'not_estimable_fill'
  | 'land'
  | 'sea';

export type ChartItem =
  | {
      kind: 'path';
      /** SVG path data in the scene's coordinates (origin top left, y down, points). */
      d: string;
      stroke?: BriefTone;
      fill?: BriefTone;
      width?: number;
      /** dash and gap lengths */
      dash?: [number, number];
      opacity?: number;
    }
  | { kind: 'circle'; cx: number; cy: number; r: number; fill?: BriefTone; stroke?: BriefTone; width?: number; opacity?: number }
  | {
      kind: 'text';
      x: number;
      /** the text's baseline */
      y: number;
      text: string;
      size: number;
      tone: BriefTone;
      anchor: 'start' | 'middle' | 'end';
      bold?: boolean;
    };

/** A chart as vectors: drawn with pdfkit paths in the PDF and with SVG in the app. */
export interface ChartScene {
  width: number;
  height: number;
  title: string;
  /** One sentence saying what the chart shows (alt text in the app). */
  description: string;
  items: ChartItem[];
}

/** One labelled figure of a brief: a value and a line of detail under it. */
export interface BriefFigure {
  key: string;
  label: string;
  value: string;
  detail: string | null;
}

/** Where the numbers came from, printed on every page. */
export interface BriefTrace {
  runId: number;
  /** e.g. "3 December 2026, 14:05 (UTC)" in the region's time zone */
  publishedAt: string;
  publishedAtIso: string | null;
  dataVersion: string;
  /** first 12 hex digits of the run's data hash */
  dataHash: string;
  softwareVersion: string;
  generatedAt: string;
  timeZone: string;
  /** "Run #12 · published … · data version 3 (hash 1a2b3c4d5e6f) · Crestwatch 0.1.0" */
  line: string;
}

export type BriefPaperSize = 'A4' | 'LETTER';

export interface DistrictBriefContent {
  kind: 'district';
  code: string;
  name: string;
  /** "District brief · D07 · published run #12 · 3 December 2026" */
  subtitle: string;
  headline: string;
  standing: { key: string; label: string; note: string | null };
  /** Standing, threshold, income now, projected crossing, elasticity, shape. */
  figures: BriefFigure[];
  charts: { curve: ChartScene; path: ChartScene };
  /** Where the district lies among its neighbours (null: no boundaries loaded). */
  locator?: ChartScene | null;
  /** Three plain-language lines. */
  reading: string[];
  /** Said when the regional pooled curve stands in for the district's own. */
  substitute: string | null;
  analystNote: string | null;
  /** "Threshold corrected in software version … on …" while the latest publish corrects an earlier one */
  correctionNotice?: string | null;
  modelLine: string;
  cautions: string[];
  trace: BriefTrace;
  paperSize: BriefPaperSize;
  pdfPath: string;
}

export interface RegionBriefRow {
  code: string;
  name: string;
  standing: string;
  gap: string;
  threshold: string;
  interval: string;
  crossing: string;
}

export interface RegionBriefContent {
  kind: 'region';
  subtitle: string;
  headline: string;
  counts: { key: string; label: string; count: number }[];
  crossed: { code: string; name: string; text: string }[];
  /** Said when the list is empty or there is nothing to compare with. */
  crossedNote: string | null;
  shifts: { code: string; name: string; text: string; overLimit: boolean }[];
  shiftsNote: string | null;
  pooled: { figures: BriefFigure[]; chart: ChartScene | null; note: string | null };
  /** The standings map, the same scene as the region view's (null: no boundaries loaded). */
  map?: ChartScene | null;
  table: { columns: { key: keyof RegionBriefRow; label: string }[]; rows: RegionBriefRow[] };
  modelLine: string;
  cautions: string[];
  trace: BriefTrace;
  paperSize: BriefPaperSize;
  pdfPath: string;
}
