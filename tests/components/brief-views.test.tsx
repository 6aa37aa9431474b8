// The print-friendly brief views: the district and region briefs render the content the
// server worded and rounded (the same object its PDF is drawn from), with loading, empty
// and error states; and the brief's words for standings, shapes and cautions are the
// screen's words.
import { act, render, screen, within } from '@testing-library/react-native';

import {
  SHAPE_LABEL as BRIEF_SHAPES,
  STANDING_LABEL as BRIEF_STANDINGS,
  CAUTIONS as BRIEF_CAUTIONS,
} from '@/api/briefs/words';
import { BriefScreen } from '@/components/brief/brief-screen';
import { DistrictBriefView } from '@/components/brief/district-brief-view';
import { RegionBriefView } from '@/components/brief/region-brief-view';
import { ApiError } from '@/lib/api-client';
import type { ChartScene, DistrictBriefContent, RegionBriefContent } from '@/contracts/briefs';
import { CAUTIONS } from '@/lib/cautions';
import { SHAPE_LABEL, STANDING_LABEL } from '@/lib/estimate-words';

jest.mock('@/lib/router', () => ({
  ...jest.requireActual('@/lib/router'),
  Link: ({ children }: { children: unknown }) => children,
}));

const scene: ChartScene = {
  width: 252,
  height: 205,
  title: 'Emissions and income',
  description:
    'Emissions against real income per person for each observed year, with the fitted curve and the threshold 22,000 with its 95% band.',
  items: [{ kind: 'path', d: 'M0 0 L10 10', stroke: 'curve', width: 1 }],
};

const trace = {
  runId: 12,
  publishedAt: '3 December 2026, 14:05 (UTC)',
  publishedAtIso: '2026-12-03T14:05:00.000Z',
  dataVersion: '3',
  dataHash: '29afc9437b35',
  softwareVersion: '0.1.0',
  generatedAt: '4 December 2026, 09:00 (UTC)',
  timeZone: 'UTC',
  line: 'Run #12 · published 3 December 2026, 14:05 (UTC) · data version 3 (hash 29afc9437b35) · Crestwatch 0.1.0',
};

const cautions = CAUTIONS.map((c) => c.full);

const district: DistrictBriefContent = {
  kind: 'district',
  code: 'D24',
  name: 'Yarrowgate (Jarłowo-Şelé / Жарово)',
  subtitle: 'District brief · D24 · published run #12 of 3 December 2026',
  headline:
    'Yarrowgate (Jarłowo-Şelé / Жарово) is past its threshold: income per person (42,100 in 2025) is above the band where emissions have tended to turn down, estimated at 20,800.',
  standing: { key: 'past_turn', label: 'Past the turn', note: null },
  figures: [
    { key: 'standing', label: 'Standing', value: 'Past the turn', detail: 'read against the 95% Fieller interval' },
    {
      key: 'threshold',
      label: 'Threshold (turning point)',
      value: '20,800',
      detail: '95% Fieller interval 20,300 – 21,300; delta method 20,300 – 21,300',
    },
  ],
  charts: { curve: scene, path: { ...scene, title: 'Income over the years' } },
  reading: [
    'Over 1995–2025, emissions rose with real income per person at first.',
    'In 2025, real income per person was 42,100.',
    'The 95% interval runs from 20,300 to 21,300: read the band, not the point.',
  ],
  substitute: null,
  analystNote: 'Income for 2024 was revised.',
  modelLine: 'Log–quadratic of CO2 emissions per person on real income per person.',
  cautions,
  trace,
  paperSize: 'A4',
  pdfPath: '/api/briefs/district/D24.pdf',
};

/** Lets the lazily loaded chart drawing arrive inside act(). */
const settleCharts = () =>
  act(async () => {
    await new Promise((resolve) => setTimeout(resolve, 0));
  });

const ok = <T,>(data: T) => ({
  status: 'success' as const,
  data,
  error: null,
  isFetching: false,
  refetch: () => undefined,
});

describe('district brief view', () => {
  it('shows the name, standing, figures, both charts, the reading, the note, the cautions and the trace', async () => {
    render(<DistrictBriefView content={district} />);
    await settleCharts();
    expect(screen.getByRole('heading', { name: 'Yarrowgate (Jarłowo-Şelé / Жарово)' })).toBeTruthy();
    expect(within(screen.getByTestId('brief-standing')).getByText('Past the turn')).toBeTruthy();
    const threshold = within(screen.getByTestId('brief-figure-threshold'));
    expect(threshold.getByText('20,800')).toBeTruthy();
    expect(threshold.getByText('95% Fieller interval 20,300 – 21,300; delta method 20,300 – 21,300')).toBeTruthy();
    expect(screen.getByTestId('brief-curve-chart')).toBeTruthy();
    expect(screen.getByText('Income over the years')).toBeTruthy();
    expect(screen.getByText(`• ${district.reading[2]}`)).toBeTruthy();
    expect(screen.getByText('Income for 2024 was revised.')).toBeTruthy();
    const c = within(screen.getByTestId('brief-cautions'));
    for (const line of cautions) expect(c.getByText(`• ${line}`)).toBeTruthy();
    expect(within(screen.getByTestId('brief-trace')).getByText(trace.line)).toBeTruthy();
  });
});

