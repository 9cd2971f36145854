import { act } from 'react';
import type { PartDesignSummary, StudyDetail } from '@/db/contracts';
import { WingResults } from '@/components/studies/wing-results';
import { hasZones, idPart, readWingResult, ribChoices, skinChoices } from '@/components/studies/wing-result';
import { designKeys } from '@/hooks/queries/designs';
// The real engine computes the wing, so the screen is checked against the very shape the server stores
// (the app itself never imports server/).
import { ribStudy, wingStudy, type WingStudyInput } from '@/server/engineering';
import { standardWing } from '../fixtures/wing-study';
import { fakeLayout, KIT_ID, renderWithQueries } from './studies-render';

jest.setTimeout(60_000);

// jsdom lays nothing out: every element reports this width (a wide pane, or a phone's column).
let layoutWidth = 1000;
fakeLayout(() => layoutWidth);
afterEach(() => {
  layoutWidth = 1000;
});

const KIT = KIT_ID;
// The form's default wing (a rectangle of the kit's area and chord), with four ribs to keep the test quick.
const inputs: WingStudyInput = {
  ...standardWing,
  tail: { armIn: 170 },
  ribs: [
    { name: 'W-101', stationIn: 24 },
    { name: 'W-102', stationIn: 62 },
    { name: 'W-103', stationIn: 100 },
    { name: 'W-104', stationIn: 138 },
  ],
  gaugeCandidates: [0.025, 0.032, 0.04, 0.05],
};
const result = wingStudy(inputs);

const detail = (revision = 1): StudyDetail => ({
  id: 'wing-1',
  kind: 'wing',
  kitModelId: KIT,
  kitName: 'NK-2 Quillon',
  name: 'Left wing',
  revision,
  updatedAt: '2026-10-14T10:00:00Z',
  recommended: result.trade.recommendedUniform,
  inputs: inputs as never,
  result: result as never,
  revisions: [
    { revision: 1, createdAt: '2026-10-13T10:00:00Z', createdByName: 'Maren' },
    { revision: 2, createdAt: '2026-10-14T10:00:00Z', createdByName: 'Maren' },
  ].slice(0, revision),
});

const designs: PartDesignSummary[] = [
  {
    id: '7c1d2e3f-0000-4000-8000-000000000104',
    kitModelId: KIT,
    kitName: 'NK-2',
    partNumber: 'W-104',
    name: 'Wing rib, outboard',
    kind: 'rib',
    latest: { id: 'r', letter: 'A', status: 'published' },
    publishedLetter: 'A',
  },
  {
    id: '7c1d2e3f-0000-4000-8000-000000000201',
    kitModelId: KIT,
    kitName: 'NK-2',
    partNumber: 'S-201',
    name: 'Top skin, inboard',
    kind: 'skin_panel',
    latest: null,
    publishedLetter: null,
  },
];

function renderResults(opts: { revision?: number; latest?: number; system?: 'imperial' | 'metric' } = {}) {
  return renderWithQueries(
    opts.system ?? 'imperial',
    (qc) => qc.setQueryData(designKeys.choices(KIT), designs),
    <WingResults detail={detail(opts.revision ?? 1)} latestRevision={opts.latest ?? 1} />,
  );
}

const firstPanel = result.skins[0];
const panelId = idPart(firstPanel.name);

describe('reading a stored wing result', () => {
  it('accepts the engine’s wing and refuses a rib study’s result', () => {
    expect(readWingResult(result)).not.toBeNull();
    const rib = ribStudy({ ...inputs, rib: { chordIn: 54, spacingIn: 14.5 }, lines: inputs.rib.lines } as never);
    expect(readWingResult(rib)).toBeNull();
    expect(readWingResult(null)).toBeNull();
  });

  it('offers for each rib only the candidates stored with zones: its recommendation and the one for every rib', () => {
    const uniform = result.trade.recommendedUniform;
    for (const rib of result.ribs) {
      const choices = ribChoices(rib, uniform);
      expect(choices.length).toBeGreaterThan(0);
      const withZones = rib.study.candidates.filter(hasZones);
      expect(choices.map((c) => `${c.key.gaugeIn} ${c.key.rivet}`).sort()).toEqual(
        withZones.map((c) => `${c.gaugeIn} ${c.rivet}`).sort(),
      );
    }
    for (const p of result.skins) expect(skinChoices(p)).toEqual(p.recommended ? [p.recommended] : []);
  });

  it('names testIDs after a panel with only letters, digits and dashes', () => {
    expect(idPart('W-101–W-102 upper')).toBe('W-101-W-102-upper');
  });
});

