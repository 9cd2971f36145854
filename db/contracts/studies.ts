import { z } from 'zod';
import { aircraftCategories } from './kits';

/**
 * A rib load study's inputs, in the engine's units (in, lb, ft², KEAS). This schema checks shape and
 * plain ranges as the supplier types; the engine then refuses what makes no physical sense, naming the
 * same field paths.
 */
const num = (what: string) => z.number({ message: `${what} must be a number` });
const positive = (what: string) => num(what).positive(`${what} must be greater than zero`);

export const studyKitInput = z.object({
  weightLb: positive('weight'),
  wingAreaSqFt: positive('wing area'),
  meanChordIn: positive('mean chord'),
  liftSlopePerRad: positive('lift slope').max(2 * Math.PI, 'lift slope above 2π per radian is not a wing').optional(),
  stallSpeedKeas: positive('stall speed'),
  cruiseSpeedKeas: positive('cruise speed').optional(),
  diveSpeedKeas: positive('dive speed').optional(),
  category: z.enum(aircraftCategories, { message: 'category is normal, utility or acrobatic' }),
  altitudeFt: num('altitude').min(0, 'altitude cannot be below sea level').max(36000, 'the atmosphere model stops at the tropopause').optional(),
}).refine((k) => k.cruiseSpeedKeas === undefined || k.cruiseSpeedKeas > k.stallSpeedKeas, {
  path: ['cruiseSpeedKeas'], message: 'cruise speed must be above the stall speed',
}).refine((k) => k.diveSpeedKeas === undefined || k.cruiseSpeedKeas === undefined || k.diveSpeedKeas > k.cruiseSpeedKeas, {
  path: ['diveSpeedKeas'], message: 'dive speed must be above the cruise speed',
});

export const studyAirfoilInput = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('naca'), designation: z.string().trim().regex(/^(NACA\s*)?\d{4,5}$/i, 'a NACA designation such as 2412 or 23012') }),
  z.object({
    kind: z.literal('coordinates'),
    name: z.string().trim().max(80).optional(),
    points: z.array(z.tuple([z.number(), z.number()]), { message: 'coordinates are x, y pairs' })
      .min(10, 'an airfoil needs at least ten points').max(2000, 'at most 2000 points'),
  }),
]);

export const studyLineInput = z.object({
  name: z.string().trim().min(1, 'name the line').max(40),
  surface: z.enum(['upper', 'lower'], { message: 'the line runs along the upper or the lower surface' }),
  startXc: num('line start').min(0, 'line start is a fraction of chord from 0 to 1').max(1, 'line start is a fraction of chord from 0 to 1'),
  endXc: num('line end').min(0, 'line end is a fraction of chord from 0 to 1').max(1, 'line end is a fraction of chord from 0 to 1'),
}).refine((l) => l.endXc > l.startXc, { path: ['endXc'], message: 'the line must end aft of its start' });

export const ribStudyInputSchema = z.object({
  kit: studyKitInput,
  airfoil: studyAirfoilInput,
  rib: z.object({
    chordIn: positive('rib chord'),
    spacingIn: positive('rib spacing'),
    internalCp: num('internal pressure coefficient').min(-3).max(1).optional(),
    flangeWidthIn: positive('flange width').optional(),
  }),
  lines: z.array(studyLineInput).min(1, 'add at least one fastener line').max(6),
  material: z.string().trim().min(1, 'choose the sheet material'),
  gaugeCandidates: z.array(positive('gauge').max(0.25)).min(1, 'choose at least one gauge').max(10),
  rivetCandidates: z.array(z.string().trim().min(1)).min(1, 'choose at least one rivet').max(8),
  maxPitchDiameters: num('maximum pitch').min(4, 'maximum pitch below 4D leaves no room').max(16, 'maximum pitch over 16D is outside the layout rules'),
  pitchIncrementIn: positive('pitch increment'),
  maxZones: z.number().int('zones must be a whole number').min(1, 'at least one zone').max(8, 'at most 8 zones'),
  panels: z.number({ message: 'panels must be a number' }).int('panels is a whole number').min(40, 'at least 40 panels').max(400, 'at most 400 panels')
    .refine((n) => n % 2 === 0, 'the number of panels must be even: half on each surface').optional(),
  minutesPerHole: positive('minutes per hole').optional(),
  /** Measured or computed pressure to use instead of the panel method: one table per lift coefficient. */
  cpTables: z.array(z.object({
    cl: num('lift coefficient of the table'),
    rows: z.array(z.tuple([z.number(), z.number(), z.number()]), { message: 'rows are x/c, Cp upper, Cp lower' })
      .min(5, 'a Cp table needs at least five rows').max(500, 'at most 500 rows'),
  })).min(1).max(12, 'at most 12 Cp tables').optional(),
  rankBy: z.enum(['weight', 'buildTime']).optional(),
});
export type RibStudyInputValues = z.infer<typeof ribStudyInputSchema>;

export const studyInput = z.object({
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  name: z.string().trim().min(1, 'name the study').max(120),
  inputs: ribStudyInputSchema,
});
export type StudyInput = z.input<typeof studyInput>;

export const applyStudyInput = z.object({
  partDesignId: z.uuid({ message: 'choose the part design to apply it to' }),
  gaugeIn: positive('gauge'),
  rivet: z.string().trim().min(1, 'choose the rivet'),
});
export type ApplyStudyInput = z.infer<typeof applyStudyInput>;

export const reworkCheckInput = z.object({
  proposedSpec: z.string().trim().min(1, 'choose the oversize rivet').optional(),
});

export type StudySummary = { id: string; kitModelId: string; kitName: string; name: string; revision: number; updatedAt: string; recommended: { gaugeIn: number; rivet: string } | null };
/** `result` is the engine's RibStudyResult, stored as computed. */
export type StudyDetail = StudySummary & { inputs: RibStudyInputValues; result: Record<string, any>; revisions: { revision: number; createdAt: string; createdByName: string }[] };

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
