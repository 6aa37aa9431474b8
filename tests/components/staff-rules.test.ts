// The staff screens' pure rules: cron in words, settings and spec drafts into API bodies,
// table sorting, review filters, residuals in words, times, and refusals in words.
import { cronWords } from '@/components/admin/cron-words';
import { settingsPatch } from '@/components/admin/settings-form';
import { describeSendError, fieldErrorsOf } from '@/components/form/mutation-notice';
import { residualSummary } from '@/components/runs/residual-plot';
import { levelDelta, matchesReviewFilter, percentShort } from '@/components/runs/run-words';
import { EMPTY_DRAFT, specInputOf } from '@/components/specs/spec-form-model';
import { sortRows, type Column } from '@/components/table/data-table';
import { changeWords, noopSummary, refusalSummary, uploadStatus } from '@/components/uploads/upload-words';
import { ApiError } from '@/lib/api-client';
import { formatBytes, formatDateTime, formatRelative } from '@/lib/format-time';

import { reviewAnswer, settingsAnswer } from './support/staff-fixtures';

describe('cron in words', () => {
  it('reads the quarterly default and a monthly and a daily schedule', () => {
    expect(cronWords('0 6 1 1,4,7,10 *')).toBe('06:00 on the 1st of January, April, July and October');
    expect(cronWords('30 7 15 * *')).toBe('07:30 on the 15th of every month');
    expect(cronWords('0 22 * * *')).toBe('22:00 every day');
    expect(cronWords('0 6 2 3 *')).toBe('06:00 on the 2nd of March');
  });

  it('gives up on shapes it does not know, rather than guessing', () => {
    expect(cronWords('*/5 * * * *')).toBeNull();
    expect(cronWords('0 6 1 1-3 *')).toBeNull();
    expect(cronWords('0 6 * * 1')).toBeNull();
    expect(cronWords('0 6 1 13 *')).toBeNull();
    expect(cronWords('not a cron')).toBeNull();
  });
});

describe('settings draft', () => {
  const draft = {
    confidencePercent: '95',
    alpha: '0.05',
    thresholdShiftPercent: '10',
    uploadChangeFactor: '3',
    regionTimeZone: 'UTC',
    regionLocale: 'en-GB',
    scheduleCron: '0 6 1 1,4,7,10 *',
    briefPaperSize: 'A4' as const,
    scheduleEnabled: true,
  };

  it('sends nothing when nothing changed', () => {
    expect(settingsPatch(settingsAnswer.settings, draft)).toEqual({ patch: {}, problems: {} });
  });

  it('turns the percent back into a level, accepts a decimal comma, tidies the cron', () => {
    const { patch, problems } = settingsPatch(settingsAnswer.settings, {
      ...draft,
      confidencePercent: '97,5',
      scheduleCron: ' 0  5 1 1,4,7,10 * ',
    });
    expect(problems).toEqual({});
    expect(patch).toEqual({ confidenceLevel: 0.975, scheduleCron: '0 5 1 1,4,7,10 *' });
  });

  it('names every field out of range, and a cron without five fields', () => {
    const { problems } = settingsPatch(settingsAnswer.settings, {
      ...draft,
      confidencePercent: '40',
      uploadChangeFactor: 'x',
      scheduleCron: '0 6 1',
    });
    expect(Object.keys(problems).sort()).toEqual(['confidencePercent', 'scheduleCron', 'uploadChangeFactor']);
  });

  it('sends a region locale in its canonical BCP 47 spelling, and refuses one that is not (Intl.getCanonicalLocales)', () => {
    expect(settingsPatch(settingsAnswer.settings, { ...draft, regionLocale: 'de-DE' }).patch).toEqual({
      regionLocale: 'de-DE',
    });
    expect(settingsPatch(settingsAnswer.settings, { ...draft, regionLocale: 'de_DE' }).problems).toHaveProperty(
      'regionLocale',
    );
    expect(settingsPatch(settingsAnswer.settings, { ...draft, regionLocale: 'de-de' }).problems).toHaveProperty(
      'regionLocale',
    );
  });
});