describe('the results of a wing study', () => {
  it('puts the engine’s caution first, above every number', async () => {
    const r = await renderResults();
    const root = r.byTestId('wing-results');
    expect(root.firstElementChild?.getAttribute('data-testid')).toBe('study-caution');
    expect(r.byTestId('study-caution').textContent).toContain(result.caution);
  });

  it('lists every flight condition with its load factor, Mach number, tail load and wing CL', async () => {
    const r = await renderResults();
    for (const c of result.conditions) {
      const row = r.byTestId(`wing-condition-${c.id}`).textContent!;
      expect(row).toContain(c.n.toFixed(2));
      expect(row).toContain(c.mach.toFixed(3));
      expect(row).toContain(c.wingCl.toFixed(3));
    }
  });

  it('shows every rib at its station with Schrenk’s share of the lift and its recommendation', async () => {
    const r = await renderResults();
    for (const rib of result.ribs) {
      const row = r.byTestId(`wing-rib-row-${idPart(rib.name)}`).textContent!;
      expect(row).toContain(rib.stationIn.toFixed(2));
      // Schrenk (NACA TM 948, 1940) on a rectangular wing: cl/CL = (1 + (4/π)·√(1 − η²)) / 2, η = y / (b/2).
      const eta = rib.stationIn / (inputs.planform.spanIn / 2);
      expect(row).toContain(((1 + (4 / Math.PI) * Math.sqrt(1 - eta * eta)) / 2).toFixed(3));
      if (rib.study.recommended)
        expect(r.byTestId(`wing-rib-rec-${idPart(rib.name)}`).textContent).toBe(
          `${rib.study.recommended.gaugeIn.toFixed(3)} in${rib.study.recommended.rivet}`,
        );
    }
  });

  it('shows the zones of the rib chosen in the table, for its recommended candidate', async () => {
    const r = await renderResults();
    const rib = result.ribs[2];
    await r.press(`wing-rib-${idPart(rib.name)}`);
    expect(r.byTestId(`wing-rib-${idPart(rib.name)}`).getAttribute('aria-pressed')).toBe('true');
    expect(r.byTestId('section-rib-zones').textContent).toContain(`Zones of rib ${rib.name}`);
    const rec = rib.study.candidates.find(
      (c) => c.gaugeIn === rib.study.recommended!.gaugeIn && c.rivet === rib.study.recommended!.rivet,
    )!;
    expect(r.byTestId('rib-zone-row-0-0').textContent).toContain(rec.lines[0].zones[0].pitchIn.toFixed(3));
  });

  it('shows each skin panel’s recommendation, shear flows, pitch limit with its end fixity’s source and buckling margins', async () => {
    const r = await renderResults();
    // Stacked (a phone), the first four panels show and the rest on request.
    expect(r.allByTestIdPrefix('skin-row-')).toHaveLength(4);
    expect(r.byTestId('skin-panel-grid-show-all').textContent).toBe(`Show all ${2 * (inputs.ribs.length - 1)}`);
    await r.press('skin-panel-grid-show-all');
    // Between every two neighbouring ribs, upper and lower.
    expect(r.allByTestIdPrefix('skin-row-')).toHaveLength(2 * (inputs.ribs.length - 1));
    const rec = firstPanel.candidates.find(
      (c) => c.gaugeIn === firstPanel.recommended!.gaugeIn && c.rivet === firstPanel.recommended!.rivet,
    )!;
    const row = r.byTestId(`skin-row-${panelId}`).textContent!;
    expect(r.byTestId(`skin-rec-${panelId}`).textContent).toBe(`${rec.gaugeIn.toFixed(3)} in${rec.rivet}`);
    expect(row).toContain(rec.torsionShearFlowLbPerIn.toFixed(1));
    expect(row).toContain(rec.interRivet.source);
    if (rec.shearBuckling.diagonalTension)
      expect(r.byTestId(`skin-${panelId}-shear-ms`).textContent).toContain('relies on diagonal tension');
    // A negative margin is marked, as on the rib's zone table.
    if ((rec.shearBuckling.marginOfSafety ?? 0) < 0)
      expect(r.byTestId(`skin-${panelId}-shear-ms`).textContent).toContain('✕');
  });

  it('says on some panel that it relies on diagonal tension (thin skin under the wing’s torsion)', async () => {
    const r = await renderResults();
    expect(result.skins.some((p) => p.candidates.some((c) => c.shearBuckling.diagonalTension))).toBe(true);
    expect(r.byTestId('skin-panel-table').textContent).toContain('relies on diagonal tension');
  });

  it('shows the chosen panel’s candidates and the zones of its recommendation', async () => {
    const r = await renderResults();
    const last = result.skins[result.skins.length - 1];
    await r.press('skin-panel-grid-show-all');
    await r.press(`skin-${idPart(last.name)}`);
    // Folded again, the panel on show stays listed.
    await r.press('skin-panel-grid-show-all');
    expect(r.allByTestIdPrefix('skin-row-').map((e) => e.getAttribute('data-testid'))).toContain(
      `skin-row-${idPart(last.name)}`,
    );
    expect(r.byTestId('section-skin-zones').textContent).toContain(`Skin panel ${last.name}`);
    expect(r.allByTestIdPrefix(`skin-candidate-${idPart(last.name)}-`)).toHaveLength(last.candidates.length);
    // Two spar lines and two rib lines.
    expect(r.allByTestIdPrefix('skin-zone-table-').length).toBe(last.recommended ? 4 : 0);
  });

  it('sets one gauge and rivet for every rib against each rib its own', async () => {
    const r = await renderResults();
    expect(
      r.allByTestIdPrefix('wing-trade-row-').filter((e) => !e.getAttribute('data-testid')!.endsWith('-recommended')),
    ).toHaveLength(inputs.gaugeCandidates.length * inputs.rivetCandidates.length);
    const best = result.trade.recommendedUniform!;
    expect(r.byTestId(`wing-trade-row-${best.gaugeIn}-${best.rivet}-recommended`)).toBeTruthy();
    expect(r.byTestId('wing-trade-per-rib').textContent).toContain(`${result.trade.perRib.rivetCount} rivets`);
    expect(r.byTestId('wing-recommended').textContent).toContain(best.rivet);
  });

  it('shows stations in millimetres and moments in newton-metres on the metric switch', async () => {
    const r = await renderResults({ system: 'metric' });
    const rib = result.ribs[1];
    const row = r.byTestId(`wing-rib-row-${idPart(rib.name)}`).textContent!;
    // 1 in = 25.4 mm exactly; 1 in·lbf = 0.1129848 N·m (NIST SP 811).
    expect(row).toContain((rib.stationIn * 25.4).toFixed(0));
    expect(row).toContain((rib.loads.bendingInLb * 0.1129848).toFixed(1));
    expect(r.byTestId('section-ribs').textContent).toContain('Bending, N·m');
  });

  it('stacks the rib table into rows on a phone, every number whole', async () => {
    layoutWidth = 358;
    const r = await renderResults();
    const table = r.byTestId('wing-rib-table');
    expect(table.querySelector('[role="table"]')).toBeNull();
    expect(table.querySelectorAll('[role="listitem"]')).toHaveLength(inputs.ribs.length);
    const rib = result.ribs[0];
    expect(r.byTestId(`wing-rib-row-${idPart(rib.name)}`).textContent).toContain(
      String(Math.round(rib.loads.bendingInLb)),
    );
  });
});

