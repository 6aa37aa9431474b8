/** What the upload reader needs and what it hands back. */
import type { ProblemList } from '../problems';
import type { UploadOptions } from '../schema';
import type { Format, IndicatorRef } from './header';

export interface CatalogueEntry extends IndicatorRef {
  mustBePositive: boolean;
}

export interface DistrictSeen {
  code: string;
  firstLine: number;
  rows: number;
  /** The first non-empty name given for it, with its line. */
  name: string | null;
  nameLine: number | null;
  /** A name cell for it was refused (so "unknown district" would say nothing new). */
  nameRefused: boolean;
}

export interface ReadSummary {
  format: Format | null;
  delimiter: string | null;
  rowsRead: number;
  blankLines: number;
  /** Values read (long: one a row; wide: the non-empty indicator cells). */
  values: number;
  staged: number;
  districts: DistrictSeen[];
  firstYear: number | null;
  lastYear: number | null;
  /** True when reading stopped early (bad header, binary data, an open quote …). */
  fatal: boolean;
  /** 1-based columns of the header, once it has been read. */
  columns: { district: number; name: number | null; names: string[] } | null;
}

export interface ReaderContext {
  catalogue: Map<string, CatalogueEntry>;
  options: UploadOptions;
  currentYear: number;
  problems: ProblemList;
  /** Codes of the districts already stored (a code not among them is new). */
  knownDistricts?: ReadonlySet<string>;
  /** More new district codes than this stop the read (no cap when absent). */
  maxNewDistricts?: number;
}

/** A duplicate key whose first line is looked up in the staged rows. */
export interface DuplicateRef {
  problemIndex: number;
  district: string;
  indicatorId: number;
  year: number;
}
