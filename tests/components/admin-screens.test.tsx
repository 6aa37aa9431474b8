// People, settings, specs, alerts and subscriptions over mocked API answers: what each sends,
// how refusals read, and what each role may do.
import { fireEvent, screen, waitFor, within } from 'expo-router/testing-library';

import { ApiError, apiGet, apiSend } from '@/lib/api-client';
import type { Person } from '@/contracts/people';

import { answerWith } from './support/mock-api';
import { me, renderStaff } from './support/render-staff';
import { settingsAnswer } from './support/staff-fixtures';

jest.mock('@/lib/api-client', () => ({
  ...jest.requireActual('@/lib/api-client'),
  apiGet: jest.fn(),
  apiSend: jest.fn(),
}));
jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;
const mockedSend = apiSend as jest.MockedFunction<typeof apiSend>;

afterEach(() => {
  mockedGet.mockReset();
  mockedSend.mockReset();
});

const person = (over: Partial<Person>): Person => ({
  id: 2,
  email: 'analyst@crestwatch.example',
  name: 'Demo analyst',
  role: 'analyst',
  active: true,
  status: 'active',
  createdAt: '2026-11-01T00:00:00.000Z',
  lastSignInAt: '2026-11-30T00:00:00.000Z',
  invitedAt: null,
  ...over,
});

