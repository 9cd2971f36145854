import { holeStatuses } from '@/db/contracts';
import { HoleMark, holeShapes, HoleStatusLegend } from '@/components/ui/status-mark';
import { statusColors } from '@/constants/theme';
import { renderWeb } from './render-web';

describe('hole status marks', () => {
  it('gives every hole status its own shape, so status never rests on colour alone', () => {
    const shapes = holeStatuses.map((s) => holeShapes[s]);
    expect(new Set(shapes).size).toBe(holeStatuses.length);
  });

  it('gives every hole status its own colour as well', () => {
    expect(new Set(holeStatuses.map((s) => statusColors[s])).size).toBe(holeStatuses.length);
  });

  it('draws a different picture for each status', () => {
    const drawn = holeStatuses.map((s) => {
      const r = renderWeb(<HoleMark status={s} />);
      const svg = r.byTestId(`mark-${s}`).querySelector('svg')!.innerHTML;
      r.unmount();
      return svg;
    });
    expect(new Set(drawn).size).toBe(holeStatuses.length);
  });

  it('draws a pending hole as an open ring and an installed one filled', () => {
    const pending = renderWeb(<HoleMark status="pending" />).byTestId('mark-pending').querySelector('circle')!;
    const installed = renderWeb(<HoleMark status="installed" />).byTestId('mark-installed').querySelector('circle')!;
    expect(pending.getAttribute('stroke')).toBe(statusColors.pending);
    expect(pending.getAttribute('fill')).not.toBe(statusColors.pending);
    expect(installed.getAttribute('fill')).toBe(statusColors.installed);
  });

  it('names the status and its shape for screen readers', () => {
    const r = renderWeb(<HoleMark status="flagged" />);
    expect(r.byLabel('Flagged (triangle)')).toBeTruthy();
  });

  it('shows every status in the legend', () => {
    const r = renderWeb(<HoleStatusLegend />);
    for (const s of holeStatuses) expect(r.byTestId(`mark-${s}`)).toBeTruthy();
    expect(r.text()).toContain('Held');
  });
});
