import { wingStudyBody } from '@/db/contracts';
import { WingForm, type WingOutput } from '@/components/studies/wing-form';
import {
  evenlySpacedRibs,
  kitPlanform,
  newWingValues,
  ribName,
  wingFieldFor,
  wingValues,
} from '@/components/studies/wing-form-values';
import { ApiError } from '@/lib/api-client';
import { demoKit, renderInUnits } from './studies-render';

jest.setTimeout(60_000);

const kit = demoKit;

function renderForm(system: 'imperial' | 'metric', onSubmit: (v: WingOutput) => Promise<void>) {
  return renderInUnits(
    system,
    <WingForm kits={[kit]} defaultValues={newWingValues(kit)} isNew submitLabel="Compute" onSubmit={onSubmit} />,
  );
}

/** What a new wing lacks before the contract accepts it: a name, and the tail arm (170 in). */
async function nameWithTailArm(r: ReturnType<typeof renderForm>, name: string) {
  await r.type('wing-name', name);
  await r.type('wing-tail-arm', '170');
}

describe('the wing form’s values', () => {
  it('starts from the kit model: a rectangle of its area and mean chord, its airfoil and speeds', () => {
    const v = newWingValues(kit);
    expect(v.kind).toBe('wing');
    // Span of a rectangle b = S / c: 120 ft² × 144 in²/ft² ÷ 54 in = 320 in (arithmetic).
    expect(v.inputs.planform).toEqual({ kind: 'rectangle', spanIn: 320, chordIn: 54 });
    expect(kitPlanform({ wingAreaSqFt: 100, meanChordIn: 48 })).toEqual({
      kind: 'rectangle',
      spanIn: 300,
      chordIn: 48,
    });
    expect(v.inputs.airfoil).toEqual({ kind: 'naca', designation: '2412' });
    expect(v.inputs.kit).toMatchObject({ weightLb: 1320, stallSpeedKeas: 47, category: 'utility' });
    expect(v.inputs.tail.armIn).toBeUndefined();
  });

  it('spaces ribs evenly from the first station to the last, named up from the first', () => {
    const ribs = evenlySpacedRibs(10, 24, 154.5, 'W-101');
    expect(Array.isArray(ribs) && ribs.map((r) => r.stationIn)).toEqual([
      24, 38.5, 53, 67.5, 82, 96.5, 111, 125.5, 140, 154.5,
    ]);
    expect(Array.isArray(ribs) && ribs.map((r) => r.name)).toEqual([
      'W-101',
      'W-102',
      'W-103',
      'W-104',
      'W-105',
      'W-106',
      'W-107',
      'W-108',
      'W-109',
      'W-110',
    ]);
    expect(evenlySpacedRibs(1, 0, 100, 'R')).toBe('a wing study takes 2 to 24 ribs');
    expect(evenlySpacedRibs(25, 0, 100, 'R')).toBe('a wing study takes 2 to 24 ribs');
    expect(evenlySpacedRibs(5, 100, 20, 'R')).toMatch(/outboard of the first/);
  });

  it('counts rib names up from the trailing number, keeping its leading zeros', () => {
    expect(ribName('W-101', 2)).toBe('W-103');
    expect(ribName('R07', 3)).toBe('R10');
    expect(ribName('Root', 1)).toBe('Root 2');
  });

  it('puts a server complaint on the field it names, in zod’s spelling or the engine’s', () => {
    expect(wingFieldFor('inputs.ribs.3.stationIn')).toBe('inputs.ribs.3.stationIn');
    expect(wingFieldFor('ribs[3].stationIn')).toBe('inputs.ribs.3.stationIn');
    expect(wingFieldFor('ribs[2]')).toBe('inputs.ribs.2.stationIn');
    expect(wingFieldFor('rib.lines[1].endXc')).toBe('inputs.rib.lines.1.endXc');
    expect(wingFieldFor('skin.rivetCandidates[0]')).toBe('inputs.skin.rivetCandidates');
    expect(wingFieldFor('inputs.gaugeCandidates.4')).toBe('inputs.gaugeCandidates');
    expect(wingFieldFor('spars.rearXc')).toBe('inputs.spars.rearXc');
    expect(wingFieldFor('planform.tipChordIn')).toBe('inputs.planform.tipChordIn');
    expect(wingFieldFor('coupons[0].loadLb')).toBeNull();
  });

  it('copies a stored revision so editing the form cannot change the cached one', () => {
    const stored = { kitModelId: kit.id, name: 'W', inputs: newWingValues(kit).inputs as never };
    const v = wingValues(stored);
    v.inputs.ribs[0].name = 'changed';
    expect((stored.inputs as { ribs: { name: string }[] }).ribs[0].name).toBe('W-101');
  });
});