describe('spec draft', () => {
  it('needs a name and a driver other than the emissions indicator', () => {
    const { input, problems } = specInputOf({ ...EMPTY_DRAFT, driverIndicator: 'emissions_pc' });
    expect(input).toBeNull();
    expect(Object.keys(problems).sort()).toEqual(['driverIndicator', 'name']);
  });

  it('reads blank numbers as "not set", refuses others, and keeps the lag only for Newey–West', () => {
    expect(specInputOf({ ...EMPTY_DRAFT, name: 'A', firstYear: '19x0' }).problems).toEqual({
      firstYear: 'A whole number, or leave it blank.',
    });
    expect(specInputOf({ ...EMPTY_DRAFT, name: 'A', firstYear: '2010', lastYear: '2000' }).problems.firstYear).toMatch(
      /not be after/,
    );
    const nw = specInputOf({ ...EMPTY_DRAFT, name: ' A ', lag: '3', minYears: '' }).input!;
    expect(nw).toMatchObject({ name: 'A', lag: 3, minYears: null, firstYear: null });
    expect(specInputOf({ ...EMPTY_DRAFT, name: 'A', lag: '3', covariance: 'hc1' }).input!.lag).toBeUndefined();
  });

  it('drops controls that are the emissions or driver series, and level controls outside the log form', () => {
    const input = specInputOf({
      ...EMPTY_DRAFT,
      name: 'A',
      controls: ['income_pc', 'pop_density'],
      levelControls: ['pop_density'],
      transform: 'level',
    }).input!;
    expect(input.controls).toEqual(['pop_density']);
    expect(input.levelControls).toEqual([]);
  });
});

describe('table sorting', () => {
  const col: Column<{ v: number | null; s: string }> = {
    key: 'v',
    header: 'V',
    render: () => '',
    sortValue: (r) => r.v,
  };
  const rows = [
    { v: 2, s: 'b' },
    { v: null, s: 'n' },
    { v: -1, s: 'a' },
    { v: 10, s: 'c' },
  ];

  it('sorts numbers both ways and keeps nulls last either way', () => {
    expect(sortRows(rows, col, 'asc').map((r) => r.v)).toEqual([-1, 2, 10, null]);
    expect(sortRows(rows, col, 'desc').map((r) => r.v)).toEqual([10, 2, -1, null]);
  });

  it('sorts codes in natural order', () => {
    const codes: Column<{ c: string }> = { key: 'c', header: 'C', render: () => '', sortValue: (r) => r.c };
    expect(sortRows([{ c: 'D10' }, { c: 'D2' }, { c: 'D1' }], codes, 'asc').map((r) => r.c)).toEqual([
      'D1',
      'D2',
      'D10',
    ]);
  });
});

describe('review filters', () => {
  const [t01, t02, t03] = reviewAnswer.districts;

  it('counts a threshold as moved only beyond the admin percent', () => {
    expect(matchesReviewFilter(t01, 'threshold', 10)).toBe(false);
    expect(matchesReviewFilter(t01, 'threshold', 3)).toBe(true);
    expect(matchesReviewFilter(t02, 'threshold', 10)).toBe(true);
    expect(matchesReviewFilter(t03, 'threshold', 0)).toBe(false);
  });

  it('finds standing, shape and turn-test changes', () => {
    expect([t01, t02, t03].filter((r) => matchesReviewFilter(r, 'changed', 10)).map((r) => r.code)).toEqual(['T02']);
    expect(matchesReviewFilter(t02, 'standing', 10)).toBe(true);
    expect(matchesReviewFilter(t02, 'shape', 10)).toBe(false);
    expect(matchesReviewFilter(t02, 'significance', 10)).toBe(true);
  });

  it('prints moves with their sign', () => {
    expect(percentShort(12.34)).toBe('+12.3%');
    expect(percentShort(-0.04)).toBe('0%');
    expect(percentShort(null)).toBe('—');
    expect(levelDelta(-1234.4)).toBe('−1,234');
    expect(levelDelta(0.2)).toBe('0');
  });
});

describe('residuals in words', () => {
  it('names the years, the largest either way and the longest run of one sign', () => {
    const r = [2001, 2002, 2003, 2004, 2005, 2006, 2007].map((year, i) => ({
      year,
      residual: i < 6 ? 0.01 * (i + 1) : -0.2,
    }));
    expect(residualSummary(r)).toBe(
      '7 years, 2001–2007. Largest above the curve +0.060 in 2006, largest below −0.200 in 2007. Longest run of one sign: 6 years (a sign of serial correlation).',
    );
    expect(residualSummary([])).toBe('No residuals to show.');
  });
});

