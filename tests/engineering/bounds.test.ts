import {
  couponInput,
  kitModelInput,
  MAX_REVISION_HOLES as CONTRACT_MAX_REVISION_HOLES,
  revisionHoleBound,
  ribStudyInputSchema,
} from '@/db/contracts';
import {
  ASPECT_RATIO_RANGE as CONTRACT_ASPECT_RATIO,
  WING_LOADING_RANGE_PSF as CONTRACT_WING_LOADING,
} from '@/db/contracts/engineering';
import {
  ASPECT_RATIO_RANGE,
  buildAirfoil,
  coarsenRuns,
  designConditions,
  estimateHoles,
  fieldAt,
  groupIntoZones,
  MAX_REVISION_HOLES,
  pitchSchedule,
  placeHoles,
  requireStudyBudget,
  ribStudy,
  STUDY_BOUNDS,
  STUDY_BUDGET,
  WING_LOADING_RANGE_PSF,
  type RibStudyInput,
  type StudyBoundKey,
  type StudyWork,
  type Zone,
} from '@/server/engineering';
import { coupon } from '../fixtures/coupons';
import { sixLines, standardKit, standardKitModel, standardRibStudy } from '../fixtures/rib-study';
import { refusal } from './refusal';

// Issue 7 §4 and issue 9 §5: every input has a physical range, the engine refuses a study over its
// work budget naming the field, and no loop runs on a count a request chose without a cap.

// The standard rib with every optional input given, so that each has its range checked.
const study: RibStudyInput = {
  ...standardRibStudy,
  kit: { ...standardKit, diveSpeedKeas: 170, altitudeFt: 0, liftSlopePerRad: 4.8 },
  rib: { ...standardRibStudy.rib, internalCp: 0, flangeWidthIn: 0.75, skinGaugeIn: 0.025 },
  gaugeCandidates: [0.025, 0.032],
  rivetCandidates: ['MS20470AD4'],
  panels: 80,
  minutesPerHole: 1.5,
  wingTorqueInLb: 1000,
  cellAreaSqIn: 200,
  coupons: [{ ...coupon(0.025, 40, 'no_deformation', 'MS20470AD4'), couponWidthIn: 1 }],
};
const coordinates = buildAirfoil({ kind: 'naca', designation: '2412' }, 60).points;
const cpRows = (n: number): [number, number, number][] =>
  Array.from({ length: n }, (_, i) => [0.05 + (0.9 * i) / (n - 1), -0.5, 0.2]);
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

/**
 * The study with the bound's field set to `value` (a list item: the first one; a count: a list that long).
 * Returns the input and the field the refusal must name.
 */
