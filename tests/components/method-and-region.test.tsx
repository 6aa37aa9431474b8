// The method page (formulas, every standing, the cautions, references) and the wide home
// screen's region overview (run line, counts per standing, region brief).
import { render, screen, within } from '@testing-library/react-native';

import { MethodView } from '@/components/method/method-view';
import { RegionOverview } from '@/components/region/region-overview';
import { CAUTIONS } from '@/lib/cautions';
import type { RegionResponse } from '@/contracts/estimates';

import { co2Track, estimateRecord, run, summaryOf } from './support/estimates';
import { districtSummaries } from './support/fixtures';

jest.mock('@/lib/router', () => ({
  ...jest.requireActual('@/lib/router'),
  Link: ({ children }: { children: unknown }) => children,
}));

const ok = <T,>(data: T) => ({
  status: 'success' as const,
  data,
  error: null,
  isFetching: false,
  refetch: () => undefined,
});

describe('method page', () => {
  it('explains the threshold, the intervals, the standings and the cautions', () => {
    render(<MethodView showBackLink={false} />);
    expect(screen.getByText('x* = −b1 / (2·b2)        threshold X* = exp(x*) in real income per person')).toBeTruthy();
    expect(screen.getByText('(b1 + 2·b2·θ)² ≤ t²·(V11 + 4θ·V12 + 4θ²·V22)')).toBeTruthy();
    const standings = within(screen.getByTestId('method-standings'));
    for (const label of ['Approaching: ', 'At the turn: ', 'Past the turn: ', 'No turn: ', 'Not estimable: '])
      expect(standings.getByText(label)).toBeTruthy();
    const cautions = within(screen.getByTestId('method-cautions'));
    for (const c of CAUTIONS) expect(cautions.getByText(`– ${c.full}`)).toBeTruthy();
    expect(screen.getByText(/Fieller, E. C. \(1954\)/)).toBeTruthy();
    expect(screen.getByText(/Lind, J. T. and Mehlum, H. \(2010\)/)).toBeTruthy();
    expect(screen.getByText(/The demonstration data are invented: 24 districts/)).toBeTruthy();
  });
});

describe('region overview', () => {
  it('names the published run, counts districts per standing and links the region brief', () => {
    const approaching = summaryOf(estimateRecord({}));
    const rows = [
      { ...districtSummaries[0], estimate: approaching },
      { ...districtSummaries[1], estimate: { ...approaching, standing: 'past_turn' as const } },
      { ...districtSummaries[2], estimate: null },
    ];
    const region: RegionResponse = {
      track: co2Track,
      run,
      counts: {},
      pooled: { shape: 'inverted_u', threshold: 24000, fieller: { kind: 'bounded', levelLo: 21000, levelHi: 28000 } },
      districts: [],
    };
    render(<RegionOverview region={ok(region)} districts={ok(rows)} />);
    expect(
      within(screen.getByTestId('region-run')).getByText(
        /Run #7, published 2 Oct 2026 · spec “Regional default” · data version 3/,
      ),
    ).toBeTruthy();
    expect(within(screen.getByTestId('region-count-approaching')).getByText('1')).toBeTruthy();
    expect(within(screen.getByTestId('region-count-past_turn')).getByText('1')).toBeTruthy();
    expect(within(screen.getByTestId('region-count-not_estimable')).getByText('1')).toBeTruthy();
    expect(within(screen.getByTestId('region-count-at_turn')).getByText('0')).toBeTruthy();
    expect(screen.getByText(/turning point 24,000 € per person \(21,000–28,000\)/)).toBeTruthy();
    expect(screen.getByTestId('region-brief-link')).toBeTruthy();
  });

  it('says when no run is published yet, and offers no brief', () => {
    render(
      <RegionOverview
        region={ok<RegionResponse>({ track: co2Track, run: null, counts: {}, pooled: null, districts: [] })}
        districts={ok([])}
      />,
    );
    expect(screen.getByTestId('region-no-run')).toBeTruthy();
    expect(screen.queryByTestId('region-brief-link')).toBeNull();
  });
});
