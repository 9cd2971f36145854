import { act } from 'react';
import { holeStatuses, type TravelerSummary } from '@/db/contracts';
import { colors, statusColors } from '@/constants/theme';
import { travelerCardLabel, TravelerCard } from '@/components/travelers/traveler-card';
import { Choice, MultiChoice } from '@/components/ui/choice';
import { GridTable } from '@/components/ui/grid-table';
import { ProgressBar } from '@/components/ui/progress-bar';
import { HoleMark, HoleStatusLegend } from '@/components/ui/status-mark';
import { Mono } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';
import { standardTravelerSummary } from '../fixtures/traveler';
import { contrast, deltaE, deuteranopeLab } from './colour-math';
import { renderWeb } from './render-web';

/** A key going down and up on the element, as a keyboard sends it. */
async function key(el: HTMLElement, k: string, opts: { repeat?: boolean } = {}) {
  await act(async () => {
    el.dispatchEvent(new KeyboardEvent('keydown', { key: k, bubbles: true, cancelable: true, repeat: opts.repeat }));
    el.dispatchEvent(new KeyboardEvent('keyup', { key: k, bubbles: true, cancelable: true }));
  });
}

describe('checkboxes and radios', () => {
  it('toggle on Space as well as Enter, and ignore a held-down Space', async () => {
    const onPress = jest.fn();
    const r = renderWeb(
      <Toggle kind="checkbox" checked={false} onPress={onPress} testID="box" accessibilityLabel="Box" />,
    );
    const box = r.byTestId('box');
    await key(box, ' ');
    expect(onPress).toHaveBeenCalledTimes(1);
    await key(box, 'Enter');
    expect(onPress).toHaveBeenCalledTimes(2);
    await key(box, ' ', { repeat: true });
    expect(onPress).toHaveBeenCalledTimes(2);
  });

  it('keep Space from scrolling the page', async () => {
    const r = renderWeb(<Toggle kind="radio" checked={false} onPress={() => undefined} testID="radio" />);
    const e = new KeyboardEvent('keydown', { key: ' ', bubbles: true, cancelable: true });
    await act(async () => {
      r.byTestId('radio').dispatchEvent(e);
    });
    expect(e.defaultPrevented).toBe(true);
  });

  it('do nothing on Space when disabled', async () => {
    const onPress = jest.fn();
    const r = renderWeb(<Toggle kind="checkbox" checked disabled onPress={onPress} testID="box" />);
    await key(r.byTestId('box'), ' ');
    expect(onPress).not.toHaveBeenCalled();
    expect(r.byTestId('box').getAttribute('aria-disabled')).toBe('true');
  });

  it('say checked with aria-checked, never aria-selected', () => {
    const r = renderWeb(<Toggle kind="checkbox" checked onPress={() => undefined} testID="box" />);
    const box = r.byTestId('box');
    expect(box.getAttribute('role')).toBe('checkbox');
    expect(box.getAttribute('aria-checked')).toBe('true');
    expect(box.hasAttribute('aria-selected')).toBe(false);
  });

  it('make a named radio group of a Choice, chosen by Space', async () => {
    const onChange = jest.fn();
    const r = renderWeb(
      <Choice
        label="Disposition"
        testIDPrefix="d"
        value="rework"
        onChange={onChange}
        options={[
          { value: 'rework', label: 'Rework', hint: 'back to the drawing' },
          { value: 'repair', label: 'Repair' },
        ]}
      />,
    );
    const group = r.container.querySelector('[role="radiogroup"]')!;
    expect(group.getAttribute('aria-label')).toBe('Disposition');
    expect(r.byTestId('d-rework').getAttribute('aria-checked')).toBe('true');
    expect(r.byTestId('d-rework').getAttribute('aria-label')).toBe('Rework: back to the drawing');
    expect(r.byTestId('d-repair').getAttribute('aria-checked')).toBe('false');
    await key(r.byTestId('d-repair'), ' ');
    expect(onChange).toHaveBeenCalledWith('repair');
  });

  it('make checkboxes of a MultiChoice, toggled by Space', async () => {
    const onToggle = jest.fn();
    const r = renderWeb(
      <MultiChoice
        testIDPrefix="m"
        values={['a']}
        onToggle={onToggle}
        options={[
          { value: 'a', label: 'A' },
          { value: 'b', label: 'B' },
        ]}
      />,
    );
    expect(r.byTestId('m-a').getAttribute('role')).toBe('checkbox');
    await key(r.byTestId('m-b'), ' ');
    expect(onToggle).toHaveBeenCalledWith('b');
  });
});

describe('the progress bar', () => {
  it('is a named progressbar with its value, and leaves "N / M holes done" readable beside it', () => {
    const r = renderWeb(<ProgressBar done={8} total={55} awaiting={2} />);
    const bar = r.container.querySelector('[role="progressbar"]')!;
    expect(bar.getAttribute('aria-label')).toBe('Holes done');
    expect(bar.getAttribute('aria-valuenow')).toBe('8');
    expect(bar.getAttribute('aria-valuemin')).toBe('0');
    expect(bar.getAttribute('aria-valuemax')).toBe('55');
    expect(bar.getAttribute('aria-valuetext')).toBe('8 of 55 holes done, 2 awaiting the inspector');
    // A progressbar's children are not read: the words must not be inside it.
    expect(bar.contains(r.byTestId('progress-count'))).toBe(false);
    expect(r.byTestId('progress-count').textContent).toBe('8 / 55');
  });

  it('hatches the awaiting segment on the web with one element, and draws none without holes awaiting', () => {
    const r = renderWeb(<ProgressBar done={8} total={55} awaiting={20} />);
    const bar = r.byTestId('progress-bar');
    // The track, the done fill, the awaiting segment with its hatching, nine tenths' ticks.
    expect(bar.querySelectorAll('*').length).toBe(12);
    expect(r.queryByTestId('hatching')).not.toBeNull();
    expect(renderWeb(<ProgressBar done={8} total={55} awaiting={0} />).queryByTestId('hatching')).toBeNull();
  });
});

