import { fireEvent, screen, waitFor } from 'expo-router/testing-library';

import { ApiError, apiGet } from '@/lib/api-client';
import { openServerPage } from '@/lib/open-server-page';

import { answerWith } from './support/mock-api';
import { renderApp } from './support/render-app';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
}));
jest.mock('@/lib/open-server-page', () => ({ openServerPage: jest.fn() }));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone' }));
// Document titles need the helmet provider of a full ExpoRoot; they are not under test here.
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const unauthenticated = new ApiError(401, 'unauthenticated', 'Sign in to continue.');

afterEach(() => {
  mockedGet.mockReset();
  (openServerPage as jest.Mock).mockReset();
});

describe('signing in', () => {
  it('turns a 401 on the list into a sign-in link instead of Retry', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/region': unauthenticated }));
    const app = renderApp('/');
    expect(await screen.findByText('Sign in to see the district list')).toBeTruthy();
    expect(screen.queryByText('Retry')).toBeNull();
    fireEvent.press(screen.getByLabelText('Sign in'));
    await waitFor(() => expect(app.getPathname()).toBe('/sign-in'));
  });

  it('hands over to the server sign-in URL it is given, naming the demo stand-in', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/auth/options': { provider: 'stand-in', signInUrl: '/api/auth/stand-in' },
        '/api/me': unauthenticated,
      }),
    );
    renderApp('/sign-in');
    fireEvent.press(await screen.findByText('Continue to sign-in'));
    expect(openServerPage).toHaveBeenCalledWith('/api/auth/stand-in');
    expect(screen.getByText(/Demo mode/)).toBeTruthy();
  });

  it('explains a failed sign-in sent back by the server', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/auth/options': { provider: 'google', signInUrl: '/api/auth/google' },
        '/api/me': unauthenticated,
      }),
    );
    renderApp('/sign-in?error=no_email');
    expect(await screen.findByTestId('sign-in-problem')).toBeTruthy();
    expect(screen.getByText(/did not share an e-mail address/)).toBeTruthy();
    expect(screen.queryByText(/Demo mode/)).toBeNull();
  });

  it.each([
    [
      'idle',
      'Your session ended after 30 minutes without activity. Sign in again.',
      'Signed out after a while without activity',
    ],
    ['lifetime', 'Sessions last at most 12 hours. Sign in again.', 'Your session reached its time limit'],
  ])('says the session ended (%s) on the sign-in screen', async (reason, message, title) => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/auth/options': { provider: 'google', signInUrl: '/api/auth/google' },
        '/api/me': new ApiError(401, 'session_expired', message, { reason }),
      }),
    );
    renderApp('/sign-in');
    expect(await screen.findByTestId(`sign-in-session-${reason}`)).toBeTruthy();
    expect(screen.getByText(title)).toBeTruthy();
    expect(screen.getByText(message)).toBeTruthy();
    expect(screen.getByText('Continue to sign-in')).toBeTruthy();
  });

  it('says an idle session ended where a list failed to load, with a way to sign in again', async () => {
    const message = 'Your session ended after 30 minutes without activity. Sign in again.';
    mockedGet.mockImplementation(
      answerWith({ '/api/region': new ApiError(401, 'session_expired', message, { reason: 'idle' }) }),
    );
    const app = renderApp('/');
    expect(await screen.findByText('Signed out after a while without activity')).toBeTruthy();
    expect(screen.getByText(message)).toBeTruthy();
    fireEvent.press(screen.getByLabelText('Sign in again'));
    await waitFor(() => expect(app.getPathname()).toBe('/sign-in'));
  });

  it.each([
    ['identity_mismatch', 'This address belongs to another Google account'],
    ['invitation_expired', 'This invitation has expired'],
    ['email_unverified', 'This Google account’s address is not verified'],
    ['wrong_domain', 'This account is outside the agency’s domain'],
  ])('explains the refusal %s', async (reason, title) => {
    mockedGet.mockImplementation(answerWith({}));
    renderApp(`/no-access?reason=${reason}`);
    expect(await screen.findByText(title)).toBeTruthy();
  });

  it('says why access was refused', async () => {
    mockedGet.mockImplementation(answerWith({}));
    renderApp('/no-access?reason=not_invited');
    expect(await screen.findByText('This account has not been invited')).toBeTruthy();
  });
});