describe('region brief view', () => {
  it('shows the counts, the lists with their notes, and every district in the table under one header', () => {
    const region: RegionBriefContent = {
      kind: 'region',
      subtitle: 'Region brief · published run #12 of 3 December 2026',
      headline: '2 districts in this run: 1 past the turn, 1 no turn.',
      counts: [
        { key: 'past_turn', label: 'Past the turn', count: 1 },
        { key: 'no_turn', label: 'No turn', count: 1 },
      ],
      crossed: [],
      crossedNote: 'This is the first published run: there is nothing to compare with.',
      shifts: [],
      shiftsNote: 'This is the first published run: there is nothing to compare with.',
      pooled: { figures: [], chart: null, note: 'No regional pooled curve in this run.' },
      table: {
        columns: [
          { key: 'code', label: 'Code' },
          { key: 'name', label: 'District' },
          { key: 'standing', label: 'Standing' },
          { key: 'gap', label: 'Gap' },
          { key: 'threshold', label: 'Threshold' },
          { key: 'interval', label: '95% interval' },
          { key: 'crossing', label: 'Crossing year' },
        ],
        rows: [
          {
            code: 'D01',
            name: 'Amberlyn Reach',
            standing: 'Past the turn',
            gap: '+72%',
            threshold: '22,000',
            interval: '14,300 – 36,500',
            crossing: 'passed 2013 (2004–2025)',
          },
          {
            code: 'D05',
            name: 'Elderwick Fen',
            standing: 'No turn',
            gap: '+3,010%',
            threshold: '609',
            interval: 'not bounded at 95%',
            crossing: 'passed 1931',
          },
        ],
      },
      modelLine: 'Log–quadratic.',
      cautions,
      trace,
      paperSize: 'LETTER',
      pdfPath: '/api/briefs/region.pdf',
    };
    render(<RegionBriefView content={region} />);
    expect(within(screen.getByTestId('brief-count-past_turn')).getByText('1')).toBeTruthy();
    expect(screen.getAllByText('This is the first published run: there is nothing to compare with.')).toHaveLength(2);
    const table = within(screen.getByTestId('brief-table'));
    expect(table.getAllByText('Code')).toHaveLength(1);
    expect(table.getByText('Amberlyn Reach')).toBeTruthy();
    expect(table.getByText('not bounded at 95%')).toBeTruthy();
    expect(table.getByText('passed 2013 (2004–2025)')).toBeTruthy();
  });
});

describe('brief screen states', () => {
  const child = () => <DistrictBriefView content={district} />;

  it('shows a skeleton while loading, and the PDF link already', () => {
    render(
      <BriefScreen
        query={{ status: 'pending', data: undefined, error: null, isFetching: true, refetch: () => undefined }}
        what="district brief of D24"
        pdfPath="/api/briefs/district/D24.pdf"
      >
        {child}
      </BriefScreen>,
    );
    expect(screen.getByTestId('brief-loading')).toBeTruthy();
    expect(screen.getByTestId('brief-pdf-link')).toBeTruthy();
  });

  it('says there is no brief before anything is published', () => {
    const error = new ApiError(404, 'no_published_run', 'Nothing has been published yet.');
    render(
      <BriefScreen
        query={{ status: 'error', data: undefined, error, isFetching: false, refetch: () => undefined }}
        what="district brief of D24"
        pdfPath="/api/briefs/district/D24.pdf"
      >
        {child}
      </BriefScreen>,
    );
    expect(screen.getByTestId('brief-nothing-published')).toBeTruthy();
  });

  it('names an unknown district', () => {
    const error = new ApiError(404, 'not_found', 'No district with code D99');
    render(
      <BriefScreen
        query={{ status: 'error', data: undefined, error, isFetching: false, refetch: () => undefined }}
        what="district brief of D99"
        pdfPath="/api/briefs/district/D99.pdf"
      >
        {child}
      </BriefScreen>,
    );
    expect(within(screen.getByTestId('brief-not-found')).getByText('No district with code D99')).toBeTruthy();
  });

  it('renders the content once loaded', async () => {
    render(
      <BriefScreen query={ok(district)} what="district brief of D24" pdfPath="/api/briefs/district/D24.pdf">
        {child}
      </BriefScreen>,
    );
    await settleCharts();
    expect(screen.getByTestId('district-brief')).toBeTruthy();
  });
});

describe('brief words', () => {
  it('name standings, shapes and cautions as the screens do', () => {
    expect(BRIEF_STANDINGS).toEqual(STANDING_LABEL);
    expect(BRIEF_SHAPES).toEqual(SHAPE_LABEL);
    expect([...BRIEF_CAUTIONS]).toEqual(CAUTIONS.map((c) => c.full));
  });
});