describe('people', () => {
  const people = [person({ id: 1, email: 'admin@crestwatch.example', name: 'Demo admin', role: 'admin' }), person({})];

  it('invites an address with the chosen role and says the mail is on its way', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('admin'),
        '/api/people': { people },
        '/api/auth/options': { provider: 'stand-in', signInUrl: '/x' },
      }),
    );
    mockedSend.mockResolvedValue({
      user: person({ id: 9, email: 'new@crestwatch.example', role: 'official', status: 'invited' }),
      mail: { sent: true },
    });
    renderStaff('/people');
    fireEvent.changeText(await screen.findByTestId('invite-email'), ' new@crestwatch.example ');
    fireEvent.press(screen.getByTestId('invite-role-official'));
    fireEvent.press(screen.getByTestId('invite-send'));
    expect(
      await screen.findByText('Invited new@crestwatch.example as official; the invitation e-mail is on its way.'),
    ).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith(
      'POST',
      '/api/people/invitations',
      expect.objectContaining({ json: { email: 'new@crestwatch.example', role: 'official' } }),
    );
    expect(screen.getByLabelText('Read them in the mailbox')).toBeTruthy();
  });

  it('checks the address before sending anything', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/me': me('admin'), '/api/people': { people } }));
    renderStaff('/people');
    fireEvent.changeText(await screen.findByTestId('invite-email'), 'not-an-address');
    fireEvent.press(screen.getByTestId('invite-send'));
    expect(await screen.findByText('An e-mail address, such as name@agency.example.')).toBeTruthy();
    expect(mockedSend).not.toHaveBeenCalled();
  });

  it('changes a role, and shows the server refusing to demote the last admin', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/me': me('admin', 1), '/api/people': { people } }));
    mockedSend.mockResolvedValueOnce({ person: person({ role: 'official' }) });
    renderStaff('/people');
    fireEvent.press(await screen.findByTestId('person-role-2-official'));
    expect(await screen.findByText('Demo analyst is now official.')).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith(
      'PATCH',
      '/api/people/2',
      expect.objectContaining({ json: { role: 'official' } }),
    );

    mockedSend.mockRejectedValueOnce(
      new ApiError(409, 'last_admin', 'Crestwatch needs at least one active admin: make someone else admin first.'),
    );
    fireEvent.press(screen.getByTestId('person-role-1-analyst'));
    expect(
      await screen.findByText('Crestwatch needs at least one active admin: make someone else admin first.'),
    ).toBeTruthy();
    // An admin cannot switch themselves off from here.
    expect(screen.queryByTestId('person-deactivate-1')).toBeNull();
    expect(screen.getByTestId('person-deactivate-2')).toBeTruthy();
  });

  it('shows a lapsed invitation as expired and re-sends it', async () => {
    const lapsed = person({
      id: 3,
      email: 'late@crestwatch.example',
      name: '',
      status: 'expired',
      lastSignInAt: null,
      invitedAt: '2026-11-01T00:00:00.000Z',
      invitationExpiresAt: '2026-11-15T00:00:00.000Z',
      identityPinned: false,
    });
    // A demo account that never signed in was never sent an invitation: nothing to re-send.
    const demoAccount = person({
      id: 4,
      email: 'official@crestwatch.example',
      status: 'invited',
      lastSignInAt: null,
      invitedAt: null,
      invitationExpiresAt: null,
    });
    mockedGet.mockImplementation(
      answerWith({ '/api/me': me('admin', 1), '/api/people': { people: [...people, lapsed, demoAccount] } }),
    );
    mockedSend.mockResolvedValueOnce({
      user: { ...lapsed, status: 'invited', invitationExpiresAt: '2026-12-18T00:00:00.000Z' },
      mail: { sent: true },
    });
    renderStaff('/people');
    expect(await screen.findByText('Invitation expired')).toBeTruthy();
    expect(screen.getByTestId('person-meta-3').props.children).toMatch(/^Invited .* · expired /);
    // Someone who has signed in has nothing to re-send.
    expect(screen.queryByTestId('person-resend-2')).toBeNull();
    expect(screen.queryByTestId('person-resend-4')).toBeNull();
    fireEvent.press(screen.getByTestId('person-resend-3'));
    expect(await screen.findByText('The invitation to late@crestwatch.example is sent again.')).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/people/3/invitation', expect.anything());
  });

  it('resets a pinned Google identity only after confirming', async () => {
    const pinned = [people[0], person({ identityPinned: true })];
    mockedGet.mockImplementation(answerWith({ '/api/me': me('admin', 1), '/api/people': { people: pinned } }));
    mockedSend.mockResolvedValueOnce({ person: person({ identityPinned: false }) });
    renderStaff('/people');
    fireEvent.press(await screen.findByTestId('person-reset-identity-2'));
    expect(mockedSend).not.toHaveBeenCalled();
    fireEvent.press(await screen.findByTestId('person-reset-identity-2-confirm'));
    expect(
      await screen.findByText(
        'The next Google account that signs in as analyst@crestwatch.example is kept for Demo analyst.',
      ),
    ).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith('POST', '/api/people/2/identity-reset', expect.anything());
    // Not offered for an account with no pinned identity, nor for the admin themself.
    expect(screen.queryByTestId('person-reset-identity-1')).toBeNull();
  });

  it('changes how long invitations can be used (the invitationDays setting)', async () => {
    const withDays = { ...settingsAnswer, settings: { ...settingsAnswer.settings, invitationDays: 14 } };
    mockedGet.mockImplementation(
      answerWith({ '/api/me': me('admin', 1), '/api/people': { people }, '/api/settings': withDays }),
    );
    mockedSend.mockResolvedValueOnce({ ...withDays, settings: { ...withDays.settings, invitationDays: 30 } });
    renderStaff('/people');
    const input = await screen.findByTestId('invitation-days-input');
    await waitFor(() => expect(input.props.value).toBe('14'));
    fireEvent.changeText(input, '0');
    fireEvent.press(screen.getByTestId('invitation-days-save'));
    expect(await screen.findByText('A whole number of days from 1 to 365.')).toBeTruthy();
    expect(mockedSend).not.toHaveBeenCalled();
    fireEvent.changeText(input, '30');
    fireEvent.press(screen.getByTestId('invitation-days-save'));
    expect(await screen.findByText('New and re-sent invitations can be used for 30 days.')).toBeTruthy();
    expect(mockedSend).toHaveBeenCalledWith(
      'PATCH',
      '/api/settings',
      expect.objectContaining({ json: { invitationDays: 30 } }),
    );
  });

  it('shows a 403 plainly', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('admin'),
        '/api/people': new ApiError(403, 'forbidden', 'This needs the admin role.'),
      }),
    );
    renderStaff('/people');
    expect(await screen.findByText('This needs the admin role.')).toBeTruthy();
  });
});

