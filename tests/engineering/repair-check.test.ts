import {
  countersunkHeadHeightIn,
  findRivet,
  repairCheck,
  type RepairCheckInput,
  type RepairHoleInput,
} from '@/server/engineering';
import { refusal } from './refusal';

// AD4 drilled out to AD5 in 0.032 6061-T6: 2D = 0.3125 in, 3D = 0.46875 in, 2.5D (countersunk) = 0.390625 in.
const sound: RepairHoleInput = {
  holeId: 'U-01',
  stationIn: 10,
  neighbourStationsIn: [9, 11],
  edgeDistanceIn: 0.35,
  appliedLimitTensionLb: 10,
  appliedLimitShearLb: 40,
};

/** Another hole of the same finding, two inches along, with room for the new size unless told otherwise. */
const other = (over: Partial<RepairHoleInput> = {}): RepairHoleInput => ({
  ...sound,
  holeId: 'U-02',
  stationIn: 12,
  neighbourStationsIn: [11, 13],
  ...over,
});

const finding = (holes: RepairHoleInput[], over: Partial<RepairCheckInput> = {}): RepairCheckInput => ({
  rivetSpec: 'MS20470AD4',
  proposedSpec: 'MS20470AD5',
  gaugeIn: 0.032,
  material: '6061-T6',
  holes,
  ...over,
});

const countersunk = { rivetSpec: 'MS20426AD4', proposedSpec: 'MS20426AD5' };

describe('the repair check over every hole of a finding', () => {
  it('fails the finding when one hole fails, and names that hole in every reason', () => {
    const r = repairCheck(finding([sound, other({ neighbourStationsIn: [11.6, 13] })]));
    // pitch ≥ 3D of the new diameter: 3 × 5/32 = 0.46875 in — FAA AC 43.13-1B ch. 4 / 4-57
    expect(r.requiredPitchIn).toBeCloseTo(0.46875, 10);
    expect(r.holes.map((h) => [h.holeId, h.pass])).toEqual([
      ['U-01', true],
      ['U-02', false],
    ]);
    expect(r.pass).toBe(false);
    expect(r.reasons.length).toBeGreaterThan(0);
    expect(r.reasons.every((reason) => reason.startsWith('U-02: '))).toBe(true);
    expect(r.reasons.join(' ')).toMatch(/pitch to the previous hole 0\.4000 in is less than 3D = 0\.4688 in/);
    expect(r.alternative).toBe('repair with doubler');
  });

  it('gives the new drill, and the edge distance and pitch the new size needs', () => {
    const r = repairCheck(finding([sound]));
    expect(r.pass).toBe(true);
    // #21 number drill = 0.1590 in for a 5/32 rivet — published number-drill charts; FAA-H-8083-31 ch. 4
    expect(r.newDrill).toEqual({ name: '#21', diameterIn: 0.159 });
    // edge ≥ 2D, pitch ≥ 3D — FAA AC 43.13-1B ch. 4
    expect(r.requiredEdgeIn).toBeCloseTo(0.3125, 10);
    expect(r.requiredPitchIn).toBeCloseTo(0.46875, 10);
    expect(r.countersink).toBeNull();
    expect(r.alternative).toBeNull();
    expect(r.holes[0].margins.combinedLimit).not.toBeNull();
  });

  it('checks a run drilled out together against 3D of the new size between its own holes', () => {
    const run = (gap: number): RepairHoleInput[] =>
      ['U-01', 'U-02', 'U-03'].map((holeId, i) => ({
        holeId,
        stationIn: 10 + i * gap,
        neighbourStationsIn: [i === 0 ? 10 - gap : 10 + (i - 1) * gap, 10 + (i + 1) * gap],
        edgeDistanceIn: 0.35,
      }));
    // pitch ≥ 3D = 0.46875 in for AD5 — FAA AC 43.13-1B ch. 4: 0.5 in holds, 0.45 in does not
    expect(repairCheck(finding(run(0.5))).pass).toBe(true);
    const tight = repairCheck(finding(run(0.45)));
    expect(tight.holes.every((h) => !h.pass)).toBe(true);
    expect(tight.holes[1].pitchToNeighboursIn.map((p) => p?.toFixed(4))).toEqual(['0.4500', '0.4500']);
  });

  it('takes the measured edge distance over the nominal one: nominal 0.35 in passes, measured 0.25 in fails', () => {
    const nominal = repairCheck(finding([sound]));
    expect(nominal.pass).toBe(true);
    expect(nominal.holes[0]).toMatchObject({ edgeDistanceUsedIn: 0.35, edgeDistanceMeasured: false });

    const measured = repairCheck(finding([{ ...sound, measured: { edgeDistanceIn: 0.25 } }]));
    // FAA AC 43.13-1B 4-57: AD4 → AD5 at 0.25 in edge distance fails, needs 0.3125 in (2D of 5/32)
    expect(measured.pass).toBe(false);
    expect(measured.holes[0]).toMatchObject({ edgeDistanceUsedIn: 0.25, edgeDistanceMeasured: true });
    expect(measured.reasons).toEqual([
      expect.stringMatching(/^U-01: edge distance 0\.2500 in is less than 2D = 0\.3125 in/),
    ]);
    expect(measured.alternative).toBe('repair with doubler');
  });

  it('fails a hole that measures larger than the new drill: the next size does not clean it up', () => {
    const r = repairCheck(finding([sound, other({ holeId: 'U-04', measured: { holeDiameterIn: 0.17 } })]));
    // #21 drill = 0.1590 in — published number-drill charts; 0.170 in is beyond it
    expect(r.pass).toBe(false);
    expect(r.holes[0].pass).toBe(true);
    expect(r.reasons).toEqual([
      'U-04: the hole measures 0.170 in, larger than the #21 drill (0.159 in) of MS20470AD5: ' +
        'the next size does not clean it up',
    ]);
    expect(r.holes[1].alternative).toBe('repair with doubler');
  });

  it('lets the drill clean up a hole that measures just at its size, and says to look at the wall', () => {
    const r = repairCheck(finding([{ ...sound, measured: { holeDiameterIn: 0.159 } }]));
    // #21 drill = 0.1590 in — published number-drill charts
    expect(r.pass).toBe(true);
    expect(r.warnings.join(' ')).toMatch(/cleans the wall up all round/);
  });

  it('says scrap for the finding when any hole would break into the edge, even if another only needs a doubler', () => {
    const r = repairCheck(
      finding([
        { ...sound, holeId: 'U-01', neighbourStationsIn: [9.6, 11] },
        other({ measured: { edgeDistanceIn: 0.15 } }),
      ]),
    );
    // edge ≥ 2D = 0.3125 in, pitch ≥ 3D — FAA AC 43.13-1B ch. 4;
    // the scrap threshold (under 1D of edge left) is our rule, not a published one
    expect(r.holes.map((h) => h.alternative)).toEqual(['repair with doubler', 'scrap']);
    expect(r.alternative).toBe('scrap');
  });
});