describe('hole marks and their key', () => {
  it('is an image with a name on its own, and hidden where its words are beside it', () => {
    const own = renderWeb(<HoleMark status="held" />).byTestId('mark-held');
    expect(own.getAttribute('role')).toBe('img');
    expect(own.getAttribute('aria-label')).toBe('Held (square)');
    const quiet = renderWeb(<HoleMark status="held" decorative />).byTestId('mark-held');
    expect(quiet.getAttribute('aria-hidden')).toBe('true');
    expect(quiet.hasAttribute('aria-label')).toBe(false);
  });

  it('reads the key as a list, each status with its shape and count', () => {
    const r = renderWeb(<HoleStatusLegend counts={{ pending: 46, installed: 8, flagged: 1 }} />);
    const items = Array.from(r.container.querySelectorAll('[role="listitem"]')).map((e) =>
      e.getAttribute('aria-label'),
    );
    expect(r.byTestId('hole-legend').getAttribute('role')).toBe('list');
    expect(items).toHaveLength(holeStatuses.length);
    expect(items).toContain('Flagged (triangle): 1');
    expect(items).toContain('Held (square): 0');
  });

  it('draws marks at 12 px or more wherever a status is shown', () => {
    // The smallest mark in use: the flag screen's hole picker (16) and finding marks (14).
    for (const size of [16, 18, 20, 24]) {
      const svg = renderWeb(<HoleMark status="flagged" size={size} />)
        .byTestId('mark-flagged')
        .querySelector('svg')!;
      expect(Number(svg.getAttribute('width'))).toBeGreaterThanOrEqual(12);
    }
  });
});

describe('colours that read', () => {
  it('keep warning text at 4.5:1 or more on the paper and the raised paper', () => {
    expect(contrast(colors.warning, colors.paper)).toBeGreaterThanOrEqual(4.5);
    expect(contrast(colors.warning, colors.paperRaised)).toBeGreaterThanOrEqual(4.5);
  });

  it('give the focus ring 3:1 or more on the paper, on the ink of a chosen chip, and on every tint', () => {
    for (const bg of [
      colors.paper,
      colors.paperRaised,
      colors.paperSunk,
      colors.ink,
      colors.accentSoft,
      colors.cautionSoft,
      colors.errorSoft,
    ]) {
      expect(contrast(colors.focus, bg)).toBeGreaterThanOrEqual(3);
    }
  });

  it('tell flagged from held under deuteranopia by lightness as well as shape', () => {
    const flagged = deuteranopeLab(statusColors.flagged);
    const held = deuteranopeLab(statusColors.held);
    expect(deltaE(flagged, held)).toBeGreaterThanOrEqual(20);
    expect(Math.abs(flagged[0] - held[0])).toBeGreaterThanOrEqual(15);
  });

  it('keep every hole mark at 3:1 or more on the paper', () => {
    for (const s of holeStatuses) expect(contrast(statusColors[s], colors.paper)).toBeGreaterThanOrEqual(3);
  });
});

describe('names that leave nothing out', () => {
  const card: TravelerSummary = {
    ...standardTravelerSummary,
    id: 't1',
    holesTotal: 55,
    holesDone: 8,
    holesAwaitingInspector: 1,
    openFindings: 1,
    newerRevision: 'B',
  };

  it('names a part card with its warnings: the open finding and the newer revision', () => {
    expect(travelerCardLabel(card)).toContain('1 open finding');
    expect(travelerCardLabel(card)).toContain('revision B is out');
    const r = renderWeb(<TravelerCard t={card} onPress={() => undefined} />);
    expect(r.byTestId('traveler-EDN-CY6').getAttribute('aria-label')).toContain('8 of 55 holes done');
  });
});

describe('values that never break', () => {
  it('keeps a short value (a callout, a size with its unit) on one line, and lets long text wrap', () => {
    const short = renderWeb(<Mono testID="v">MS20470AD4</Mono>).byTestId('v');
    expect(getComputedStyle(short).whiteSpace).toBe('nowrap');
    const unit = renderWeb(<Mono testID="u">{0.125} in</Mono>).byTestId('u');
    expect(getComputedStyle(unit).whiteSpace).toBe('nowrap');
    const long = renderWeb(<Mono testID="l">{'AB:'.repeat(20)}</Mono>).byTestId('l');
    expect(getComputedStyle(long).whiteSpace).not.toBe('nowrap');
  });

  it('lays a small table out with table roles, each value under its column', () => {
    const r = renderWeb(
      <GridTable
        label="Pitch schedule of line U"
        columns={[
          { key: 'from', title: 'From', width: 80 },
          { key: 'pitch', title: 'Pitch', width: 80 },
        ]}
        rows={[{ key: '0', testID: 'z0', cells: { from: <Mono>0.00</Mono>, pitch: <Mono>1.00</Mono> } }]}
      />,
    );
    expect(r.container.querySelector('[role="table"]')!.getAttribute('aria-label')).toBe('Pitch schedule of line U');
    expect(Array.from(r.container.querySelectorAll('[role="columnheader"]')).map((e) => e.textContent)).toEqual([
      'From',
      'Pitch',
    ]);
    expect(Array.from(r.byTestId('z0').querySelectorAll('[role="cell"]')).map((e) => e.textContent)).toEqual([
      '0.00',
      '1.00',
    ]);
  });
});
