// Phone details: the header's Menu panel closes on navigation and on Escape (WAI-ARIA
// Authoring Practices, Disclosure pattern: Escape closes and focus returns to the button),
// and the Refresh control refetches the screen's queries through react-query, shows that it
// is busy, then when the figures were fetched.
import { QueryClient, QueryClientProvider, useQuery } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react-native';
import { router, usePathname } from 'expo-router';
import { renderRouter } from 'expo-router/testing-library';

import { HeaderArea, type HeaderAreaProps } from '@/components/layout/header-area';
import { RefreshButton } from '@/components/ui/refresh-button';
import { formatClock } from '@/lib/format-time';

import { me } from './support/render-staff';

const signedIn: HeaderAreaProps['me'] = {
  status: 'success',
  data: me('analyst'),
  error: null,
  isFetching: false,
  refetch: () => undefined,
};

function Header() {
  const pathname = usePathname();
  return (
    <HeaderArea mode="phone" pathname={pathname} me={signedIn} demo onSignOut={() => undefined} signingOut={false} />
  );
}

function renderHeader() {
  return renderRouter({ index: Header, alerts: Header, runs: Header }, { initialUrl: '/' });
}

describe('the phone Menu panel', () => {
  // The component tests run without a DOM; the header listens for Escape on `document`
  // when one exists (the web), so the test gives it one to dispatch on.
  const hadDocument = 'document' in globalThis;
  beforeEach(() => {
    if (!hadDocument) (globalThis as { document?: unknown }).document = new EventTarget();
  });
  afterEach(() => {
    if (!hadDocument) delete (globalThis as { document?: unknown }).document;
  });

  const pressKey = (key: string) =>
    act(() => {
      (globalThis as unknown as { document: EventTarget }).document.dispatchEvent(
        Object.assign(new Event('keydown'), { key }),
      );
    });

  it('closes on Escape, and only on Escape', () => {
    renderHeader();
    fireEvent.press(screen.getByTestId('menu-button'));
    expect(screen.getByTestId('nav-menu')).toBeTruthy();
    expect(screen.getByLabelText('Close the menu')).toBeTruthy();
    pressKey('Enter');
    expect(screen.getByTestId('nav-menu')).toBeTruthy();
    pressKey('Escape');
    expect(screen.queryByTestId('nav-menu')).toBeNull();
    expect(screen.getByLabelText('Menu')).toBeTruthy();
  });

  it('stops listening once closed', () => {
    const doc = (globalThis as unknown as { document: EventTarget }).document;
    const add = jest.spyOn(doc, 'addEventListener');
    const remove = jest.spyOn(doc, 'removeEventListener');
    renderHeader();
    expect(add).not.toHaveBeenCalled();
    fireEvent.press(screen.getByTestId('menu-button'));
    expect(add).toHaveBeenCalledWith('keydown', expect.any(Function));
    fireEvent.press(screen.getByTestId('menu-button'));
    expect(remove).toHaveBeenCalledWith('keydown', add.mock.calls[0][1]);
  });

  it('closes when a section is chosen, and on any change of route', async () => {
    const app = renderHeader();
    fireEvent.press(screen.getByTestId('menu-button'));
    fireEvent.press(screen.getByTestId('menu-alerts'));
    await waitFor(() => expect(app.getPathname()).toBe('/alerts'));
    expect(screen.queryByTestId('nav-menu')).toBeNull();

    // Open again, then the route changes by other means (a link in the page, the back button).
    fireEvent.press(screen.getByTestId('menu-button'));
    expect(screen.getByTestId('nav-menu')).toBeTruthy();
    act(() => router.push('/runs'));
    await waitFor(() => expect(app.getPathname()).toBe('/runs'));
    expect(screen.queryByTestId('nav-menu')).toBeNull();
  });
});

describe('the Refresh control', () => {
  function Screen({ fetches }: { fetches: { list: jest.Mock; run: jest.Mock } }) {
    const list = useQuery({ queryKey: ['list'], queryFn: fetches.list, staleTime: Infinity });
    const run = useQuery({ queryKey: ['run'], queryFn: fetches.run, staleTime: Infinity });
    return <RefreshButton queries={[list, run]} what="the districts" testID="refresh" />;
  }

  it('fetches every query of the screen again, says it is busy, then when it was updated', async () => {
    let release: () => void = () => undefined;
    const fetches = {
      list: jest.fn(async () => ['D01']),
      run: jest.fn(async () => ({ id: 1 })),
    };
    const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    render(
      <QueryClientProvider client={client}>
        <Screen fetches={fetches} />
      </QueryClientProvider>,
    );
    await waitFor(() => expect(screen.getByTestId('refresh-status').props.children).toMatch(/^Updated \d\d:\d\d$/));
    expect(fetches.list).toHaveBeenCalledTimes(1);
    expect(fetches.run).toHaveBeenCalledTimes(1);
    expect(screen.getByLabelText('Refresh the districts')).toBeTruthy();

    // The next answer for the list waits until released: the button shows it is busy meanwhile.
    fetches.list.mockImplementationOnce(
      () => new Promise<string[]>((resolve) => (release = () => resolve(['D01', 'D02']))),
    );
    fireEvent.press(screen.getByTestId('refresh'));
    await waitFor(() => expect(screen.getByText('Refreshing…')).toBeTruthy());
    expect(screen.getByTestId('refresh').props.accessibilityState).toMatchObject({ busy: true });
    expect(fetches.list).toHaveBeenCalledTimes(2);
    expect(fetches.run).toHaveBeenCalledTimes(2);
    // A second press while busy asks for nothing more.
    fireEvent.press(screen.getByTestId('refresh'));
    expect(fetches.list).toHaveBeenCalledTimes(2);

    await act(async () => release());
    await waitFor(() => expect(screen.getByText('Refresh')).toBeTruthy());
    expect(client.getQueryData(['list'])).toEqual(['D01', 'D02']);
    const updatedAt = Math.max(
      client.getQueryState(['list'])!.dataUpdatedAt,
      client.getQueryState(['run'])!.dataUpdatedAt,
    );
    expect(screen.getByTestId('refresh-status').props.children).toBe(`Updated ${formatClock(updatedAt)}`);
  });

  it('says nothing about an update before the first answer', () => {
    render(
      <RefreshButton queries={[{ refetch: jest.fn(), isFetching: false, dataUpdatedAt: 0 }]} what="this district" />,
    );
    expect(screen.getByTestId('refresh-status').props.children).toBe('');
    expect(screen.getByLabelText('Refresh this district')).toBeTruthy();
  });
});
