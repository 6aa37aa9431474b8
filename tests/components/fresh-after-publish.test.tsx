// Fresh after publish: a publish made on this device refreshes the open card at once, and a
// publish made elsewhere reaches an official's open card through GET /api/published when the
// app regains focus (react-query's focusManager stands in for the browser's focus events).
// Plumbing over mocked API answers: the figures are invented.
import { focusManager, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { act, fireEvent, renderRouter, screen, waitFor } from 'expo-router/testing-library';
import { Pressable, Text } from 'react-native';

import DistrictScreen from '@/app/district/[code]';
import { usePublishedWatch } from '@/hooks/use-published';
import { usePublishRunMutation } from '@/hooks/use-runs';
import { apiGet, apiSend } from '@/lib/api-client';

import { cardAnswers, estimateRecord, estimateResponse, run } from './support/estimates';
import { gappyDetail } from './support/fixtures';
import { answerWith } from './support/mock-api';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
  apiSend: jest.fn(),
}));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const mockedSend = apiSend as jest.MockedFunction<typeof apiSend>;

const nextRun = { ...run, id: 8, publishedAt: '2026-12-01T09:00:00.000Z' };
let published = run.id;

function answers() {
  const card =
    published === run.id
      ? estimateResponse(estimateRecord({}))
      : estimateResponse(estimateRecord({}), { run: nextRun });
  mockedGet.mockImplementation((path: string) =>
    answerWith({
      ...cardAnswers(estimateRecord({})),
      '/api/districts/T02/estimate': card,
      '/api/districts/T02': gappyDetail,
      '/api/published': { runId: published },
    })(path),
  );
}

function PublishButton() {
  const publish = usePublishRunMutation();
  return (
    <Pressable accessibilityRole="button" onPress={() => void publish.mutateAsync(nextRun.id)}>
      <Text>Publish run 8</Text>
    </Pressable>
  );
}

function render(withWatch: boolean) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity } } });
  function Watched() {
    usePublishedWatch(withWatch);
    return (
      <>
        <PublishButton />
        <Slot />
      </>
    );
  }
  function Root() {
    return (
      <QueryClientProvider client={client}>
        <Watched />
      </QueryClientProvider>
    );
  }
  return renderRouter({ _layout: Root, 'district/[code]': DistrictScreen }, { initialUrl: '/district/T02' });
}

beforeEach(() => {
  published = run.id;
  answers();
  mockedSend.mockResolvedValue({ alerts: { total: 0 } });
});
afterEach(() => {
  mockedGet.mockReset();
  mockedSend.mockReset();
  focusManager.setFocused(undefined);
});

it('publishing here refreshes the open card at once (no waiting for its stale time)', async () => {
  render(false);
  await screen.findByText(/Run #7, published 2 Oct 2026/);
  published = nextRun.id;
  answers();
  fireEvent.press(screen.getByText('Publish run 8'));
  await screen.findByText(/Run #8, published 1 Dec 2026/);
  expect(mockedSend).toHaveBeenCalledWith('POST', '/api/runs/8/publish', expect.anything());
});

it('a publish made elsewhere reaches the open card when the app regains focus', async () => {
  render(true);
  await screen.findByText(/Run #7, published 2 Oct 2026/);
  await waitFor(() => expect(mockedGet.mock.calls.some(([p]) => p === '/api/published')).toBe(true));
  const asked = () => mockedGet.mock.calls.filter(([p]) => p === '/api/districts/T02/estimate').length;
  const before = asked();

  // Another device publishes run 8; this one is in the background, then comes back.
  published = nextRun.id;
  answers();
  act(() => focusManager.setFocused(false));
  act(() => focusManager.setFocused(true));

  await screen.findByText(/Run #8, published 1 Dec 2026/);
  expect(asked()).toBeGreaterThan(before);
});

it('coming back with nothing new published asks only the cheap question', async () => {
  render(true);
  await screen.findByText(/Run #7, published 2 Oct 2026/);
  await waitFor(() => expect(mockedGet.mock.calls.some(([p]) => p === '/api/published')).toBe(true));
  const estimateCalls = () => mockedGet.mock.calls.filter(([p]) => p === '/api/districts/T02/estimate').length;
  const publishedCalls = () => mockedGet.mock.calls.filter(([p]) => p === '/api/published').length;
  const [estimates, checks] = [estimateCalls(), publishedCalls()];
  act(() => focusManager.setFocused(false));
  act(() => focusManager.setFocused(true));
  await waitFor(() => expect(publishedCalls()).toBeGreaterThan(checks));
  expect(estimateCalls()).toBe(estimates);
  expect(screen.getByText(/Run #7, published 2 Oct 2026/)).toBeTruthy();
});