describe('the wing form', () => {
  it('sends a whole-wing body the contract accepts once named and given a tail arm', async () => {
    const sent: WingOutput[] = [];
    const r = renderForm('imperial', async (v) => {
      sent.push(v);
    });
    await nameWithTailArm(r, 'Left wing');
    await r.press('wing-compute');
    expect(sent).toHaveLength(1);
    expect(wingStudyBody.safeParse(sent[0]).success).toBe(true);
    expect(sent[0]).toMatchObject({
      kind: 'wing',
      kitModelId: kit.id,
      inputs: { tail: { armIn: 170 }, planform: { spanIn: 320 } },
    });
    expect(sent[0].inputs.ribs).toHaveLength(10);
  });

  it('takes rib stations in millimetres on the metric switch and sends inches', async () => {
    const sent: WingOutput[] = [];
    const r = renderForm('metric', async (v) => {
      sent.push(v);
    });
    await r.type('wing-name', 'Metric wing');
    await r.type('wing-tail-arm', '4318');
    await r.type('wing-rib-9-station', '3937');
    await r.press('wing-compute');
    // 25.4 mm to the inch, exactly (international inch, 1959).
    expect(sent[0].inputs.ribs[9].stationIn).toBeCloseTo(155, 9);
    expect(sent[0].inputs.tail.armIn).toBeCloseTo(170, 9);
  });

  it('says as it is typed that ribs go root to tip and stay inside the half-span', async () => {
    const r = renderForm('imperial', async () => {});
    // The contract checks the rib order once the rest of the body reads: name it and give the tail arm first.
    await nameWithTailArm(r, 'Order');
    await r.type('wing-rib-3-station', '30');
    expect(r.byTestId('wing-rib-3-station-field-error').textContent).toContain('root to tip');
    await r.type('wing-rib-3-station', '67.5');
    await r.type('wing-rib-9-station', '170');
    expect(r.byTestId('wing-rib-9-station-field-error').textContent).toContain('beyond the 160 in half-span');
  });

  it('puts the server’s complaint about one rib next to that rib’s station', async () => {
    const r = renderForm('imperial', async () => {
      throw new ApiError(
        400,
        'invalid_input',
        'inputs.ribs.3.stationIn: rib W-104 carries a 61.0 in wide strip of wing: at most 60 in; add a rib',
        {
          'inputs.ribs.3.stationIn': 'rib W-104 carries a 61.0 in wide strip of wing: at most 60 in; add a rib',
        },
      );
    });
    await nameWithTailArm(r, 'Refused');
    await r.press('wing-compute');
    expect(r.byTestId('wing-rib-3-station-field-error').textContent).toContain('add a rib');
    expect(r.byTestId('wing-form-error').textContent).toContain('See the marked fields');
  });

  it('replaces the ribs with evenly spaced ones', async () => {
    const r = renderForm('imperial', async () => {});
    await r.press('wing-even-open');
    await r.type('wing-even-count', '4');
    await r.type('wing-even-first', '20');
    await r.type('wing-even-last', '140');
    await r.type('wing-even-name', 'R1');
    await r.press('wing-even-apply');
    expect(r.byTestId('wing-rib-count').textContent).toBe('4 ribs');
    expect((r.byTestId('wing-rib-3-station') as HTMLInputElement).value).toBe('140');
    expect((r.byTestId('wing-rib-1-name') as HTMLInputElement).value).toBe('R2');
    expect((r.byTestId('wing-rib-1-station') as HTMLInputElement).value).toBe('60');
  });

  it('refuses to space one rib alone', async () => {
    const r = renderForm('imperial', async () => {});
    await r.press('wing-even-open');
    await r.type('wing-even-count', '1');
    await r.press('wing-even-apply');
    expect(r.byTestId('wing-even-error').textContent).toBe('a wing study takes 2 to 24 ribs');
    expect(r.byTestId('wing-rib-count').textContent).toBe('10 ribs');
  });

  it('turns the rectangle into a taper that starts from its chord, and checks the tip against the root', async () => {
    const r = renderForm('imperial', async () => {});
    await r.press('wing-planform-tapered');
    expect((r.byTestId('wing-root-chord') as HTMLInputElement).value).toBe('54');
    await r.type('wing-tip-chord', '4');
    expect(r.byTestId('wing-tip-chord-field-error').textContent).toContain('0.1 to 1 times the root chord');
  });

  it('asks for the flaps-extended stall speed once flaps are studied', async () => {
    const sent: WingOutput[] = [];
    const r = renderForm('imperial', async (v) => {
      sent.push(v);
    });
    await nameWithTailArm(r, 'Flaps');
    await r.press('wing-flaps-on');
    await r.press('wing-compute');
    expect(sent).toHaveLength(0);
    await r.type('wing-flaps-stall', '42');
    await r.press('wing-compute');
    expect(sent[0].inputs.flaps).toEqual({ stallSpeedKeas: 42 });
  });

  it('does not send a wing without a skin rivet', async () => {
    const sent: WingOutput[] = [];
    const r = renderForm('imperial', async (v) => {
      sent.push(v);
    });
    await nameWithTailArm(r, 'No skin rivets');
    await r.press('wing-skin-rivet-MS20426AD3');
    await r.press('wing-skin-rivet-MS20426AD4');
    await r.press('wing-compute');
    expect(sent).toHaveLength(0);
    expect(r.byTestId('wing-skin-rivets-field').textContent).toContain('choose at least one skin rivet');
  });
});
