import { z } from 'zod';
import { plainText } from './common';
import { checkWing, GAUGE_RANGE_IN, listOf, measured, whole } from './engineering';
import { aircraftCategories } from './kits';

/**
 * A rib load study's inputs, in the engine's units (in, lb, ft², KEAS). Every number carries its
 * physical range here, the engine's own (server/engineering/bounds.ts) or a narrower one, so a request
 * never reaches the engine outside it; the engine then refuses what makes no physical sense in
 * combination (and a study whose work is over its budget), naming the same field paths.
 */
const num = (what: string) => z.number({ message: `${what} must be a number` });
const fraction = (what: string) =>
  num(what).min(0, `${what} is a fraction of chord from 0 to 1`).max(1, `${what} is a fraction of chord from 0 to 1`);

export const studyKitInput = z
  .object({
    /** gross weight, lb: 100 – 20,000 */
    weightLb: measured('weight', 100, 20_000, 'lb'),
    /** wing area, ft²: 10 – 2,000 */
    wingAreaSqFt: measured('wing area', 10, 2_000, 'ft²'),
    /** mean geometric chord, in: 10 – 300 */
    meanChordIn: measured('mean chord', 10, 300, 'in'),
    /** wing lift slope, per radian: 0.5 – 2π */
    liftSlopePerRad: measured('lift slope', 0.5, 2 * Math.PI, 'per radian (2π is the thin-airfoil limit)').optional(),
    /** stall speed, KEAS: 20 – 200 */
    stallSpeedKeas: measured('stall speed', 20, 200, 'KEAS'),
    /** design cruise speed VC, KEAS: 30 – 400 */
    cruiseSpeedKeas: measured('cruise speed', 30, 400, 'KEAS').optional(),
    /** design dive speed VD, KEAS: 40 – 500 */
    diveSpeedKeas: measured('dive speed', 40, 500, 'KEAS').optional(),
    category: z.enum(aircraftCategories, { message: 'category is normal, utility or acrobatic' }),
    /** gust altitude, ft: 0 – 36,000 (the atmosphere model stops at the tropopause) */
    altitudeFt: num('altitude')
      .min(0, 'altitude cannot be below sea level')
      .max(36000, 'the atmosphere model stops at the tropopause')
      .optional(),
  })
  .refine((k) => k.cruiseSpeedKeas === undefined || k.cruiseSpeedKeas > k.stallSpeedKeas, {
    path: ['cruiseSpeedKeas'],
    message: 'cruise speed must be above the stall speed',
  })
  .refine(
    (k) => k.diveSpeedKeas === undefined || k.cruiseSpeedKeas === undefined || k.diveSpeedKeas > k.cruiseSpeedKeas,
    {
      path: ['diveSpeedKeas'],
      message: 'dive speed must be above the cruise speed',
    },
  )
  .superRefine(checkWing);

/** One coordinate of an uploaded outline, in the file's own unit (unit chord, mm, in): ±10,000. */
const coordinate = measured('a coordinate', -10_000, 10_000, "(in the file's unit)");

export const studyAirfoilInput = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('naca'),
    designation: z
      .string({ message: 'the designation must be text' })
      .trim()
      .regex(/^(NACA\s*)?\d{4,5}$/i, 'a NACA designation such as 2412 or 23012'),
  }),
  z.object({
    kind: z.literal('coordinates'),
    name: plainText('the airfoil name', 0, 80).optional(),
    /** 10 – 2,000 [x, y] points */
    points: listOf(
      z.tuple([coordinate, coordinate], { message: 'coordinates are x, y pairs' }),
      'points',
      10,
      2000,
      'an airfoil needs at least ten points',
    ),
  }),
]);

export const studyLineInput = z
  .object({
    name: plainText('the line name', 1, 40, 'name the line'),
    surface: z.enum(['upper', 'lower'], { message: 'the line runs along the upper or the lower surface' }),
    /** x/c: 0 – 1 */
    startXc: fraction('line start'),
    /** x/c: 0 – 1, aft of the start */
    endXc: fraction('line end'),
  })
  .refine((l) => l.endXc > l.startXc, { path: ['endXc'], message: 'the line must end aft of its start' });

/** One row of a Cp table: x/c 0 – 1, Cp upper and lower −30 – 1 (1 is stagnation). */
const cp = (what: string) =>
  num(what)
    .min(-30, `${what} below −30 is not a plausible pressure`)
    .max(1, `${what} above 1 is more than stagnation pressure: impossible in subsonic flow`);