describe('settings', () => {
  it('shows the scheduled job and its next start, read-only for analysts', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/me': me('analyst'), '/api/settings': settingsAnswer }));
    renderStaff('/settings');
    // The distance from today ("in 30 days") changes with the day the test runs; the date does not.
    expect(await screen.findByText(/^Next start: 1 Jan 2027, 06:00 UTC — /)).toBeTruthy();
    expect(screen.getByText(/06:00 on the 1st of January, April, July and October \(UTC\)/)).toBeTruthy();
    expect(screen.getByTestId('settings-read-only')).toBeTruthy();
    expect(screen.queryByTestId('settings-save')).toBeNull();
  });

  it('sends only what an admin changed, in the API’s units', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/me': me('admin'), '/api/settings': settingsAnswer }));
    mockedSend.mockResolvedValue({
      ...settingsAnswer,
      settings: { ...settingsAnswer.settings, confidenceLevel: 0.9, thresholdShiftPercent: 15 },
    });
    renderStaff('/settings');
    fireEvent.changeText(await screen.findByTestId('settings-level'), '90');
    fireEvent.changeText(screen.getByTestId('settings-shift'), '15');
    fireEvent.press(screen.getByTestId('settings-save'));
    await waitFor(() =>
      expect(mockedSend).toHaveBeenCalledWith(
        'PATCH',
        '/api/settings',
        expect.objectContaining({ json: { confidenceLevel: 0.9, thresholdShiftPercent: 15 } }),
      ),
    );
    expect(await screen.findByText('Saved: 2 settings changed.')).toBeTruthy();
  });

  it('stops a value out of range before sending', async () => {
    mockedGet.mockImplementation(answerWith({ '/api/me': me('admin'), '/api/settings': settingsAnswer }));
    renderStaff('/settings');
    fireEvent.changeText(await screen.findByTestId('settings-alpha'), '0.9');
    fireEvent.press(screen.getByTestId('settings-save'));
    expect(await screen.findByText('Between 0.001 and 0.5.')).toBeTruthy();
    expect(mockedSend).not.toHaveBeenCalled();
  });
});

describe('specs', () => {
  const indicators = [
    {
      code: 'emissions_pc',
      name: 'CO2 emissions per person',
      unit: 't',
      description: '',
      mustBePositive: true,
      derivation: null,
      stats: { districts: 3, values: 30, firstYear: 2000, lastYear: 2025 },
    },
    {
      code: 'income_pc',
      name: 'Real income per person',
      unit: 'units',
      description: '',
      mustBePositive: true,
      derivation: null,
      stats: { districts: 3, values: 30, firstYear: 2000, lastYear: 2025 },
    },
    {
      code: 'pop_density',
      name: 'Population density',
      unit: 'per km²',
      description: '',
      mustBePositive: true,
      derivation: null,
      stats: { districts: 3, values: 30, firstYear: 2000, lastYear: 2025 },
    },
  ];

  it('saves a new spec with the chosen controls and model', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('analyst'),
        '/api/specs': { specs: [], headlineSpecId: null },
        '/api/indicators': { indicators },
      }),
    );
    mockedSend.mockResolvedValue({ spec: { id: 4, name: 'Cubic check' } });
    renderStaff('/specs/new');
    fireEvent.changeText(await screen.findByTestId('spec-name'), 'Cubic check');
    fireEvent.press(screen.getByTestId('spec-control-pop_density'));
    fireEvent.press(screen.getByText('Cubic'));
    fireEvent.press(screen.getByTestId('spec-covariance-hc3'));
    fireEvent.press(screen.getByTestId('spec-save'));
    await waitFor(() => expect(mockedSend).toHaveBeenCalled());
    const [method, path, options] = mockedSend.mock.calls[0];
    expect([method, path]).toEqual(['POST', '/api/specs']);
    expect(options?.json).toMatchObject({
      name: 'Cubic check',
      controls: ['pop_density'],
      form: 'cubic',
      covariance: 'hc3',
      emissionsIndicator: 'emissions_pc',
      driverIndicator: 'income_pc',
    });
    expect((options?.json as Record<string, unknown>).lag).toBeUndefined();
  });

  it('names the field the server refused', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('analyst'),
        '/api/specs': { specs: [], headlineSpecId: null },
        '/api/indicators': { indicators },
      }),
    );
    mockedSend.mockRejectedValue(
      new ApiError(400, 'validation_failed', 'Invalid body: body.name: Too big', {
        issues: [{ path: 'body.name', message: 'at most 80 characters' }],
      }),
    );
    renderStaff('/specs/new');
    fireEvent.changeText(await screen.findByTestId('spec-name'), 'x');
    fireEvent.press(screen.getByTestId('spec-save'));
    expect(await screen.findByText('at most 80 characters')).toBeTruthy();
  });
});