function withValue(key: StudyBoundKey, value: number): { input: RibStudyInput; field: string } {
  const input = clone(study) as RibStudyInput & Record<string, unknown>;
  const list = <T>(n: number, item: (i: number) => T) => Array.from({ length: Math.max(0, n) }, (_, i) => item(i));
  switch (key) {
    case 'airfoil.points':
      input.airfoil = { kind: 'coordinates', points: list(value, (i) => coordinates[i % coordinates.length]) };
      return { input, field: 'airfoil.points' };
    case 'airfoil.points[][]':
      input.airfoil = { kind: 'coordinates', points: coordinates.map((p, i) => (i === 0 ? [value, p[1]] : p)) };
      return { input, field: 'airfoil.points[0][0]' };
    case 'lines':
      input.lines = list(value, (i) => ({
        name: `line ${i}`,
        surface: i % 2 ? 'lower' : 'upper',
        startXc: 0.1,
        endXc: 0.8,
      }));
      return { input, field: 'lines' };
    case 'gaugeCandidates':
      input.gaugeCandidates = list(value, (i) => 0.02 + i / 1000);
      return { input, field: 'gaugeCandidates' };
    case 'gaugeCandidates[]':
      input.gaugeCandidates = [value];
      return { input, field: 'gaugeCandidates[0]' };
    case 'rivetCandidates':
      input.rivetCandidates = list(value, () => 'MS20470AD4');
      return { input, field: 'rivetCandidates' };
    case 'cpTables':
      input.cpTables = list(value, (i) => ({ cl: 0.2 + i / 10, rows: cpRows(5) }));
      return { input, field: 'cpTables' };
    case 'cpTables[].cl':
      input.cpTables = [{ cl: value, rows: cpRows(5) }];
      return { input, field: 'cpTables[0].cl' };
    case 'cpTables[].rows':
      input.cpTables = [{ cl: 0.5, rows: cpRows(value) }];
      return { input, field: 'cpTables[0].rows' };
    case 'coupons':
      input.coupons = list(value, () => study.coupons![0]);
      return { input, field: 'coupons' };
    default: {
      if (key.startsWith('coupons[].')) {
        const f = key.slice('coupons[].'.length);
        input.coupons = [{ ...study.coupons![0], [f]: value }];
        return { input, field: `coupons[0].${f}` };
      }
      // A kit's edge values come with an area, weight or chord that keeps the wing a wing, so the only
      // thing wrong is the value itself (not also its aspect ratio or wing loading).
      const low = value < STUDY_BOUNDS[key].min;
      const companions: Record<string, Partial<RibStudyInput['kit']>> = {
        'kit.weightLb': low ? { wingAreaSqFt: 20, meanChordIn: 30 } : { wingAreaSqFt: 1000, meanChordIn: 100 },
        'kit.meanChordIn': low ? { wingAreaSqFt: 10, weightLb: 200 } : { wingAreaSqFt: 2000, weightLb: 20000 },
        'kit.wingAreaSqFt': low ? { weightLb: 100, meanChordIn: 15 } : { weightLb: 20000, meanChordIn: 150 },
      };
      if (companions[key]) input.kit = { ...input.kit, ...companions[key] };
      const path = key.split('.');
      let at: Record<string, unknown> = input;
      for (const p of path.slice(0, -1)) at = at[p] as Record<string, unknown>;
      at[path[path.length - 1]] = value;
      return { input, field: key };
    }
  }
}

/** Just outside each end: below the least, above the most (a count: one fewer, one more). */
function outside(key: StudyBoundKey): number[] {
  const b = STUDY_BOUNDS[key];
  const step = 'integer' in b && b.integer ? 1 : Math.max(Math.abs(b.min), Math.abs(b.max), 1) * 1e-6;
  // A list cannot be shorter than empty; a list that must have one is refused empty by its own check.
  return [b.min - step, b.max + step].filter((v) => !('integer' in b && b.integer) || v >= 0);
}

const keys = Object.keys(STUDY_BOUNDS) as StudyBoundKey[];

describe('the engine refuses every number outside its physical range, naming the field', () => {
  it.each(keys.flatMap((key) => outside(key).map((v) => [key, v] as const)))('%s = %p', (key, value) => {
    const { input, field } = withValue(key, value);
    expect(refusal(() => ribStudy(input)).field).toBe(field);
  });

  it('takes the study inside every range (the table above refuses only what is outside)', () => {
    expect(ribStudy(study).recommended).not.toBeNull();
  });

  it('names the mean chord, not the lift slope, for a mean chord of 1e300 in', () => {
    const e = refusal(() => designConditions({ ...study.kit, meanChordIn: 1e300, liftSlopePerRad: undefined }));
    expect(e.field).toBe('kit.meanChordIn');
  });

  it.each([
    [
      'a plank: 300 in on 12 ft²',
      { meanChordIn: 300, wingAreaSqFt: 12, weightLb: 200 },
      'kit.meanChordIn',
      /aspect ratio/,
    ],
    [
      'a ribbon: 10 in on 2,000 ft²',
      { meanChordIn: 10, wingAreaSqFt: 2000, weightLb: 20000 },
      'kit.meanChordIn',
      /aspect ratio/,
    ],
    ['20,000 lb on 100 ft²', { weightLb: 20000, wingAreaSqFt: 100, meanChordIn: 40 }, 'kit.weightLb', /wing loading/],
  ])('refuses a wing that is not one (%s), naming the field that makes it so', (_what, kit, field, reason) => {
    const e = refusal(() =>
      designConditions({
        ...study.kit,
        ...kit,
        liftSlopePerRad: undefined,
        cruiseSpeedKeas: undefined,
        diveSpeedKeas: undefined,
        stallSpeedKeas: 30,
      }),
    );
    expect(e.field).toBe(field);
    expect(e.reason).toMatch(reason);
  });
});