const cpRow = z.tuple([fraction('x/c'), cp('Cp upper'), cp('Cp lower')], {
  message: 'rows are x/c, Cp upper, Cp lower',
});

/** Flaps-extended conditions (14 CFR 23.345): VSF, and VF when the supplier sets it above the rule minimum. */
const flapsInput = z.object({
  /** KEAS: 15 – 200 */
  stallSpeedKeas: measured('stall speed with flaps extended', 15, 200, 'KEAS'),
  /** KEAS: 20 – 400 */
  designSpeedKeas: measured('flap design speed', 20, 400, 'KEAS').optional(),
});

/** The correction of Cp to each condition's Mach number. */
export const pressureRules = ['karman-tsien', 'prandtl-glauert', 'none'] as const;

const cpTablesInput = listOf(
  z.object({
    /** −3 – 3, not zero */
    cl: num('lift coefficient of the table')
      .min(-3, 'lift coefficient of the table must be between −3 and 3')
      .max(3, 'lift coefficient of the table must be between −3 and 3'),
    rows: listOf(cpRow, 'rows', 5, 500, 'a Cp table needs at least five rows'),
  }),
  'Cp tables',
  1,
  12,
);

/** What a rib study and a wing study both take: the kit, the section, the sheet and rivet candidates, the layout. */
const studyCommon = {
  kit: studyKitInput,
  airfoil: studyAirfoilInput,
  /** flaps-extended conditions are studied when given */
  flaps: flapsInput.optional(),
  /** Kármán–Tsien when absent */
  compressibility: z
    .enum(pressureRules, { message: 'compressibility is karman-tsien, prandtl-glauert or none' })
    .optional(),
  material: plainText('the material', 1, 40, 'choose the sheet material'),
  /** 1 – 10 gauges, each 0.008 – 0.25 in */
  gaugeCandidates: listOf(
    measured('gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in'),
    'gauges',
    1,
    10,
    'choose at least one gauge',
  ),
  /** 1 – 8 rivet specs */
  rivetCandidates: listOf(
    plainText('the rivet', 1, 40, 'choose the rivet'),
    'rivets',
    1,
    8,
    'choose at least one rivet',
  ),
  /** diameters: 4 – 16 (the engine takes 3 – 24) */
  maxPitchDiameters: num('maximum pitch')
    .min(4, 'maximum pitch below 4D leaves no room')
    .max(16, 'maximum pitch over 16D is outside the layout rules'),
  /**
   * in: 0.01 – 1. The engine also holds the pitch grid (maximum pitch ÷ increment) and the stations ×
   * pitches it makes to its work budget, and names this field when a study is over it.
   */
  pitchIncrementIn: measured('pitch increment', 0.01, 1, 'in'),
  /** 1 – 8 */
  maxZones: whole('zones', 1, 8),
  /** 40 – 400, even */
  panels: whole('panels', 40, 400)
    .refine((n) => n % 2 === 0, 'the number of panels must be even: half on each surface')
    .optional(),
  /** min: 0.1 – 30 */
  minutesPerHole: measured('minutes per hole', 0.1, 30, 'min').optional(),
  /** Measured or computed pressure to use instead of the panel method: 1 – 12 tables, one per lift coefficient, 5 – 500 rows each. */
  cpTables: cpTablesInput.optional(),
  rankBy: z.enum(['weight', 'buildTime']).optional(),
};

const internalCp = num('internal pressure coefficient')
  .min(-3, 'internal pressure coefficient must be between −3 and 1')
  .max(1, 'internal pressure coefficient must be between −3 and 1');

export const ribStudyInputSchema = z.object({
  ...studyCommon,
  rib: z.object({
    /** in: 4 – 300 */
    chordIn: measured('rib chord', 4, 300, 'in'),
    /** in: 2 – 60 (the tributary width each rivet line carries) */
    spacingIn: measured('rib spacing', 2, 60, 'in'),
    /** −3 – 1 */
    internalCp: internalCp.optional(),
    /** in: 0.2 – 4 */
    flangeWidthIn: measured('flange width', 0.2, 4, 'in').optional(),
  }),
  /** 1 – 6 lines */
  lines: listOf(studyLineInput, 'fastener lines', 1, 6, 'add at least one fastener line'),
});
export type RibStudyInputValues = z.infer<typeof ribStudyInputSchema>;