describe('applying a wing study', () => {
  it('offers a skin panel only the kit’s skin-panel part designs, and sends the panel as the target', async () => {
    const sent: { url: string; body: unknown }[] = [];
    const saved = global.fetch;
    const rev = {
      id: 'rev',
      partDesignId: designs[1].id,
      letter: 'A',
      status: 'draft',
      material: '6061-T6',
      gaugeIn: firstPanel.recommended!.gaugeIn,
      rivetSpec: firstPanel.recommended!.rivet,
      drillSize: '#40',
      edgeDistanceIn: 0.2,
      lines: [],
    };
    global.fetch = jest.fn(async (url: string, init: { body?: string }) => {
      // Applying refreshes the kit's part designs afterwards: that GET gets the same list again.
      if (!String(url).includes('/apply')) return { ok: true, status: 200, text: async () => JSON.stringify(designs) };
      sent.push({ url: String(url), body: init.body ? JSON.parse(init.body) : undefined });
      return { ok: true, status: 200, text: async () => JSON.stringify(rev) };
    }) as never;
    try {
      const r = await renderResults();
      // The panel shown in the tables is the one offered first.
      expect(r.byTestId(`wing-apply-target-${panelId}`).getAttribute('aria-checked')).toBe('true');
      expect(r.queryByTestId('apply-design-W-104')).toBeNull();
      await r.press('apply-design-S-201');
      expect(r.byTestId('apply-what').textContent).toContain(firstPanel.name);
      await act(async () => {
        r.byTestId('apply-study').click();
      });
      await r.settle();
      expect(sent).toHaveLength(1);
      expect(sent[0].url).toContain('/api/studies/wing-1/apply');
      expect(sent[0].body).toEqual({
        partDesignId: designs[1].id,
        gaugeIn: firstPanel.recommended!.gaugeIn,
        rivet: firstPanel.recommended!.rivet,
        target: { kind: 'skin', name: firstPanel.name },
      });
      expect(r.byTestId('apply-result').textContent).toContain('S-201');
    } finally {
      global.fetch = saved;
    }
  });

  it('offers a rib the rib part designs and only its candidates with zones', async () => {
    const r = await renderResults();
    await r.press('wing-apply-kind-rib');
    expect(r.queryByTestId('apply-design-S-201')).toBeNull();
    expect(r.byTestId('apply-design-W-104')).toBeTruthy();
    const rib = result.ribs[0];
    await r.press(`wing-apply-target-${idPart(rib.name)}`);
    const offered = r.allByTestIdPrefix('wing-apply-candidate-');
    expect(offered).toHaveLength(ribChoices(rib, result.trade.recommendedUniform).length);
  });

  it('applies only from the latest revision', async () => {
    const r = await renderResults({ revision: 1, latest: 2 });
    expect(r.byTestId('apply-latest-only').textContent).toContain('latest revision (2)');
    expect(r.queryByTestId('apply-study')).toBeNull();
  });
});
