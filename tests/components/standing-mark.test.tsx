// The standing marks' text alternative (WCAG 2.2 SC 1.1.1 Non-text Content): a mark alone is
// an image named by its standing's word; beside that word it is decoration, hidden from
// assistive technology so the word is not read twice.
import { render, screen } from '@testing-library/react-native';

import { StandingBadge, StandingMark } from '@/components/region/standing-mark';
import { STANDINGS } from '@/contracts/estimates';
import { STANDING_LABEL } from '@/lib/estimate-words';

describe('standing marks', () => {
  it.each(STANDINGS.map((s) => [s]))('a %s mark alone is an image named by its word', (standing) => {
    render(<StandingMark standing={standing} />);
    const mark = screen.getByTestId(`standing-mark-${standing}`);
    expect(mark.props.role).toBe('img');
    expect(mark.props['aria-label']).toBe(STANDING_LABEL[standing]);
    expect(mark.props['aria-hidden']).toBeUndefined();
  });

  it('beside its word (a badge) is hidden, and the word is there to read', () => {
    render(<StandingBadge standing="past_turn" />);
    const mark = screen.getByTestId('standing-mark-past_turn', { includeHiddenElements: true });
    expect(mark.props['aria-hidden']).toBe(true);
    expect(mark.props['aria-label']).toBeUndefined();
    expect(screen.getByText('Past the turn')).toBeTruthy();
  });
});
