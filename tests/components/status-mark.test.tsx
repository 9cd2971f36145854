import { render, screen } from '@testing-library/react-native';
import { holeStatuses } from '@/db/contracts';
import { HoleMark, holeShapes, HoleStatusLegend } from '@/components/ui/status-mark';

describe('hole status marks', () => {
  it('gives every hole status its own shape, so status never rests on colour alone', () => {
    const shapes = holeStatuses.map((s) => holeShapes[s]);
    expect(new Set(shapes).size).toBe(holeStatuses.length);
  });

  it('draws a different picture for each status', () => {
    const drawn = holeStatuses.map((s) => {
      const { toJSON, unmount } = render(<HoleMark status={s} />);
      const json = JSON.stringify(toJSON());
      unmount();
      return json;
    });
    expect(new Set(drawn).size).toBe(holeStatuses.length);
  });

  it('names the status and its shape for screen readers', () => {
    render(<HoleMark status="flagged" />);
    expect(screen.getByLabelText('Flagged (triangle)')).toBeTruthy();
  });

  it('shows every status in the legend', () => {
    render(<HoleStatusLegend />);
    for (const s of holeStatuses) expect(screen.getByTestId(`mark-${s}`)).toBeTruthy();
  });
});
