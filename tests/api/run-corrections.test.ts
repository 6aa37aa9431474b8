import { answerChanges } from '../../api/runs/corrections';
import type { EstimateRecord } from '../../api/runs/estimate-record';

// The listing of published answers that change when a run is reproduced with corrected
// software (issue: what officials already saw). Pure function; the records are invented.

function record(
  code: string,
  standing: string,
  threshold: number | null,
  lo: number | null,
  hi: number | null,
  status: EstimateRecord['status'] = 'ok',
) {
  return {
    code,
    name: `District ${code}`,
    status,
    standing: {
      standing,
      intervalMethod: 'fieller',
      intervalBounded: lo !== null,
      levelLo: lo,
      levelHi: hi,
      note: null,
    },
    threshold: threshold === null ? null : { level: threshold },
  } as unknown as EstimateRecord & { code: string; name: string };
}

describe('answerChanges', () => {
  test('lists threshold, interval and standing changes, in code order; same figures to 1e-9 are not changes', () => {
    const published = [
      record('D02', 'past_turn', 24952600, null, null),
      record('D01', 'approaching', 22058, 20178, 23821),
      record('D03', 'no_turn', null, null, null),
    ];
    const reproduced = [
      record('D01', 'approaching', 22058 * (1 + 1e-12), 20178, 23821), // rounding only
      record('D02', 'at_turn', 22058326, 20178000, 23821000),
      record('D03', 'not_estimable', null, null, null, 'not_estimable'),
    ];
    const changes = answerChanges(published, reproduced);
    expect(changes.map((c) => [c.code, c.fields])).toEqual([
      ['D02', ['threshold', 'interval', 'standing']],
      ['D03', ['status', 'standing']],
    ]);
    expect(changes[0].before!.threshold).toBe(24952600);
    expect(changes[0].after!.threshold).toBe(22058326);
  });

  test('a district in only one run is listed with the other side null', () => {
    const changes = answerChanges([record('D01', 'at_turn', 1, 0.5, 2)], [record('D09', 'at_turn', 1, 0.5, 2)]);
    expect(changes.map((c) => [c.code, c.before === null, c.after === null])).toEqual([
      ['D01', false, true],
      ['D09', true, false],
    ]);
  });
});
