// Invented answers for the staff screens' component tests (plumbing only: no figure here means anything).
import type { ReviewResponse, RunView } from '@/contracts/runs';
import { co2Track } from './estimates';
import type { SettingsResponse } from '@/contracts/settings';
import type { UploadAnswer, UploadPreview, UploadSummary } from '@/contracts/uploads';

export const settingsAnswer: SettingsResponse = {
  settings: {
    confidenceLevel: 0.95,
    alpha: 0.05,
    thresholdShiftPercent: 10,
    uploadChangeFactor: 3,
    regionTimeZone: 'UTC',
    briefPaperSize: 'A4',
    scheduleCron: '0 6 1 1,4,7,10 *',
    scheduleEnabled: true,
  },
  schedule: { cron: '0 6 1 1,4,7,10 *', timeZone: 'UTC', enabled: true, nextRunAt: '2027-01-01T06:00:00.000Z' },
};

export function upload(over: Partial<UploadSummary> = {}): UploadSummary {
  return {
    id: 3,
    kind: 'file',
    status: 'committed',
    fileName: 'series.csv',
    checksum: 'ab'.repeat(32),
    byteSize: 1200,
    format: 'long',
    options: {},
    by: { userId: 2, email: 'analyst@crestwatch.example' },
    note: null,
    createdAt: '2026-11-30T09:00:00.000Z',
    committedAt: '2026-11-30T09:00:05.000Z',
    version: 4,
    revertsUploadId: null,
    revertedByUploadId: null,
    revertedAt: null,
    counts: {
      rowsRead: 10,
      values: 10,
      insert: 6,
      change: 4,
      unchanged: 0,
      remove: 0,
      derived: 0,
      errors: 0,
      warnings: 1,
    },
    canCommit: false,
    canRevert: true,
    ...over,
  };
}

export const preview: UploadPreview = {
  format: 'long',
  delimiter: ',',
  decimalComma: false,
  rowsRead: 10,
  values: 10,
  blankLines: 0,
  years: { first: 2021, last: 2025 },
  totals: { insert: 6, change: 4, unchanged: 0 },
  byIndicator: [{ indicator: 'emissions_pc', name: 'CO2 emissions per person', insert: 6, change: 4, unchanged: 0 }],
  byDistrict: [
    { district: 'T01', name: 'Ashgrove', isNew: false, indicators: {}, insert: 6, change: 0, unchanged: 0 },
    { district: 'T02', name: 'Bryn Ødegård', isNew: false, indicators: {}, insert: 0, change: 4, unchanged: 0 },
  ],
  newDistricts: [],
  derived: [],
  expiresAt: '2026-12-01T09:00:00.000Z',
};

export const previewAnswer: UploadAnswer = {
  noop: false,
  upload: upload({ id: 7, status: 'previewed', committedAt: null, version: null, canCommit: true, canRevert: false }),
  preview,
  problems: [
    {
      line: 4,
      column: 4,
      field: 'value',
      code: 'large_change',
      severity: 'warning',
      reason: 'value changes by more than ×3 against the stored 2.1',
    },
  ],
  problemsTruncated: false,
};

export const committedAnswer: UploadAnswer = {
  ...previewAnswer,
  upload: upload({ id: 7, status: 'committed', version: 5 }),
};

export function runView(over: Partial<RunView> = {}): RunView {
  return {
    id: 5,
    state: 'in_review',
    trigger: 'manual',
    track: co2Track,
    spec: {
      savedSpecId: 1,
      name: 'Regional default',
      selection: { emissions: 'emissions_pc', driver: 'income_pc', controls: [], firstYear: null, lastYear: null },
      model: {
        form: 'quadratic',
        transform: 'log',
        covariance: 'newey_west',
        level: 0.95,
        alpha: 0.05,
        intervalMethod: 'fieller',
      },
    },
    specId: 1,
    dataVersion: 4,
    dataHash: 'cd'.repeat(32),
    dataRows: 90,
    softwareVersion: '0.1.0',
    createdAt: '2026-11-30T10:00:00.000Z',
    startedAt: '2026-11-30T10:00:01.000Z',
    finishedAt: '2026-11-30T10:00:04.000Z',
    publishedAt: null,
    discardedAt: null,
    error: null,
    progress: { chunksDone: 1, chunksTotal: 1, districts: 3 },
    timings: null,
    standingCounts: { approaching: 1, past_turn: 1, no_turn: 1 },
    pooled: null,
    reproduction: null,
    ...over,
  };
}

const unchanged = { thresholdPercent: 0, standingChanged: false, shapeChanged: false, significanceChanged: false };

export const reviewAnswer: ReviewResponse = {
  track: co2Track,
  runId: 5,
  previousRunId: 4,
  // The settings' default limit (api/settings/schema.ts), as settingsAnswer above has it.
  thresholdShiftPercent: 10,
  districts: [
    {
      code: 'T01',
      name: 'Ashgrove',
      status: 'ok',
      standing: 'approaching',
      shape: 'inverted_u',
      threshold: 30000,
      gapPercent: -20,
      crossingYear: 2031,
      uTestRejects: true,
      intervalBounded: true,
      lastYear: 2025,
      previous: { standing: 'approaching', shape: 'inverted_u', threshold: 29000, uTestRejects: true },
      change: { ...unchanged, thresholdPercent: 3.4 },
      note: null,
    },
    {
      code: 'T02',
      name: 'Bryn Ødegård',
      status: 'ok',
      standing: 'past_turn',
      shape: 'inverted_u',
      threshold: 20000,
      gapPercent: 12,
      crossingYear: null,
      uTestRejects: true,
      intervalBounded: true,
      lastYear: 2025,
      previous: { standing: 'approaching', shape: 'inverted_u', threshold: 25000, uTestRejects: false },
      change: { thresholdPercent: -20, standingChanged: true, shapeChanged: false, significanceChanged: true },
      note: 'Revised income',
    },
    {
      code: 'T03',
      name: 'Coldwater',
      status: 'ok',
      standing: 'no_turn',
      shape: 'increasing',
      threshold: null,
      gapPercent: null,
      crossingYear: null,
      uTestRejects: false,
      intervalBounded: null,
      lastYear: 2025,
      previous: { standing: 'no_turn', shape: 'increasing', threshold: null, uTestRejects: false },
      change: { ...unchanged, thresholdPercent: null },
      note: null,
    },
  ],
};
