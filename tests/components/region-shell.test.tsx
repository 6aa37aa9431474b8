import { render, screen } from '@testing-library/react-native';
import { Text } from 'react-native';

import { RegionShell } from '@/components/layout/region-shell';

function shell(mode: 'phone' | 'wide') {
  return render(
    <RegionShell mode={mode} header={<Text>header</Text>} list={<Text>the list</Text>}>
      <Text>the route</Text>
    </RegionShell>,
  );
}

describe('region shell', () => {
  it('puts the list beside the route in the wide layout', () => {
    shell('wide');
    expect(screen.getByText('header')).toBeTruthy();
    expect(screen.getByText('the list')).toBeTruthy();
    expect(screen.getByText('the route')).toBeTruthy();
  });

  it('shows only the route on a phone (the home route is the list there)', () => {
    shell('phone');
    expect(screen.getByText('the route')).toBeTruthy();
    expect(screen.queryByText('the list')).toBeNull();
  });
});