/** The wing's planform: a rectangle, or straight taper from root to tip (taper ratio 0.1 – 1). */
const planformInput = z.discriminatedUnion(
  'kind',
  [
    z.object({
      kind: z.literal('rectangle'),
      /** tip to tip, in: 60 – 1,200 */
      spanIn: measured('span', 60, 1200, 'in'),
      /** in: 4 – 300 */
      chordIn: measured('chord', 4, 300, 'in'),
    }),
    z
      .object({
        kind: z.literal('tapered'),
        spanIn: measured('span', 60, 1200, 'in'),
        rootChordIn: measured('root chord', 4, 300, 'in'),
        tipChordIn: measured('tip chord', 4, 300, 'in'),
      })
      .refine((p) => p.tipChordIn <= p.rootChordIn && p.tipChordIn >= 0.1 * p.rootChordIn, {
        path: ['tipChordIn'],
        message: 'the tip chord must be from 0.1 to 1 times the root chord',
      }),
  ],
  { message: 'the planform is a rectangle or tapered' },
);

/**
 * A whole wing: its planform, the tail, its ribs from root to tip (each studied at its own station), the
 * fastener lines every rib has, the spars that close the box, and the skin panels' candidates.
 */
export const wingStudyInputSchema = z
  .object({
    ...studyCommon,
    planform: planformInput,
    tail: z.object({
      /** in: 24 – 600, from the wing's quarter chord to the tail's */
      armIn: measured('tail arm', 24, 600, 'in'),
      /** lb at VC, positive down: −5,000 – 5,000; estimated from the section's moment when absent */
      balancingLoadLb: num('tail balancing load')
        .min(-5000, 'tail balancing load must be between −5,000 and 5,000 lb')
        .max(5000, 'tail balancing load must be between −5,000 and 5,000 lb')
        .optional(),
    }),
    /** 2 – 24 ribs, root to tip, each 0 – 600 in from the centre line */
    ribs: listOf(
      z.object({
        name: plainText('the rib name', 1, 40, 'name the rib'),
        stationIn: num('rib station')
          .min(0, 'a rib station is measured outboard from the centre line')
          .max(600, 'a rib station is at most 600 in from the centre line'),
      }),
      'ribs',
      2,
      24,
      'a wing needs at least two ribs',
    ),
    rib: z.object({
      lines: listOf(studyLineInput, 'fastener lines', 1, 6, 'add at least one fastener line'),
      internalCp: internalCp.optional(),
      flangeWidthIn: measured('flange width', 0.2, 4, 'in').optional(),
      skinGaugeIn: measured('skin gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in').optional(),
    }),
    spars: z
      .object({
        /** x/c: 0.05 – 0.5 */
        frontXc: num('front spar position')
          .min(0.05, 'the front spar is at x/c 0.05 to 0.5')
          .max(0.5, 'the front spar is at x/c 0.05 to 0.5'),
        /** x/c: 0.2 – 0.9, at least 0.1 aft of the front spar */
        rearXc: num('rear spar position')
          .min(0.2, 'the rear spar is at x/c 0.2 to 0.9')
          .max(0.9, 'the rear spar is at x/c 0.2 to 0.9'),
        /** in², both caps of one surface: 0 – 20 (about 1 in² for a light two-seater's root) */
        capAreaSqIn: num('spar-cap area')
          .min(0, 'the spar-cap area cannot be negative')
          .max(20, 'the spar-cap area is at most 20 in²')
          .optional(),
      })
      .refine((s) => s.rearXc >= s.frontXc + 0.1, {
        path: ['rearXc'],
        message: 'the rear spar must be at least 0.1 chord aft of the front spar',
      }),
    skin: z.object({
      /** 1 – 6 gauges */
      gaugeCandidates: listOf(
        measured('skin gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in'),
        'skin gauges',
        1,
        6,
        'choose at least one skin gauge',
      ),
      /** 1 – 4 rivet specs */
      rivetCandidates: listOf(
        plainText('the rivet', 1, 40, 'choose the rivet'),
        'skin rivets',
        1,
        4,
        'choose at least one skin rivet',
      ),
    }),
  })
  .superRefine((w, ctx) => {
    // Ribs root to tip, within the half-span (the engine says the same; here the form can show it first).
    const half = w.planform.spanIn / 2;
    w.ribs.forEach((r, i) => {
      if (r.stationIn > half)
        ctx.addIssue({
          code: 'custom',
          path: ['ribs', i, 'stationIn'],
          message: `a rib ${r.stationIn} in from the centre line is beyond the ${half} in half-span`,
        });
      if (i > 0 && r.stationIn < w.ribs[i - 1].stationIn + 0.5)
        ctx.addIssue({
          code: 'custom',
          path: ['ribs', i, 'stationIn'],
          message: 'ribs go from root to tip, each at least 0.5 in outboard of the one before',
        });
    });
  });
