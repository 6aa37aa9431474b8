// The header's navigation: which sections each role sees, the phone menu, the wide tabs,
// the role in the bar, and Sign out.
import { fireEvent, renderRouter, screen } from 'expo-router/testing-library';

import { HeaderArea, type HeaderAreaProps } from '@/components/layout/header-area';
import { activeNavKey, isRegionRoute, navItemsFor } from '@/components/layout/nav-items';
import type { MeResponse } from '@/contracts/districts';

import { me } from './support/render-staff';

const keys = (role: string, demo = true) => navItemsFor(role, { demo }).map((i) => i.key);

describe('sections by role', () => {
  it('gives officials the region, alerts and method only', () => {
    expect(keys('official')).toEqual(['region', 'alerts', 'method']);
  });

  it('gives analysts the working sections but none of the admin ones', () => {
    expect(keys('analyst')).toEqual(['region', 'alerts', 'runs', 'uploads', 'specs', 'method']);
  });

  it('gives admins everything, the mailbox only in demo mode', () => {
    expect(keys('admin')).toEqual([
      'region',
      'alerts',
      'runs',
      'uploads',
      'specs',
      'people',
      'settings',
      'audit',
      'mailbox',
      'method',
    ]);
    expect(keys('admin', false)).not.toContain('mailbox');
  });

  it('gives an unknown role nothing', () => {
    expect(keys('visitor')).toEqual([]);
  });

  it('marks the section a path belongs to', () => {
    const items = navItemsFor('admin', { demo: true });
    expect(activeNavKey(items, '/')).toBe('region');
    expect(activeNavKey(items, '/district/D07')).toBe('region');
    expect(activeNavKey(items, '/runs/12')).toBe('runs');
    expect(activeNavKey(items, '/subscriptions')).toBe('alerts');
    expect(activeNavKey(items, '/uploadsX')).toBeNull();
    expect(isRegionRoute('/district/D01')).toBe(true);
    expect(isRegionRoute('/runs')).toBe(false);
  });
});

function signedIn(data: MeResponse): HeaderAreaProps['me'] {
  return { status: 'success', data, error: null, isFetching: false, refetch: () => undefined };
}

function renderHeader(props: Partial<HeaderAreaProps> & Pick<HeaderAreaProps, 'mode' | 'me'>) {
  const onSignOut = jest.fn();
  renderRouter(
    {
      index: () => <HeaderArea pathname="/runs" demo={true} onSignOut={onSignOut} signingOut={false} {...props} />,
    },
    { initialUrl: '/' },
  );
  return { onSignOut };
}

describe('header', () => {
  it('on a phone shows the role in the bar and opens the sections from the menu, with Sign out', () => {
    const { onSignOut } = renderHeader({ mode: 'phone', me: signedIn(me('analyst')), unreadAlerts: 3 });
    expect(screen.getByTestId('account-role')).toBeTruthy();
    expect(screen.getByText('Analyst')).toBeTruthy();
    expect(screen.queryByTestId('nav-strip')).toBeNull();
    expect(screen.queryByTestId('nav-menu')).toBeNull();
    expect(screen.getByLabelText('Menu, 3 unread alerts')).toBeTruthy();

    fireEvent.press(screen.getByTestId('menu-button'));
    expect(screen.getByTestId('nav-menu')).toBeTruthy();
    expect(screen.getByTestId('menu-runs').props['aria-current']).toBe('page');
    expect(screen.queryByTestId('menu-people')).toBeNull();
    expect(screen.getByText('Signed in as analyst')).toBeTruthy();
    fireEvent.press(screen.getByTestId('sign-out'));
    expect(onSignOut).toHaveBeenCalledTimes(1);

    fireEvent.press(screen.getByTestId('menu-button'));
    expect(screen.queryByTestId('nav-menu')).toBeNull();
  });

  it('wide shows the sections as tabs, the name, the role and Sign out in the bar', () => {
    const { onSignOut } = renderHeader({ mode: 'wide', me: signedIn(me('admin')) });
    expect(screen.getByTestId('nav-strip')).toBeTruthy();
    expect(screen.getByTestId('nav-mailbox')).toBeTruthy();
    expect(screen.getByTestId('nav-runs').props['aria-current']).toBe('page');
    expect(screen.getByTestId('account-name').props.children).toBe('Demo admin');
    expect(screen.queryByTestId('menu-button')).toBeNull();
    fireEvent.press(screen.getByTestId('sign-out'));
    expect(onSignOut).toHaveBeenCalledTimes(1);
  });

  it('offers only a sign-in link, and no sections, when nobody is signed in', () => {
    const { ApiError } = jest.requireActual('@/lib/api-client');
    renderHeader({
      mode: 'wide',
      me: {
        status: 'error',
        data: undefined,
        error: new ApiError(401, 'unauthenticated', 'Sign in'),
        isFetching: false,
        refetch: () => undefined,
      },
    });
    expect(screen.getByLabelText('Sign in')).toBeTruthy();
    expect(screen.queryByTestId('nav-strip')).toBeNull();
    expect(screen.queryByTestId('account-role')).toBeNull();
  });
});
