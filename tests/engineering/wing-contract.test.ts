import { studyInput, wingStudyInputSchema } from '@/db/contracts';
import { fieldAt, MAX_WING_RIBS, WING_BOUNDS, type WingStudyInput } from '@/server/engineering';
import { flangeLines } from '../fixtures/rib-study';
import { standardWing } from '../fixtures/wing-study';

// The wing study's contract states each range the engine holds (server/engineering/bounds.ts, WING_BOUNDS)
// or a narrower one: a request never reaches the engine with a number it would refuse.

// The standard wing cut down to two ribs and one candidate, with flaps and a tail load: every field given.
const wing: WingStudyInput = {
  ...standardWing,
  flaps: { stallSpeedKeas: 41, designSpeedKeas: 80 },
  tail: { armIn: 170, balancingLoadLb: 50 },
  ribs: standardWing.ribs.slice(0, 2),
  rib: { lines: [flangeLines[0]] },
  spars: { ...standardWing.spars, capAreaSqIn: 0.4 },
  skin: { gaugeCandidates: [0.02], rivetCandidates: ['MS20426AD3'] },
  gaugeCandidates: [0.025],
  rivetCandidates: ['PULLED-4'],
};
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

/** Sets a dotted path ("spars.frontXc", "ribs.0.stationIn") in a copy of the wing. */
function withValue(path: string, value: unknown): unknown {
  const body = clone(wing) as unknown as Record<string, unknown>;
  const keys = path.split('.');
  let at: Record<string, unknown> = body;
  for (const k of keys.slice(0, -1)) at = at[k] as Record<string, unknown>;
  at[keys[keys.length - 1]] = value;
  return body;
}

// Each contract field and the engine bound it must stay within.
const fields: [string, keyof typeof WING_BOUNDS][] = [
  ['planform.spanIn', 'planform.spanIn'],
  ['planform.chordIn', 'planform.chordIn'],
  ['ribs.0.stationIn', 'ribs[].stationIn'],
  ['tail.armIn', 'tail.armIn'],
  ['tail.balancingLoadLb', 'tail.balancingLoadLb'],
  ['spars.frontXc', 'spars.frontXc'],
  ['spars.capAreaSqIn', 'spars.capAreaSqIn'],
  ['flaps.stallSpeedKeas', 'flaps.stallSpeedKeas'],
  ['flaps.designSpeedKeas', 'flaps.designSpeedKeas'],
  ['skin.gaugeCandidates.0', 'panel.thicknessIn'],
];

describe('the wing study contract', () => {
  it('accepts the wing as a request sends it, as a study of kind "wing"', () => {
    expect(wingStudyInputSchema.safeParse(wing).success).toBe(true);
    const body = studyInput.safeParse({
      kind: 'wing',
      kitModelId: '6f1d8c1e-2a8b-4f7e-9c55-3c1b2a9d0e11',
      name: 'Wing',
      inputs: wing,
    });
    expect(body.success && body.data.kind).toBe('wing');
  });

  it('reads a body without a kind as a rib study', () => {
    const parsed = studyInput.safeParse({
      kitModelId: '6f1d8c1e-2a8b-4f7e-9c55-3c1b2a9d0e11',
      name: 'Rib',
      inputs: wing,
    });
    expect(parsed.success).toBe(false);
    expect(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'))).toContain('inputs.lines');
  });

  it.each(fields)("refuses %s outside the engine's range", (path, key) => {
    const b = WING_BOUNDS[key];
    const span = b.max - b.min;
    for (const v of [b.min - 0.01 * span - 1e-6, b.max + 0.01 * span + 1e-6]) {
      const parsed = wingStudyInputSchema.safeParse(withValue(path, v));
      expect(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'))).toContain(path);
    }
  });

  it('takes at most as many ribs as the engine', () => {
    const many = Array.from({ length: MAX_WING_RIBS + 1 }, (_, i) => ({ name: `R${i}`, stationIn: 10 + i * 6 }));
    const parsed = wingStudyInputSchema.safeParse(withValue('ribs', many));
    expect(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'))).toContain('ribs');
  });

  it('names a rib beyond the half-span at its own field, as the engine does', () => {
    const parsed = wingStudyInputSchema.safeParse(
      withValue('ribs', [
        { name: 'A', stationIn: 20 },
        { name: 'B', stationIn: 170 },
      ]),
    );
    const engineField = fieldAt('', 'ribs[1].stationIn');
    expect(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'))).toContain(engineField);
  });
});