describe('a countersunk rivet in the repair', () => {
  const edge = { ...sound, edgeDistanceIn: 0.4 };

  it('derives the head height of a 100° head from its diameter', () => {
    // h = (Dh − D)/2 / tan 50°; MS20426AD4 head 0.225 in across, about 0.042 in high — MS20426, from memory
    expect(countersunkHeadHeightIn(findRivet('MS20426AD4'))).toBeCloseTo(0.042, 3);
    // MS20426AD5 head 0.285 in across, about 0.054 in high — MS20426, from memory
    expect(countersunkHeadHeightIn(findRivet('MS20426AD5'))).toBeCloseTo(0.054, 3);
    expect(countersunkHeadHeightIn(findRivet('MS20470AD5'))).toBeNull();
  });

  it('fails in thin sheet, where a machine countersink would knife-edge it: dimple instead', () => {
    const r = repairCheck(finding([edge], countersunk));
    // FAA-H-8083-31 ch. 4 (AC 65-15A ch. 5 before it): countersink only where the sheet is thicker than the head,
    // dimple thinner sheet. The 0.054 in AD5 head is deeper than the whole 0.032 in sheet, so this fails
    // under that rule and under the 2/3-of-the-sheet shop rule (2/3 figure from memory) alike.
    expect(r.countersink).toEqual({
      required: true,
      headHeightIn: expect.closeTo(0.054, 3),
      limitIn: expect.closeTo(0.02133, 5),
      pass: false,
    });
    expect(r.pass).toBe(false);
    expect(r.reasons).toEqual([expect.stringMatching(/^U-01: countersink would knife-edge the sheet: dimple instead/)]);
    // The repair is a dimple, not a doubler or scrap.
    expect(r.alternative).toBeNull();
    expect(r.rules.join(' ')).toMatch(/2\/3 of the sheet thickness/);
  });

  it('passes in thick sheet, where the countersink leaves a cylindrical bore', () => {
    const r = repairCheck(finding([edge], { ...countersunk, gaugeIn: 0.09 }));
    // 0.054 in head in 0.090 in sheet: within 2/3 t = 0.060 in (shop rule, from memory) and thinner than the
    // sheet (FAA-H-8083-31 ch. 4); edge ≥ 2.5D = 0.390625 in for a countersunk head — FAA AC 43.13-1B ch. 4
    expect(r.countersink).toMatchObject({ required: true, limitIn: expect.closeTo(0.06, 10), pass: true });
    expect(r.requiredEdgeIn).toBeCloseTo(0.390625, 10);
    expect(r.pass).toBe(true);
  });
});

