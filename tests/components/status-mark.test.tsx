import { findingStatuses, holeStatuses, isOpenFinding } from '@/db/contracts';
import {
  FindingMark,
  findingShapes,
  FindingStatusTag,
  HoleMark,
  holeShapes,
  HoleStatusLegend,
} from '@/components/ui/status-mark';
import { findingStatusColors, statusColors } from '@/constants/theme';
import { renderWeb } from './render-web';

describe('hole status marks', () => {
  it('gives every hole status its own shape, so status never rests on colour alone', () => {
    const shapes = holeStatuses.map((s) => holeShapes[s]);
    expect(new Set(shapes).size).toBe(holeStatuses.length);
  });

  it('gives every hole status its own colour as well', () => {
    expect(new Set(holeStatuses.map((s) => statusColors[s])).size).toBe(holeStatuses.length);
  });

  it('keeps the marks the shop knows', () => {
    expect(holeShapes).toEqual({
      pending: 'open-circle',
      installed: 'dot',
      flagged: 'triangle',
      held: 'square',
      reworked: 'diamond',
      accepted: 'ringed-check',
    });
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
    const pending = renderWeb(<HoleMark status="pending" />)
      .byTestId('mark-pending')
      .querySelector('circle')!;
    const installed = renderWeb(<HoleMark status="installed" />)
      .byTestId('mark-installed')
      .querySelector('circle')!;
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

describe('finding status tags', () => {
  it('give every finding state its own shape', () => {
    expect(new Set(findingStatuses.map((s) => findingShapes[s])).size).toBe(findingStatuses.length);
  });

  it('never draw closed in the shape of an open state', () => {
    const open = findingStatuses.filter(isOpenFinding).map((s) => findingShapes[s]);
    expect(open).not.toContain(findingShapes.closed);
  });

  it('give every finding state its own colour', () => {
    expect(new Set(findingStatuses.map((s) => findingStatusColors[s])).size).toBe(findingStatuses.length);
  });

  it('draw a different picture for each state, and name its shape', () => {
    const drawn = findingStatuses.map((s) => {
      const r = renderWeb(<FindingMark status={s} />);
      const el = r.byTestId(`finding-mark-${s}`);
      expect(el.getAttribute('aria-label')).toMatch(/\((triangle|hourglass|square|diamond|ringed tick)\)$/);
      const svg = el.querySelector('svg')!.innerHTML;
      r.unmount();
      return svg;
    });
    expect(new Set(drawn).size).toBe(findingStatuses.length);
  });

  it('say how a closed finding closed, in words beside "Closed"', () => {
    const r = renderWeb(<FindingStatusTag status="closed" disposition="use_as_is" closure="use_as_is" />);
    expect(r.byTestId('finding-status-closed').textContent).toBe('Closed· Used as is');
    expect(r.byTestId('closure').textContent).toContain('Used as is');
  });

  it('name the disposition an open finding works to', () => {
    const r = renderWeb(<FindingStatusTag status="work_ordered" disposition="repair" />);
    expect(r.byTestId('finding-status-work_ordered').textContent).toBe('Work ordered· Repair');
    expect(r.queryByTestId('closure')).toBeNull();
  });
});
