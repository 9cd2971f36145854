import type { PartLabel } from '@/db/contracts';
import { LabelsScreen } from '@/components/travelers/labels-screen';
import { TravelerScreen } from '@/components/travelers/traveler-screen';
import { standardTraveler } from '../fixtures/traveler';
import { recordFetch, wrap } from './finding-fixtures';

const mockPush = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({ push: mockPush, replace: jest.fn(), back: jest.fn(), canGoBack: () => false }),
}));
beforeEach(() => mockPush.mockReset());

const label: PartLabel = {
  travelerId: 'trav-1',
  serial: 'NK2-0147-W-104',
  shortCode: 'EDN-CY6',
  partNumber: 'W-104',
  partName: 'Wing rib, inboard',
  letter: 'B',
  kitModelCode: 'NK-2',
  kitModelName: 'Northkit Two',
  supplierName: 'Larkspur Kitworks',
  kitSerial: 'NK2-0147',
  url: 'https://pitchcard.test/t/abc',
  qrDataUrl: 'data:image/png;base64,iVBORw0KGgo=',
};

const pageCss = () => document.head.querySelector('style[data-pitchcard="labels-print"]')?.textContent ?? '';

describe('the labels page', () => {
  it('prints on each label the kit model, the supplier, the part, its revision, the serial and the short code', async () => {
    const calls = recordFetch({ '/api/travelers/labels': { body: [label] } });
    const r = wrap(<LabelsScreen travelerId="trav-1" />);
    await r.settle();
    expect(calls[0].url).toContain('/api/travelers/labels?travelerId=trav-1');
    const card = r.byTestId('part-label-EDN-CY6');
    const within = (id: string) => card.querySelector(`[data-testid="${id}"]`)?.textContent ?? '';
    expect(within('label-code')).toBe('EDN-CY6');
    expect(within('label-serial')).toBe('NK2-0147-W-104');
    expect(within('label-part')).toContain('W-104');
    expect(within('label-part')).toContain('Wing rib, inboard');
    expect(within('label-revision')).toBe('B');
    expect(within('label-kit')).toContain('NK-2');
    expect(within('label-kit')).toContain('Northkit Two');
    expect(within('label-kit')).toContain('NK2-0147');
    expect(within('label-supplier')).toBe('Larkspur Kitworks');
    expect(card.querySelector('img')?.getAttribute('src') ?? card.innerHTML).toContain('data:image/png');
  });

  it.each([
    // 2 × 1 in is 50.8 × 25.4 mm (1 in = 25.4 mm exactly); CSS lays out 96 px to the inch (CSS Values and Units, absolute lengths).
    ['2x1in', 'size: 2in 1in', 192, 96],
    ['62mm', 'size: 62mm 32mm', 234.3, 120.9],
    ['sheet', 'size: auto', 321.3, null],
  ] as const)(
    'the %s stock sets the printed page to "%s" and draws the label at its real size',
    async (size, css, widthPx, heightPx) => {
      recordFetch({
        '/api/travelers/labels': { body: [label, { ...label, travelerId: 'trav-2', shortCode: 'K7P-4QX' }] },
      });
      const r = wrap(<LabelsScreen buildId="b1" />);
      await r.settle();
      // Start from another stock so the press is a change.
      await r.press(size === 'sheet' ? 'label-size-62mm' : 'label-size-sheet');
      await r.press(`label-size-${size}`);
      expect(r.byTestId(`label-size-${size}`).getAttribute('aria-checked')).toBe('true');
      const printCss = pageCss();
      expect(printCss).toContain(`@page { ${css}`);
      expect(document.head.querySelectorAll('style[data-pitchcard="labels-print"]')).toHaveLength(1);
      // One label a page on a roll or die-cut stock; the sheet lets them flow.
      expect(printCss.includes('break-after: page')).toBe(size !== 'sheet');
      const card = r.byTestId('part-label-K7P-4QX');
      expect(card.style.width).toBe(`${widthPx}px`);
      if (heightPx === null) expect(card.style.height).toBe('');
      else expect(card.style.height).toBe(`${heightPx}px`);
    },
  );

  it('says why when the server refuses (a loopback address) and prints nothing', async () => {
    recordFetch({
      '/api/travelers/labels': {
        status: 409,
        body: {
          error: { code: 'conflict', message: 'labels would carry http://localhost:8080, which a phone cannot open' },
        },
      },
    });
    const r = wrap(<LabelsScreen travelerId="trav-1" />);
    await r.settle();
    expect(r.text()).toContain('which a phone cannot open');
    expect(r.queryByTestId('part-labels')).toBeNull();
  });
});

describe('reprinting one part’s label from the traveler', () => {
  const detail = standardTraveler;

  it('links to the labels page of this one part when the server allows it', async () => {
    const r = wrap(<TravelerScreen travelerId="trav-1" />, { traveler: { ...detail, labelAllowed: true } });
    await r.settle();
    await r.press('traveler-label');
    expect(mockPush).toHaveBeenCalledWith('/travelers/trav-1/label');
  });

  it('shows no link when the server does not say so', async () => {
    const r = wrap(<TravelerScreen travelerId="trav-1" />, { traveler: { ...detail, labelAllowed: false } });
    await r.settle();
    expect(r.queryByTestId('traveler-label')).toBeNull();
    const old = wrap(<TravelerScreen travelerId="trav-1" />, { traveler: detail });
    await old.settle();
    expect(old.queryByTestId('traveler-label')).toBeNull();
  });
});
