// Screens loaded on demand (the web's staff screens and print views): the route shows its
// title and a loading placeholder until the chunk arrives, then the screen; a failed fetch
// says so and fetches again on "Try again"; once loaded, the group's screens render at once.
import { fireEvent, render, screen, waitFor } from '@testing-library/react-native';
import { Text } from 'react-native';

import { onDemandPage, type PageSource } from '@/components/layout/on-demand-page';

jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const pages = {
  FirstPage: () => <Text>first screen</Text>,
  SecondPage: () => <Text>second screen</Text>,
};

function deferred<T>() {
  let resolve!: (v: T) => void;
  let reject!: (e: unknown) => void;
  const promise = new Promise<T>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  return { promise, resolve, reject };
}

it('is the screen itself where the group ships with the app', () => {
  expect(onDemandPage({ ready: pages }, 'FirstPage', 'First')).toBe(pages.FirstPage);
});

it('shows the title and a loading placeholder, then the screen; a second screen renders at once', async () => {
  const gate = deferred<typeof pages>();
  const load = jest.fn(() => gate.promise);
  const source: PageSource<typeof pages> = { load };
  const First = onDemandPage(source, 'FirstPage', 'First');
  const Second = onDemandPage(source, 'SecondPage', 'Second');
  const first = render(<First />);
  expect(screen.getByText('First')).toBeTruthy();
  expect(screen.getByTestId('on-demand-loading')).toBeTruthy();
  expect(screen.queryByText('first screen')).toBeNull();
  gate.resolve(pages);
  expect(await screen.findByText('first screen')).toBeTruthy();
  first.unmount();
  render(<Second />);
  expect(screen.getByText('second screen')).toBeTruthy();
  expect(load).toHaveBeenCalledTimes(1);
});

it('says when the chunk did not arrive and fetches again on "Try again"', async () => {
  const load = jest
    .fn<Promise<typeof pages>, []>()
    .mockRejectedValueOnce(new Error('ChunkLoadError'))
    .mockResolvedValueOnce(pages);
  const First = onDemandPage({ load }, 'FirstPage', 'First');
  render(<First />);
  expect(await screen.findByTestId('on-demand-failed')).toBeTruthy();
  expect(screen.getByText('This screen could not be loaded')).toBeTruthy();
  fireEvent.press(screen.getByText('Try again'));
  expect(await screen.findByText('first screen')).toBeTruthy();
  await waitFor(() => expect(load).toHaveBeenCalledTimes(2));
});
