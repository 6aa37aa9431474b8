/** The JSON shapes the uploads API answers with. */
import type { Evaluation } from './evaluate-store';
import type { ReadSummary } from './parse/upload-reader';
import { STAGING_TTL_HOURS } from './staging-store';
import type { UploadRecord } from './store';

export interface UploadSummary {
  id: number;
  kind: UploadRecord['kind'];
  status: UploadRecord['status'];
  fileName: string | null;
  checksum: string | null;
  byteSize: number | null;
  format: 'long' | 'wide' | null;
  options: Record<string, unknown>;
  by: { userId: number | null; email: string | null } | null;
  note: string | null;
  createdAt: string;
  committedAt: string | null;
  /** The data version this change set produced (null until applied). */
  version: number | null;
  revertsUploadId: number | null;
  revertedByUploadId: number | null;
  revertedAt: string | null;
  counts: UploadRecord['counts'];
  /** A preview whose staged rows are still kept can be committed without the file. */
  canCommit: boolean;
  canRevert: boolean;
}

export function summaryOf(u: UploadRecord): UploadSummary {
  const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
  return {
    id: u.id,
    kind: u.kind,
    status: u.status,
    fileName: u.fileName,
    checksum: u.checksum,
    byteSize: u.byteSize,
    format: u.format,
    options: u.options,
    by: u.userId === null && u.userEmail === null ? null : { userId: u.userId, email: u.userEmail },
    note: u.note,
    createdAt: iso(u.createdAt)!,
    committedAt: iso(u.committedAt),
    version: u.version,
    revertsUploadId: u.revertsUploadId,
    revertedByUploadId: u.revertedByUploadId,
    revertedAt: iso(u.revertedAt),
    counts: u.counts,
    canCommit: u.status === 'previewed' && u.stagingTable !== null,
    canRevert: u.status === 'committed' && (u.kind === 'file' || u.kind === 'derivation' || u.kind === 'boundaries'),
  };
}

export interface KindCounts {
  insert: number;
  change: number;
  unchanged: number;
}

export interface Preview {
  format: 'long' | 'wide' | null;
  delimiter: string | null;
  decimalComma: boolean;
  rowsRead: number;
  values: number;
  blankLines: number;
  years: { first: number | null; last: number | null };
  totals: KindCounts;
  byIndicator: ({ indicator: string; name: string } & KindCounts)[];
  byDistrict: ({
    district: string;
    name: string;
    isNew: boolean;
    indicators: Record<string, KindCounts>;
  } & KindCounts)[];
  newDistricts: { code: string; name: string; line: number }[];
  /** How many districts the file touches and how many it adds (the two lists above stop at PREVIEW_LIST_CAP). */
  districtsTotal: number;
  newDistrictsTotal: number;
  derived: { indicator: string; insert: number; change: number; remove: number }[];
  /** When the staged rows of a preview are dropped. */
  expiresAt: string | null;
}

const zero = (): KindCounts => ({ insert: 0, change: 0, unchanged: 0 });
const KIND = { i: 'insert', c: 'change', u: 'unchanged' } as const;
/**
 * One collator for every comparison: `localeCompare` with options builds a collator per
 * call, which for a preview of 50,000 districts cost over 100 MB of memory and seconds.
 */
export const DISTRICT_ORDER = new Intl.Collator('en', { numeric: true });

/**
 * The per-district lists of a preview stop here (the totals count all): a file of 50,000
 * new districts would otherwise answer, and keep in the upload's row, a preview of 30 MB.
 */
export const PREVIEW_LIST_CAP = 1000;

export function buildPreview(
  read: ReadSummary,
  ev: Evaluation | null,
  names: {
    districts: Map<number, { code: string; name: string }>;
    indicators: Map<number, { code: string; name: string }>;
  },
  decimalComma: boolean,
  previewedAt: Date | null,
): Preview {
  const totals = zero();
  const byIndicator = new Map<number, KindCounts>();
  const byDistrict = new Map<number, KindCounts & { indicators: Record<string, KindCounts> }>();
  const districtIds = new Set<number>();
  for (const c of ev?.cells ?? []) {
    const k = KIND[c.kind];
    totals[k] += c.n;
    const ind = byIndicator.get(c.indicatorId) ?? zero();
    ind[k] += c.n;
    byIndicator.set(c.indicatorId, ind);
    districtIds.add(c.districtId);
    // Only the districts named in `names` are listed (the caller picks at most PREVIEW_LIST_CAP).
    if (!names.districts.has(c.districtId)) continue;
    const dist = byDistrict.get(c.districtId) ?? { ...zero(), indicators: {} };
    dist[k] += c.n;
    const code = names.indicators.get(c.indicatorId)?.code ?? String(c.indicatorId);
    (dist.indicators[code] ??= zero())[k] += c.n;
    byDistrict.set(c.districtId, dist);
  }
  const newIds = new Set((ev?.newDistricts ?? []).map((d) => d.id));
  const derived = new Map<number, { insert: number; change: number; remove: number }>();
  for (const d of ev?.derived ?? []) {
    const e = derived.get(d.indicatorId) ?? { insert: 0, change: 0, remove: 0 };
    e[d.kind === 'i' ? 'insert' : d.kind === 'c' ? 'change' : 'remove'] += d.n;
    derived.set(d.indicatorId, e);
  }
  return {
    format: read.format,
    delimiter: read.delimiter,
    decimalComma,
    rowsRead: read.rowsRead,
    values: read.values,
    blankLines: read.blankLines,
    years: { first: read.firstYear, last: read.lastYear },
    totals,
    byIndicator: [...byIndicator]
      .map(([id, c]) => ({
        indicator: names.indicators.get(id)?.code ?? String(id),
        name: names.indicators.get(id)?.name ?? '',
        ...c,
      }))
      .sort((a, b) => a.indicator.localeCompare(b.indicator)),
    byDistrict: [...byDistrict]
      .map(([id, c]) => ({
        district: names.districts.get(id)?.code ?? String(id),
        name: names.districts.get(id)?.name ?? '',
        isNew: newIds.has(id),
        ...c,
      }))
      .sort((a, b) => DISTRICT_ORDER.compare(a.district, b.district))
      .slice(0, PREVIEW_LIST_CAP),
    newDistricts: (ev?.newDistricts ?? [])
      .slice(0, PREVIEW_LIST_CAP)
      .map(({ code, name, line }) => ({ code, name, line })),
    districtsTotal: districtIds.size,
    newDistrictsTotal: ev?.newDistricts.length ?? 0,
    derived: [...derived].map(([id, c]) => ({ indicator: names.indicators.get(id)?.code ?? String(id), ...c })),
    expiresAt: previewedAt ? new Date(previewedAt.getTime() + STAGING_TTL_HOURS * 3600_000).toISOString() : null,
  };
}