describe('alerts and subscriptions', () => {
  const alert = (id: number, read: boolean) => ({
    id,
    runId: 5,
    kind: 'crossing' as const,
    districtCode: 'T02',
    districtName: 'Bryn Ødegård',
    details: { from: 'approaching', to: 'past_turn' },
    createdAt: `2026-11-3${id}T10:00:00.000Z`,
    read,
  });

  it('marks unread alerts, filters to them and marks one read', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('official'),
        '/api/alerts?limit=50': { alerts: [alert(0, false), alert(1, true)], unread: 1 },
      }),
    );
    mockedSend.mockResolvedValue(undefined);
    renderStaff('/alerts');
    const unread = await screen.findByTestId('alert-0');
    expect(within(unread).getByText('New')).toBeTruthy();
    expect(within(unread).getByText('Standing moved from Approaching to Past the turn.')).toBeTruthy();
    expect(within(screen.getByTestId('alert-1')).queryByText('New')).toBeNull();
    fireEvent.press(screen.getByTestId('alerts-show-unread'));
    expect(screen.queryByTestId('alert-1')).toBeNull();
    fireEvent.press(screen.getByTestId('alert-read-0'));
    await waitFor(() => expect(mockedSend).toHaveBeenCalledWith('POST', '/api/alerts/0/read'));
  });

  it('subscribes to a set of districts with some kinds as a digest with the brief', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('official'),
        '/api/subscriptions': { subscriptions: [] },
        '/api/districts': {
          districts: [
            { code: 'T01', name: 'Ashgrove' },
            { code: 'T02', name: 'Bryn Ødegård' },
          ],
        },
      }),
    );
    mockedSend.mockResolvedValue({ subscription: { id: 1 } });
    renderStaff('/subscriptions');
    expect(await screen.findByTestId('subs-empty')).toBeTruthy();
    fireEvent.press(screen.getByTestId('sub-scope-districts'));
    fireEvent.press(await screen.findByTestId('sub-district-T01'));
    fireEvent.press(screen.getByTestId('sub-district-T02'));
    fireEvent.press(screen.getByTestId('sub-kind-shape_change'));
    fireEvent.press(screen.getByTestId('sub-delivery-digest'));
    fireEvent.press(screen.getByTestId('sub-brief'));
    fireEvent.press(screen.getByTestId('sub-save'));
    await waitFor(() =>
      expect(mockedSend).toHaveBeenCalledWith(
        'POST',
        '/api/subscriptions',
        expect.objectContaining({
          json: {
            // no track list in this test's answers: the form follows every track
            tracks: 'all',
            scope: 'districts',
            districtCodes: ['T01', 'T02'],
            kinds: ['crossing', 'threshold_shift', 'significance_change'],
            delivery: 'digest',
            attachBrief: true,
          },
        }),
      ),
    );
    expect(await screen.findByText('Subscribed to 2 districts.')).toBeTruthy();
  });

  it('asks for a district before subscribing to one', async () => {
    mockedGet.mockImplementation(
      answerWith({
        '/api/me': me('official'),
        '/api/subscriptions': { subscriptions: [] },
        '/api/districts': { districts: [] },
      }),
    );
    renderStaff('/subscriptions');
    fireEvent.press(await screen.findByTestId('sub-save'));
    expect(await screen.findByText('Choose the district.')).toBeTruthy();
    expect(mockedSend).not.toHaveBeenCalled();
  });
});