describe('limits met exactly', () => {
  const f = Math.fround;

  it('passes stations stored as float32 exactly 3D apart, and an edge distance of exactly 2D', () => {
    // The database stores stations as `real`: 1.3 reads back as 1.2999999523…, a hair under 3D from 0.83125.
    const s = [0.83125, 1.3, 1.76875].map(f);
    expect(s[1] - s[0]).toBeLessThan(0.46875);
    const hole = other({ stationIn: s[1], neighbourStationsIn: [s[0], s[2]], edgeDistanceIn: f(0.3125) });
    const r = repairCheck(finding([hole]));
    // pitch ≥ 3D = 0.46875 in, edge ≥ 2D = 0.3125 in for AD5 — FAA AC 43.13-1B ch. 4; met at the limit
    expect(r.pass).toBe(true);
  });

  it('still fails a pitch a thousandth short of 3D: the tolerance is half a thousandth', () => {
    const r = repairCheck(finding([{ ...sound, neighbourStationsIn: [10 - 0.4677, 11] }]));
    // pitch ≥ 3D = 0.46875 in — FAA AC 43.13-1B ch. 4
    expect(r.pass).toBe(false);
  });
});

describe('what the repair check refuses', () => {
  it('refuses more than 50 holes, naming the holes', () => {
    const holes = Array.from({ length: 51 }, (_, i) => ({ ...sound, holeId: `U-${i + 1}` }));
    expect(refusal(() => repairCheck(finding(holes))).field).toBe('holes');
    expect(refusal(() => repairCheck(finding([]))).field).toBe('holes');
  });

  it.each<[string, RepairCheckInput]>([
    ['holes[0].edgeDistanceIn', finding([{ ...sound, edgeDistanceIn: NaN }])],
    ['holes[1].measured.edgeDistanceIn', finding([sound, other({ measured: { edgeDistanceIn: 11 } })])],
    ['holes[0].measured.holeDiameterIn', finding([{ ...sound, measured: { holeDiameterIn: 1.5 } }])],
    ['holes[0].stationIn', finding([{ ...sound, stationIn: 1001 }])],
    ['holes[0].neighbourStationsIn[1]', finding([{ ...sound, neighbourStationsIn: [9, Infinity] }])],
    ['holes[0].neighbourStationsIn[0]', finding([{ ...sound, neighbourStationsIn: [10, 11] }])],
    ['holes[0].appliedLimitShearLb', finding([{ ...sound, appliedLimitShearLb: -1 }])],
    ['holes[0].appliedLimitTensionLb', finding([{ ...sound, appliedLimitTensionLb: 100001 }])],
    ['holes[1].holeId', finding([sound, sound])],
    ['gaugeIn', finding([sound], { gaugeIn: 0.6 })],
    ['proposedSpec', finding([sound], { proposedSpec: 'MS20470AD3' })],
  ])('refuses a bad %s, naming it', (field, input) => {
    expect(refusal(() => repairCheck(input)).field).toBe(field);
  });
});

describe('the stored repair check', () => {
  it('is plain JSON, with its inputs, rules, warnings and caution', () => {
    const r = repairCheck(finding([sound, other()], countersunk));
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
    expect(r.inputs.holes).toHaveLength(2);
    expect(r.rules.join(' ')).toMatch(/FAA AC 43\.13-1B/);
    expect(r.caution).toMatch(/aid only/);
  });

  it('says a warning every hole shares once, and names the holes of the others', () => {
    const unloaded = other({ appliedLimitTensionLb: undefined, appliedLimitShearLb: undefined });
    const r = repairCheck(finding([sound, unloaded]));
    expect(r.warnings).toContain('U-02: no applied loads given: strength margins are not checked, only the layout');
    expect(r.warnings.filter((w) => /no coupon data/.test(w))).toHaveLength(1);
  });
});