export type WingStudyInputValues = z.infer<typeof wingStudyInputSchema>;

export const studyKinds = ['rib', 'wing'] as const;
export type StudyKind = (typeof studyKinds)[number];

const studyBody = {
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  name: plainText('the study name', 1, 120, 'name the study'),
};

export const ribStudyBody = z.object({ ...studyBody, kind: z.literal('rib'), inputs: ribStudyInputSchema });
export const wingStudyBody = z.object({ ...studyBody, kind: z.literal('wing'), inputs: wingStudyInputSchema });

/** A study of one rib (the default, for bodies without a kind) or of a whole wing. */
export const studyInput = z.preprocess(
  (b) => (b !== null && typeof b === 'object' && !Array.isArray(b) && !('kind' in b) ? { ...b, kind: 'rib' } : b),
  z.discriminatedUnion('kind', [ribStudyBody, wingStudyBody], { message: 'a study is of a rib or of a wing' }),
);
/** What the rib study form checks and sends (a body without a kind is a rib study). */
export const ribStudyForm = z.object({ ...studyBody, inputs: ribStudyInputSchema });
export type StudyInput = z.input<typeof ribStudyForm>;
export type WingStudyInput = z.input<typeof wingStudyBody>;
export type StudyBody = z.output<typeof studyInput>;

export const applyStudyInput = z.object({
  partDesignId: z.uuid({ message: 'choose the part design to apply it to' }),
  gaugeIn: measured('gauge', GAUGE_RANGE_IN.min, GAUGE_RANGE_IN.max, 'in'),
  rivet: plainText('the rivet', 1, 40, 'choose the rivet'),
  /** in a wing study: which rib, or which skin panel (by name) */
  target: z
    .discriminatedUnion(
      'kind',
      [
        z.object({ kind: z.literal('rib'), name: plainText('the rib', 1, 40, 'choose the rib') }),
        z.object({ kind: z.literal('skin'), name: plainText('the skin panel', 1, 80, 'choose the skin panel') }),
      ],
      { message: 'choose a rib or a skin panel of the wing' },
    )
    .optional(),
});
export type ApplyStudyInput = z.infer<typeof applyStudyInput>;

export const reworkCheckInput = z.object({
  proposedSpec: plainText('the oversize rivet', 1, 40, 'choose the oversize rivet').optional(),
});

export type StudySummary = {
  id: string;
  kind: StudyKind;
  kitModelId: string;
  kitName: string;
  name: string;
  revision: number;
  updatedAt: string;
  recommended: { gaugeIn: number; rivet: string } | null;
};
/** `result` is the engine's RibStudyResult (kind 'rib') or WingStudyResult (kind 'wing'), stored as computed. */
export type StudyDetail = StudySummary & {
  inputs: RibStudyInputValues | WingStudyInputValues;
  result: Record<string, any>;
  revisions: { revision: number; createdAt: string; createdByName: string }[];
};

/** Parses pasted or uploaded airfoil coordinates: one "x y" (or "x,y") pair a line; other lines skipped. */
export function parseCoordinateText(text: string): [number, number][] {
  const points: [number, number][] = [];
  for (const line of text.split(/\r?\n/)) {
    const m = line.trim().match(/^(-?\d*\.?\d+(?:[eE][-+]?\d+)?)[\s,;]+(-?\d*\.?\d+(?:[eE][-+]?\d+)?)$/);
    if (!m) continue;
    const [x, y] = [Number(m[1]), Number(m[2])];
    // A point-count line ("61. 61.") heads some files: whole numbers past the chord are not a point.
    if (x > 1.5 && Number.isInteger(x) && Number.isInteger(y)) continue;
    points.push([x, y]);
  }
  return points;
}