describe('times, sizes and upload words', () => {
  it('formats in one locale, optionally in a named zone', () => {
    expect(formatDateTime('2027-01-01T06:00:00.000Z', 'UTC')).toBe('1 Jan 2027, 06:00 UTC');
    expect(formatDateTime(null)).toBe('—');
    expect(formatRelative('2027-01-01T06:00:00.000Z', new Date('2026-12-02T06:00:00.000Z'))).toBe('in 30 days');
    expect(formatRelative('2026-12-02T05:58:00.000Z', new Date('2026-12-02T06:00:00.000Z'))).toBe('2 minutes ago');
    expect(formatBytes(412)).toBe('412 bytes');
    expect(formatBytes(1234)).toBe('1.2 kB');
    expect(formatBytes(52_400_000)).toBe('52.4 MB');
  });

  it('calls a revert that went through applied, and a file loaded', () => {
    expect(uploadStatus({ kind: 'file', status: 'committed' }).label).toBe('Loaded');
    expect(uploadStatus({ kind: 'revert', status: 'committed' }).label).toBe('Applied');
    expect(uploadStatus({ kind: 'file', status: 'previewed' }).label).toBe('Checked, not loaded');
    expect(changeWords({ insert: 1, change: 2, unchanged: 3, remove: 4 })).toBe(
      '1 new, 2 changed, 3 unchanged, 4 removed',
    );
  });
});

describe('refusals in words', () => {
  it('keeps the server’s message for 4xx and says what happened otherwise', () => {
    expect(describeSendError(new ApiError(409, 'run_in_progress', 'Run #4 of this spec is still running.'))).toBe(
      'Run #4 of this spec is still running.',
    );
    expect(describeSendError(new ApiError(403, 'forbidden', 'Admins only.'))).toBe(
      'Not allowed for your role: Admins only.',
    );
    expect(describeSendError(new ApiError(0, 'network_error', 'x'))).toMatch(
      /could not be reached\. Nothing was changed/,
    );
    expect(describeSendError(new ApiError(503, 'jobs_unavailable', 'x'))).toMatch(/\(503 jobs_unavailable\)/);
  });

  it('maps validation issues to the body’s field names', () => {
    const e = new ApiError(400, 'validation_failed', 'Invalid body', {
      issues: [
        { path: 'body.alpha', message: 'too big' },
        { path: 'body.controls.0', message: 'bad code' },
        { path: 'query.limit', message: 'ignored' },
      ],
    });
    // Only the body's fields belong to a form; a query problem stays in the message.
    expect(fieldErrorsOf(e)).toEqual({ alpha: 'too big', controls: 'bad code' });
    expect(fieldErrorsOf(new ApiError(409, 'x', 'y'))).toEqual({});
  });
});

describe('upload refusal and no-op words, composed from the answer fields', () => {
  const problem = (over: object) => ({
    line: 7,
    column: 2,
    field: 'year',
    code: 'bad_year',
    severity: 'error' as const,
    reason: 'year "20x5" is not a year',
    ...over,
  });

  it('names the first error by place, then how many more errors and warnings there are', () => {
    const warning = problem({ line: 2, severity: 'warning', reason: 'value changed by more than ×10' });
    expect(refusalSummary({ problems: [warning, problem({})], errorCount: 3, warningCount: 1 })).toBe(
      'Line 7, column 2 (year): year "20x5" is not a year (and 2 more errors and 1 warning).',
    );
  });

  it('starts with the reason when the problem has no place (a file-level problem)', () => {
    expect(
      refusalSummary({
        problems: [problem({ line: null, column: null, field: null, reason: 'the file is empty' })],
        errorCount: 1,
        warningCount: 0,
      }),
    ).toBe('The file is empty.');
  });

  it('says which earlier upload a re-sent file is, and that nothing changed', () => {
    expect(noopSummary({ id: 12, committedAt: null, version: 4 })).toBe(
      'This file was already loaded as upload #12 (—, data version 4): nothing was changed.',
    );
  });
});