describe('the contracts never let through what the engine refuses', () => {
  // The request's form of the study: the engine-only fields (torque, cell area, skin gauge, coupons) are
  // not part of it.
  const requestBody = (input: RibStudyInput) => {
    const { wingTorqueInLb: _t, cellAreaSqIn: _a, coupons: _c, ...rest } = input;
    const { skinGaugeIn: _s, ...rib } = rest.rib;
    return { ...rest, rib };
  };
  const inRequest = keys.filter((k) => !/^(wingTorqueInLb|cellAreaSqIn|coupons|rib\.skinGaugeIn)/.test(k));
  const issuesAt = (body: unknown, field: string) => {
    const parsed = ribStudyInputSchema.safeParse(body);
    const path = fieldAt('', field);
    return parsed.success ? [] : parsed.error.issues.filter((i) => i.path.join('.').startsWith(path));
  };

  it('accepts the study as the request sends it', () => {
    expect(ribStudyInputSchema.safeParse(requestBody(study)).success).toBe(true);
  });

  it.each(inRequest.flatMap((key) => outside(key).map((v) => [key, v] as const)))(
    'the study contract refuses %s = %p',
    (key, value) => {
      const { input, field } = withValue(key, value);
      expect(issuesAt(requestBody(input), field).length).toBeGreaterThan(0);
    },
  );

  it.each(['weightLb', 'wingAreaSqFt', 'meanChordIn', 'stallSpeedKeas', 'cruiseSpeedKeas'] as const)(
    'the kit contract refuses a %s outside the engine range',
    (f) => {
      const kit = standardKitModel;
      expect(kitModelInput.safeParse(kit).success).toBe(true);
      for (const v of outside(`kit.${f}`)) {
        // The study's kit with the value set (and its companions: see withValue), as a kit model.
        const parsed = kitModelInput.safeParse({ ...kit, ...withValue(`kit.${f}`, v).input.kit });
        expect(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'))).toContain(f);
      }
    },
  );

  it.each(['gaugeIn', 'loadLb', 'couponWidthIn'] as const)(
    'the coupon contract refuses a %s outside the engine range',
    (f) => {
      const test = {
        material: '6061-T6',
        gaugeIn: 0.025,
        couponWidthIn: 1,
        rivetSpec: 'PULLED-4',
        loadLb: 40,
        outcome: 'failure',
        testedOn: '2026-10-14',
      };
      expect(couponInput.safeParse(test).success).toBe(true);
      for (const v of outside(`coupons[].${f}`)) {
        const parsed = couponInput.safeParse({ ...test, [f]: v });
        expect(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'))).toContain(f);
      }
    },
  );

  it.each([
    ['a plank: 300 in on 12 ft²', { meanChordIn: 300, wingAreaSqFt: 12, weightLb: 200 }, 'meanChordIn', /aspect ratio/],
    ['20,000 lb on 100 ft²', { weightLb: 20000, wingAreaSqFt: 100, meanChordIn: 40 }, 'weightLb', /wing loading/],
  ])('the kit contracts refuse a wing that is not one (%s) as the engine does', (_what, wing, field, message) => {
    const kit = standardKitModel;
    for (const schema of [kitModelInput, ribStudyInputSchema.shape.kit]) {
      const parsed = schema.safeParse({ ...kit, ...wing });
      expect(
        parsed.success ? [] : parsed.error.issues.filter((i) => i.path.join('.') === field).map((i) => i.message),
      ).toEqual([expect.stringMatching(message)]);
    }
  });

  it('states the same wing checks and revision hole cap as the engine', () => {
    expect(CONTRACT_ASPECT_RATIO).toEqual(ASPECT_RATIO_RANGE);
    expect(CONTRACT_WING_LOADING).toEqual(WING_LOADING_RANGE_PSF);
    expect(CONTRACT_MAX_REVISION_HOLES).toBe(MAX_REVISION_HOLES);
  });
});

describe('the engine refuses a study over its work budget before it starts, naming the field that drives it', () => {
  it.each([1e-12, 1e-6])(
    'refuses a pitch increment of %p in at once (the grid loop once had no bound)',
    (pitchIncrementIn) => {
      expect(refusal(() => ribStudy({ ...study, pitchIncrementIn })).field).toBe('pitchIncrementIn');
    },
  );

  it('refuses a rib chord of 1e6 in and a spacing of 1e-300 in', () => {
    expect(refusal(() => ribStudy({ ...study, rib: { ...study.rib, chordIn: 1e6 } })).field).toBe('rib.chordIn');
    expect(refusal(() => ribStudy({ ...study, rib: { ...study.rib, spacingIn: 1e-300 } })).field).toBe('rib.spacingIn');
  });

  it('refuses a pitch grid over its budget before it starts: before even the airfoil is read', () => {
    const e = refusal(() =>
      ribStudy({
        ...study,
        airfoil: { kind: 'naca', designation: '0000' },
        rivetCandidates: ['MS20470AD8'],
        maxPitchDiameters: 24,
        pitchIncrementIn: 0.01,
      }),
    );
    expect(e.field).toBe('pitchIncrementIn');
  });

  it('refuses an in-range increment whose pitch grid is too long for the largest rivet', () => {
    // 24D of a 1/4 in rivet is 6 in: 600 pitches at 0.01 in.
    const e = refusal(() =>
      ribStudy({ ...study, rivetCandidates: ['MS20470AD8'], maxPitchDiameters: 24, pitchIncrementIn: 0.01 }),
    );
    expect(e.field).toBe('pitchIncrementIn');
    expect(e.reason).toMatch(/601 pitches .* at most 500: use an increment of at least 0\.013 in/);
  });

  it('refuses stations × pitches over the budget, naming the increment and the one that fits', () => {
    const e = refusal(() =>
      ribStudy({
        ...study,
        rib: { ...study.rib, chordIn: 300 },
        lines: sixLines,
        maxPitchDiameters: 16,
        pitchIncrementIn: 0.01,
      }),
    );
    expect(e.field).toBe('pitchIncrementIn');
    expect(e.reason).toMatch(/look-ups; at most 2,000,000: use an increment of at least/);
  });

  it('refuses a study whose candidates would place more holes than the budget, naming the longer list', () => {
    const big = { ...study, rib: { ...study.rib, chordIn: 200 }, lines: sixLines };
    const gauges = [0.016, 0.02, 0.025, 0.032, 0.04, 0.05, 0.063, 0.071, 0.08, 0.09];
    const byGauges = refusal(() =>
      ribStudy({ ...big, gaugeCandidates: gauges, rivetCandidates: ['MS20470AD3', 'MS20470AD4'] }),
    );
    expect(byGauges.field).toBe('gaugeCandidates');
    expect(byGauges.reason).toMatch(/20 candidates could place up to [\d,]+ holes in all; at most 50,000/);
    const byRivets = refusal(() =>
      ribStudy({
        ...big,
        gaugeCandidates: gauges.slice(0, 2),
        rivetCandidates: [
          'MS20470AD3',
          'MS20470AD4',
          'PULLED-4',
          'PULLED-5',
          'MS20426AD3',
          'MS20426AD4',
          'MS20470AD5',
          'PULLED-4-CSK',
        ],
      }),
    );
    expect(byRivets.field).toBe('rivetCandidates');
    expect(byRivets.reason).toMatch(/holes in all/);
  });

  it('refuses an outline whose surface is far longer than its chord (a wavy file), naming the points', () => {
    // The upper surface zig-zags 400 times between 5 % and 45 % thickness without crossing itself.
    const n = 400;
    const upper: [number, number][] = Array.from({ length: n + 1 }, (_, i) => [
      1 - i / n,
      i === 0 ? 0 : i % 2 ? 0.45 : 0.05,
    ]);
    const lower: [number, number][] = Array.from({ length: n }, (_, i) => [(i + 1) / n, i === n - 1 ? 0 : -0.02]);
    const points = [...upper.slice(0, -1), [0, 0] as [number, number], ...lower];
    const e = refusal(() =>
      ribStudy({
        ...study,
        airfoil: { kind: 'coordinates', points },
        panels: 400,
        rib: { ...study.rib, chordIn: 300 },
        lines: sixLines,
      }),
    );
    expect(e.field).toBe('airfoil.points');
    expect(e.reason).toMatch(/load stations; at most 20,000: the outline's surface is \d+ times as long as its chord/);
  });

  const work = (w: Partial<StudyWork>): StudyWork & { lineLengthsIn: number[] } => ({
    stations: 1000,
    conditions: 7,
    candidates: 18,
    pitchGrid: 20,
    gridCells: 20_000,
    stationChecks: 126_000,
    holes: 5000,
    lineLengthsIn: [50, 50],
    ...w,
  });
  it.each([
    ['stations', { stations: STUDY_BUDGET.stations + 1 }, 'rib.chordIn'],
    ['stations × pitches', { gridCells: STUDY_BUDGET.gridCells + 1 }, 'pitchIncrementIn'],
    ['stations × conditions × candidates', { stationChecks: STUDY_BUDGET.stationChecks + 1 }, 'gaugeCandidates'],
    ['holes', { holes: STUDY_BUDGET.holes + 1 }, 'gaugeCandidates'],
  ] as const)('holds %s to its budget', (_what, over, field) => {
    const input = {
      ...study,
      gaugeCandidates: [0.02, 0.025, 0.032, 0.04, 0.05, 0.063],
      rivetCandidates: ['MS20470AD3', 'MS20470AD4', 'PULLED-4'],
    };
    expect(refusal(() => requireStudyBudget(input, work(over), 3)).field).toBe(field);
    expect(() => requireStudyBudget(input, work({}), 3)).not.toThrow();
  });

  it('says in its result what it counted', () => {
    const r = ribStudy(study);
    expect(r.work).toMatchObject({ conditions: r.conditions.length, candidates: 2, pitchGrid: 9 });
    expect(r.work.stations).toBeGreaterThan(2 * 2);
    expect(r.work.holes).toBeGreaterThanOrEqual(
      r.candidates.reduce((n, c) => n + c.lines.reduce((m, l) => m + l.holes.length, 0), 0),
    );
  });
});

describe('holes are bounded however the zones came', () => {
  it('refuses zones of 1e-8 in pitch before placing a hole (shipping such a revision once killed the server)', () => {
    const e = refusal(() => placeHoles([{ from: 0, to: 30, pitch: 1e-8 }], 0.25, 29.75, 0));
    expect(e.field).toBe('zones');
    expect(e.reason).toMatch(/would place about [\d,]+ holes on one line; at most 5,000/);
  });

  it('never places holes closer than the minimum pitch, whatever a zone asks', () => {
    const { positions } = placeHoles([{ from: 0, to: 10, pitch: 0.1 }], 0.25, 9.75, 0.375);
    for (let i = 1; i < positions.length; i++)
      expect(positions[i] - positions[i - 1]).toBeGreaterThanOrEqual(0.375 - 1e-9);
  });

  it('estimates at least as many holes as it places, and the contract at least as many as that', () => {
    let seed = 7;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (let k = 0; k < 200; k++) {
      const length = 5 + 60 * rnd();
      const cuts = [
        0,
        ...Array.from({ length: Math.floor(4 * rnd()) }, () => length * rnd()).sort((a, b) => a - b),
        length,
      ];
      const zones: Zone[] = cuts
        .slice(1)
        .map((to, i) => ({ from: cuts[i], to, pitch: 0.4 + 2 * rnd() }))
        .filter((z) => z.to > z.from);
      const edge = 0.25;
      const placed = placeHoles(zones, edge, length - edge, 0.375).positions.length;
      const engine = estimateHoles(zones, edge, length - edge, 0.375);
      const contract = revisionHoleBound([
        { zones: zones.map((z) => ({ fromIn: z.from, toIn: z.to, pitchIn: z.pitch })) },
      ]);
      expect(engine).toBeGreaterThanOrEqual(placed);
      expect(contract).toBeGreaterThanOrEqual(engine);
    }
  });

  it('merges a saw-tooth of needed pitches down to a bounded count, keeping the tighter pitch', () => {
    const runs: Zone[] = Array.from({ length: 1001 }, (_, i) => ({
      from: i,
      to: i + 1,
      pitch: i % 2 ? 2 : 1 + (i % 7) / 10,
    }));
    const { runs: merged, merged: did } = coarsenRuns(runs, 200);
    expect(did).toBe(true);
    expect(merged.length).toBeLessThanOrEqual(200);
    expect(merged[0].from).toBe(0);
    expect(merged[merged.length - 1].to).toBe(1001);
    for (const z of merged) {
      const inside = runs.filter((r) => r.from >= z.from - 1e-9 && r.to <= z.to + 1e-9);
      expect(z.pitch).toBeCloseTo(Math.min(...inside.map((r) => r.pitch)), 12);
    }
  });

  it('schedules a swinging load at a fine increment with its stretches merged, the tighter pitch kept, and says so', () => {
    // 60 in of line, the pull swinging ten times between 8 and 40 lb/in: the needed pitch walks up and
    // down the 0.01 in grid, hundreds of runs of one pitch.
    const stations = Array.from({ length: 1201 }, (_, i) => ({
      stationIn: i / 20,
      alongIn: i / 20,
      limitTensionLbPerIn: 24 + 16 * Math.sin((2 * Math.PI * i) / 120),
    }));
    const s = pitchSchedule({
      line: 'saw',
      stations,
      material: '6061-T6',
      gaugeIn: 0.032,
      rivetSpec: 'MS20470AD4',
      maxPitchDiameters: 16,
      pitchIncrementIn: 0.01,
      maxZones: 8,
    });
    expect(s.warnings.join(' ')).toMatch(/neighbouring stretches were merged, each keeping the tighter pitch/);
    expect(s.zones.length).toBeLessThanOrEqual(8);
    expect(s.holes.every((h) => (h.msLimit ?? 1) >= -1e-9)).toBe(true);
  });

  it('groups runs into zones exactly as the direct (cubic) grouping does', () => {
    // The reference: every split tried, each zone's pitch recomputed from scratch.
    const reference = (runs: Zone[], maxZones: number): number => {
      const cost = (a: number, b: number) =>
        (runs[b].to - runs[a].from) / Math.min(...runs.slice(a, b + 1).map((r) => r.pitch));
      const best = (k: number, b: number): number =>
        k === 0
          ? cost(0, b)
          : Math.min(...Array.from({ length: b - k + 1 }, (_, i) => best(k - 1, k + i - 1) + cost(k + i, b)));
      return Math.min(...Array.from({ length: Math.min(maxZones, runs.length) }, (_, k) => best(k, runs.length - 1)));
    };
    let seed = 11;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (let k = 0; k < 30; k++) {
      const runs: Zone[] = Array.from({ length: 3 + Math.floor(6 * rnd()) }, (_, i) => ({
        from: i * 2,
        to: i * 2 + 2,
        pitch: 0.5 + rnd(),
      }));
      const zones = groupIntoZones(runs, 3);
      const rivets = zones.reduce((n, z) => n + (z.to - z.from) / z.pitch, 0);
      expect(rivets).toBeLessThan(reference(runs, 3) + 1 + 1e-9);
    }
  });
});

describe('field paths', () => {
  it.each([
    ['inputs', 'lines[1].name', 'inputs.lines.1.name'],
    ['inputs', 'airfoil.points[4][1]', 'inputs.airfoil.points.4.1'],
    ['inputs', 'kit.meanChordIn', 'inputs.kit.meanChordIn'],
    ['', 'cpTables[0].rows[2]', 'cpTables.0.rows.2'],
  ])('places %p + %p at %p', (prefix, field, path) => {
    expect(fieldAt(prefix, field)).toBe(path);
  });
});
