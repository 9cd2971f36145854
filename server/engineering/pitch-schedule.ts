import { jointAllowables, type JointAllowables } from './allowables';
import { EngineeringInputError } from './errors';
import { layoutRules, layoutRuleText } from './layout';
import { findRivet } from './materials';
import { ENGINEERING_CAUTION } from './result';
import { ULTIMATE_FACTOR } from './rivet-loads';
import { prepareStations, StationCursor, type LoadWindow, type PreparedLine } from './station-loads';
import { STUDY_BUDGET, requireStudyBound } from './bounds';
import { coarsenRuns, groupIntoZones, placeHoles, type Zone } from './zoning';
import type {
  AllowableSummary,
  InsufficientRange,
  PitchScheduleInput,
  PitchScheduleResult,
  ScheduleHole,
  ScheduleSettings,
  ScheduleZone,
} from '../../lib/engineering-results';
import { countText } from '../../lib/number-text';

export { prepareColumns, prepareStations, type LineColumns, type PreparedLine } from './station-loads';

/**
 * The pitch schedule of one fastener line (step 7 of the chain): the pitch each station needs, clamped
 * to the layout rules and rounded down to a practical increment; the stations grouped into a few zones
 * whose pitch never exceeds what any station in the zone needs; holes placed from the line's ends at the
 * edge distance; and, per zone, the worst rivet's loads, allowables and margins.
 */

const EPS = 1e-9;
/** read once: an imported binding read in the hot loop costs a getter call once compiled to CommonJS (tsx, jest) */
const UF = ULTIMATE_FACTOR;

export function validateScheduleSettings(s: ScheduleSettings, rivetDiameterIn: number): void {
  const maxD = requireStudyBound(s.maxPitchDiameters, 'maxPitchDiameters');
  const inc = requireStudyBound(s.pitchIncrementIn, 'pitchIncrementIn');
  const maxPitch = maxD * rivetDiameterIn;
  if (inc > maxPitch + EPS) {
    throw new EngineeringInputError(
      'pitchIncrementIn',
      `the pitch increment (${inc} in) is larger than the maximum pitch (${maxPitch.toFixed(3)} in)`,
    );
  }
  requireStudyBound(s.maxZones, 'maxZones');
}

/**
 * Pitches tried for a rivet: every multiple of the increment from the maximum pitch down to just above
 * the 3D minimum, then the minimum itself. The loop that builds it runs this many times.
 */
export function pitchGridSize(
  s: Pick<ScheduleSettings, 'maxPitchDiameters' | 'pitchIncrementIn'>,
  rivetDiameterIn: number,
): number {
  return Math.max(0, Math.floor((s.maxPitchDiameters * rivetDiameterIn) / s.pitchIncrementIn + EPS)) + 1;
}

/** Refuses an increment so fine that the pitch grid of the largest rivet outgrows the budget. */
export function requirePitchGrid(s: ScheduleSettings, largestRivetDiameterIn: number): number {
  const size = pitchGridSize(s, largestRivetDiameterIn);
  if (size > STUDY_BUDGET.pitchGrid) {
    const coarsest = (s.maxPitchDiameters * largestRivetDiameterIn) / (STUDY_BUDGET.pitchGrid - 1);
    throw new EngineeringInputError(
      'pitchIncrementIn',
      `an increment of ${s.pitchIncrementIn} in makes ${countText(size)} pitches to try up to ${s.maxPitchDiameters}D of a ${largestRivetDiameterIn.toFixed(3)} in rivet; at most ${STUDY_BUDGET.pitchGrid}: use an increment of at least ${(Math.ceil(coarsest * 1000) / 1000).toFixed(3)} in`,
    );
  }
  return size;
}

/** Load per inch of pitch relative to the allowables: pitch × demand ≤ 1 passes. Infinity for a zero allowable. */
function demand(tension: number, shear: number, tensionAllowable: number, shearAllowable: number): number {
  const rt = tension > 0 ? (tensionAllowable > 0 ? tension / tensionAllowable : Infinity) : 0;
  const rs = shear > 0 ? (shearAllowable > 0 ? shear / shearAllowable : Infinity) : 0;
  // Without shear the root is rt itself: √(rt²) gives back rt exactly in binary floating point while rt²
  // neither overflows nor underflows, and the root is most of the cost of this, the hot loop.
  if (rs === 0 && rt > 1e-150 && rt < 1e150) return rt;
  return Math.sqrt(rt * rt + rs * rs); // not Math.hypot: this is the hot loop, and hypot is slow in V8
}

function summarise(a: JointAllowables): AllowableSummary {
  return {
    tensionLimitLb: a.tension.limitLb,
    tensionUltimateLb: a.tension.ultimateLb,
    tensionBasis: a.tension.basis,
    tensionGoverning: a.tension.governing,
    shearLimitLb: a.shear.limitLb,
    shearUltimateLb: a.shear.ultimateLb,
    shearGoverning: a.shear.governing,
  };
}

export function holePrefixFor(line: string): string {
  const name = line.trim().toLowerCase();
  if (name === 'upper') return 'U';
  if (name === 'lower') return 'L';
  const initials = line
    .split(/[^A-Za-z0-9]+/)
    .filter(Boolean)
    .map((w) => w[0].toUpperCase())
    .join('');
  return initials.slice(0, 3) || 'H';
}

type AllowablesInput = Pick<
  PitchScheduleInput,
  'material' | 'gaugeIn' | 'rivetSpec' | 'coupons' | 'pullThroughFallbackFraction' | 'materialData' | 'rivetData'
>;

/**
 * The joint allowables a schedule works to: at the layout's minimum edge distance. They depend on the
 * gauge and rivet, not the line: a caller that schedules one candidate on several lines (the rib study)
 * can work them out once and hand them to each `pitchSchedule`.
 */
export function scheduleAllowables(input: AllowablesInput): JointAllowables {
  const rivet = findRivet(input.rivetSpec, input.rivetData);
  return jointAllowables({
    material: input.material,
    gaugeIn: input.gaugeIn,
    rivetSpec: rivet.code,
    edgeDistanceIn: layoutRules(rivet).minEdgeIn,
    coupons: input.coupons,
    pullThroughFallbackFraction: input.pullThroughFallbackFraction,
    materialData: input.materialData,
    rivetData: input.rivetData,
  });
}

/**
 * Schedules one line. A caller that schedules many candidates on the same line (the rib study) can
 * prepare its loads once (`prepared`, from `prepareStations(input.stations)`), and one that schedules a
 * candidate on several lines its allowables once (`allowables`, from `scheduleAllowables(input)`).
 */
export function pitchSchedule(
  input: PitchScheduleInput,
  prepared?: PreparedLine,
  allowables?: JointAllowables,
): PitchScheduleResult {
  if (!prepared) {
    // the settings are refused before the stations, as they always were
    const diameterIn = layoutRules(findRivet(input.rivetSpec, input.rivetData)).diameterIn;
    validateScheduleSettings(input, diameterIn);
    requirePitchGrid(input, diameterIn);
  }
  const s = scheduleLine(input, prepared ?? prepareStations(input.stations), allowables);
  const b = s.body;
  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal some 50
  // times slower, and a rib study makes one per candidate and line.
  return {
    inputs: input,
    rules: s.rules,
    warnings: s.warnings,
    caution: ENGINEERING_CAUTION,
    line: b.line,
    rivetSpec: b.rivetSpec,
    drill: b.drill,
    gaugeIn: b.gaugeIn,
    feasible: b.feasible,
    reasons: b.reasons,
    lengthIn: b.lengthIn,
    layout: b.layout,
    allowables: b.allowables,
    zones: b.zones,
    holes: s.holes.objects(b.line),
    insufficient: b.insufficient,
  };
}

/** A schedule with its holes still as numbers (`holes.objects` makes them): see `scheduleLine`. */
export interface ScheduledLine {
  rules: string[];
  warnings: string[];
  body: Omit<PitchScheduleResult, 'inputs' | 'rules' | 'warnings' | 'caution' | 'holes'>;
  holes: HoleSet;
}

/**
 * `pitchSchedule` without making an object of every hole, on a line already prepared: the rib study
 * keeps the holes of one candidate only, and for the others needs their count (the zones' worst holes
 * and the margins are worked out here either way).
 */
export function scheduleLine(
  input: Omit<PitchScheduleInput, 'stations'>,
  lineData: PreparedLine,
  allowables?: JointAllowables,
): ScheduledLine {
  const rivet = findRivet(input.rivetSpec, input.rivetData);
  const layout = layoutRules(rivet);
  validateScheduleSettings(input, layout.diameterIn);
  requirePitchGrid(input, layout.diameterIn);
  const allow = allowables ?? scheduleAllowables(input);
  const rules = [
    ...scheduleRuleTexts(rivet.countersunk, input.maxPitchDiameters, input.pitchIncrementIn, input.maxZones),
    ...allow.rules,
  ];
  const warnings = [...allow.warnings];
  const reasons: string[] = [];
  const line = input.line;
  const prefix = input.holePrefix ?? holePrefixFor(line);
  const { along, lengthIn } = lineData;

  const { tension: ta, shear: sa } = allow;
  const cap: Capacity = { tl: ta.limitLb, tu: ta.ultimateLb, sl: sa.limitLb, su: sa.ultimateLb };

  const minPitch = layout.minPitchIn;
  const maxPitch = input.maxPitchDiameters * layout.diameterIn;
  const inc = input.pitchIncrementIn;
  const grid: number[] = [];
  for (let k = Math.floor(maxPitch / inc + EPS); k * inc > minPitch + EPS; k--) grid.push(k * inc);
  grid.push(minPitch);
  const n = along.length;

  // The end rivets carry more than a pitch: the first carries the pull from the line's start, the edge
  // distance ahead of it, as well as half the gap behind it (the last, mirrored). Their share is
  // edge + p/2, which is more than p wherever p < 2·edge; the stretch the first (last) gap spans is held
  // to the largest pitch at which the end rivet carries that share.
  const edge = layout.minEdgeIn;
  const twoEnds = lengthIn >= 2 * edge + minPitch - EPS;
  const ends: EndClamps = { firstTo: -Infinity, firstPitch: Infinity, lastFrom: Infinity, lastPitch: Infinity };
  if (twoEnds) {
    const first = endNeed('first', lineData, grid, edge, cap);
    const final = endNeed('last', lineData, grid, edge, cap);
    // how far from each end the end rivet's pitch holds: its gap, the edge distance and a station spacing
    ends.firstTo = along[0] + (edge + first.pitch + lineData.spacingIn);
    ends.firstPitch = first.pitch;
    ends.lastFrom = along[n - 1] - (edge + final.pitch + lineData.spacingIn);
    ends.lastPitch = final.pitch;
    for (const e of [first, final]) {
      if (!e.passes) {
        reasons.push(
          `the ${e.end} rivet carries the pull over the ${edge.toFixed(3)} in edge distance beyond it as well as half the gap to its neighbour: even at the ${minPitch.toFixed(3)} in (3D) minimum it is overloaded: ${input.gaugeIn} in with ${rivet.code} is insufficient`,
        );
      }
    }
  }

  const { runs, insufficient } = stationNeeds(lineData, grid, cap, ends);
  for (const r of insufficient) {
    reasons.push(
      `from station ${r.fromIn.toFixed(2)} to ${r.toIn.toFixed(2)} in the rivet would need a pitch of ${r.neededPitchIn.toFixed(3)} in, below the ${minPitch.toFixed(3)} in (3D) minimum: ${input.gaugeIn} in with ${rivet.code} is insufficient`,
    );
  }
  if (ta.limitLb <= 0 || ta.ultimateLb <= 0)
    reasons.push(
      `the pull-through allowable of ${input.gaugeIn} in ${allow.material} with ${rivet.code} is zero by its coupons`,
    );

  const coarse = coarsenRuns(runs);
  if (coarse.merged) {
    warnings.push(
      `the needed pitch changes ${runs.length} times along ${line}: neighbouring stretches were merged, each keeping the tighter pitch, before zoning`,
    );
  }
  const zones = groupIntoZones(coarse.runs, input.maxZones);

  const start = along[0] + edge;
  const end = along[n - 1] - edge;
  const placed = placeHoles(zones, start, end, minPitch);
  if (placed.positions.length === 0)
    reasons.push(`the line (${lengthIn.toFixed(3)} in) is shorter than twice the ${edge.toFixed(3)} in edge distance`);
  if (placed.note) warnings.push(placed.note);

  const holes = new HoleSet(placed.positions, zones, lineData, prefix, cap);
  if (holes.failing > 0 && insufficient.length === 0) {
    reasons.push(`${holes.failing} rivet(s) have a negative margin of safety (first ${holes.id(holes.firstFailing)})`);
  }
  const zoneReports = reportZones(zones, holes, lineData, cap);

  return {
    rules,
    warnings,
    body: {
      line,
      rivetSpec: rivet.code,
      drill: rivet.drill,
      gaugeIn: input.gaugeIn,
      feasible: reasons.length === 0,
      reasons,
      lengthIn,
      layout: { edgeDistanceIn: edge, minPitchIn: minPitch, maxPitchIn: maxPitch, pitchIncrementIn: inc },
      allowables: summarise(allow),
      zones: zoneReports,
      insufficient,
    },
    holes,
  };
}

/**
 * The layout rules a schedule states, by its settings. Kept from call to call (a few settings at a time):
 * a study states the same ones for every candidate and line, and the same string is cheap to merge.
 */
const ruleMemo: { countersunk: boolean; maxD: number; inc: number; zones: number; texts: string[] }[] = [];

function scheduleRuleTexts(countersunk: boolean, maxD: number, inc: number, zones: number): string[] {
  for (const m of ruleMemo)
    if (m.countersunk === countersunk && m.maxD === maxD && m.inc === inc && m.zones === zones) return m.texts;
  const texts = [
    "per-rivet load = largest pull per inch over the rivet's share of the line × its share (half the gap to each neighbour; an end rivet's share runs on to the line's end)",
    'required pitch: limit load ≤ limit allowable and 1.5 × limit load ≤ ultimate allowable (14 CFR 23.303, 23.305)',
    `${layoutRuleText(countersunk)}; pitch ≤ ${maxD}D; rounded down to ${inc} in (the 3D minimum itself is allowed)`,
    `at most ${zones} zones; each zone's pitch is the smallest any of its stations needs; a zone is added only if it saves a rivet`,
  ];
  if (ruleMemo.length >= 8) ruleMemo.shift();
  ruleMemo.push({ countersunk, maxD, inc, zones, texts });
  return texts;
}

/*
 * The helpers below are module functions and classes, not closures made inside the schedule: tsx (which
 * runs the benchmark) compiles with esbuild's keepNames, which names every closure as it is made (a
 * defineProperty call each time), and these run for every candidate on every line.
 */

/** The allowables the checks read, as plain numbers: limit and ultimate, tension and shear, lb. */
interface Capacity {
  tl: number;
  tu: number;
  sl: number;
  su: number;
}

/** Whether a rivet at `pitch` under a pull w and a shear q per inch passes at limit and at ultimate. */
function passes(pitch: number, w: number, q: number, c: Capacity): boolean {
  return pitch * demand(w, q, c.tl, c.sl) <= 1 + EPS && UF * pitch * demand(w, q, c.tu, c.su) <= 1 + EPS;
}

/**
 * The largest loads within reach of each station at each grid pitch, fetched from the line (which keeps
 * them for every candidate) the first time a pitch is asked about: a candidate reads only a few of them.
 */
class Windows {
  readonly byPitch: (LoadWindow | null)[];

  constructor(
    private readonly lineData: PreparedLine,
    readonly grid: number[],
  ) {
    this.byPitch = new Array<LoadWindow | null>(grid.length).fill(null);
  }

  load(g: number): LoadWindow {
    return (this.byPitch[g] = this.lineData.window(this.grid[g]));
  }
}

/** Whether station i passes at grid pitch g (its window worked out the first time it is read). */
function passesAt(w: Windows, c: Capacity, i: number, g: number): boolean {
  const win = w.byPitch[g] ?? w.load(g);
  if (win.tension[i] !== win.tension[i]) win.at(i);
  return windowPasses(w.grid, g, win, i, c);
}

/**
 * `passes(grid[g], win.tension[i], win.shear[i], c)` with `demand` written out, taking no number that is
 * not a whole one: V8 boxes every fractional number handed to a call it does not inline (some 30,000 a
 * study when these were passed as numbers), and the hot loop is too big to inline all it calls.
 */
function windowPasses(grid: number[], g: number, win: LoadWindow, i: number, c: Capacity): boolean {
  const pitch = grid[g];
  const w = win.tension[i];
  const q = win.shear[i];
  let rt = w > 0 ? (c.tl > 0 ? w / c.tl : Infinity) : 0;
  let rs = q > 0 ? (c.sl > 0 ? q / c.sl : Infinity) : 0;
  const atLimit = rs === 0 && rt > 1e-150 && rt < 1e150 ? rt : Math.sqrt(rt * rt + rs * rs);
  if (!(pitch * atLimit <= 1 + EPS)) return false;
  rt = w > 0 ? (c.tu > 0 ? w / c.tu : Infinity) : 0;
  rs = q > 0 ? (c.su > 0 ? q / c.su : Infinity) : 0;
  const atUltimate = rs === 0 && rt > 1e-150 && rt < 1e150 ? rt : Math.sqrt(rt * rt + rs * rs);
  return UF * pitch * atUltimate <= 1 + EPS;
}

/** The end rivets' pitches and how far from each end they hold (no clamp: ±Infinity). */
interface EndClamps {
  firstTo: number;
  firstPitch: number;
  lastFrom: number;
  lastPitch: number;
}

/**
 * The pitch every station needs: the longest on the grid (longest first, the 3D minimum last) that
 * carries the largest load within its reach, held to the end rivets' pitches near the ends; returned
 * as the stretches of one needed pitch (each station standing for the line halfway to its neighbours).
 * Where not even the minimum carries a station, the ranges of such stations with the pitch they would
 * need. This is the hot loop of a study (every station of every line for every candidate): one pass,
 * typed arrays, and no object per station.
 */
function stationNeeds(
  lineData: PreparedLine,
  grid: number[],
  c: Capacity,
  ends: EndClamps,
): { runs: Zone[]; insufficient: InsufficientRange[] } {
  const { along } = lineData;
  const stationIn = lineData.station.values;
  const n = along.length;
  const last = grid.length - 1;
  const windows = new Windows(lineData, grid);
  const { firstTo, firstPitch, lastFrom, lastPitch } = ends;
  const runs: Zone[] = [];
  const insufficient: InsufficientRange[] = [];
  let run: Zone | null = null;
  let shortBefore = false;
  let hint = last >> 1;
  // Loads at which the hint's pitch was last seen to pass, and the next longer pitch to fail. Passing is
  // monotone in the loads too: a station with no more tension and shear passes as well, and one with no
  // less fails as well, without working it out again (most stations, the loads changing smoothly).
  // (−∞ for none yet: loads are never negative; all four numbers kept as doubles in V8's optimised code)
  let passW = -Infinity;
  let passQ = -Infinity;
  let failW = Infinity;
  let failQ = Infinity;
  // the windows of the hint's pitch and the next longer one, kept at hand while the hint holds
  let atHint = windows.byPitch[hint] ?? windows.load(hint);
  let longer: LoadWindow | null = null;
  for (let i = 0; i < n; i++) {
    // Passing is monotone in the pitch (a longer pitch carries more, over a wider window), so the first
    // passing grid index is found by bisection. Neighbouring stations mostly need the same pitch: the
    // previous station's answer is tried first, which takes one or two checks instead of a bisection.
    let need = grid[hint];
    let short = false;
    let search = false;
    let w = atHint.tension[i];
    if (w !== w) {
      atHint.at(i);
      w = atHint.tension[i];
    }
    const q = atHint.shear[i];
    let passesHint = w <= passW && q <= passQ;
    if (!passesHint && (passesHint = windowPasses(grid, hint, atHint, i, c))) {
      passW = w;
      passQ = q;
    }
    if (passesHint) {
      if (hint > 0) {
        longer ??= windows.byPitch[hint - 1] ?? windows.load(hint - 1);
        let lw = longer.tension[i];
        if (lw !== lw) {
          longer.at(i);
          lw = longer.tension[i];
        }
        const lq = longer.shear[i];
        let passesLonger = !(lw >= failW && lq >= failQ);
        if (passesLonger && !(passesLonger = windowPasses(grid, hint - 1, longer, i, c))) {
          failW = lw;
          failQ = lq;
        }
        search = passesLonger;
      }
    } else search = true;
    // The search and a station too loaded for the minimum are rare: out of this loop, which V8 then
    // compiles with the checks above written into it (a loop this size is not otherwise).
    if (search) {
      const found = searchNeed(windows, c, i, hint, passesHint);
      if (found !== hint) {
        hint = found;
        passW = passQ = -Infinity;
        failW = failQ = Infinity;
        atHint = windows.byPitch[hint] ?? windows.load(hint);
        longer = null;
      }
      need = grid[found];
      const needed = shortPitchAt(windows, c, i, found);
      if (needed === needed) {
        // the pitch it would need, below the minimum: neighbouring such stations make one range
        const range = insufficient[insufficient.length - 1];
        if (shortBefore) {
          range.toIn = stationIn[i];
          range.neededPitchIn = Math.min(range.neededPitchIn, needed);
        } else insufficient.push({ fromIn: stationIn[i], toIn: stationIn[i], neededPitchIn: needed });
        short = true;
      }
    }
    shortBefore = short;
    const a = along[i];
    if (a <= firstTo && firstPitch < need) need = firstPitch;
    if (a >= lastFrom && lastPitch < need) need = lastPitch;
    // A run ends halfway to the next station that needs another pitch (the last at the line's end).
    if (run !== null && Math.abs(run.pitch - need) < EPS) continue;
    const from = i === 0 ? along[0] : (along[i - 1] + a) / 2;
    if (run !== null) run.to = from;
    run = { from, to: along[n - 1], pitch: need };
    runs.push(run);
  }
  return { runs, insufficient };
}

/**
 * The first passing grid index at station i, by bisection: below the hint when it and the next longer
 * pitch pass, above it when the hint fails.
 */
function searchNeed(w: Windows, c: Capacity, i: number, hint: number, hintPasses: boolean): number {
  const last = w.grid.length - 1;
  let lo = hintPasses ? 0 : Math.min(hint + 1, last);
  let hi = hintPasses ? hint - 1 : last;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (passesAt(w, c, i, mid)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * Where not even the minimum pitch carries station i (the search ending at grid index g, the minimum,
 * without a pass): the pitch it would need. NaN where grid index g passes.
 */
function shortPitchAt(w: Windows, c: Capacity, i: number, g: number): number {
  if (passesAt(w, c, i, g)) return NaN;
  const last = w.grid.length - 1;
  const win = w.byPitch[last] ?? w.load(last);
  if (win.tension[i] !== win.tension[i]) win.at(i);
  const t = win.tension[i];
  const q = win.shear[i];
  return 1 / Math.max(demand(t, q, c.tl, c.sl), UF * demand(t, q, c.tu, c.su));
}

/** The longest pitch on the grid at which an end rivet carries its share: the edge distance and half a gap. */
function endNeed(
  end: 'first' | 'last',
  lineData: PreparedLine,
  grid: number[],
  edge: number,
  c: Capacity,
): { end: 'first' | 'last'; pitch: number; passes: boolean } {
  let lo = 0;
  let hi = grid.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (endPasses(end, lineData, grid[mid], edge, c)) hi = mid;
    else lo = mid + 1;
  }
  return { end, pitch: grid[lo], passes: endPasses(end, lineData, grid[lo], edge, c) };
}

function endPasses(end: 'first' | 'last', lineData: PreparedLine, pitch: number, edge: number, c: Capacity): boolean {
  const share = edge + pitch / 2;
  const m = lineData.endMax(end, share);
  return passes(share, m.tension, m.shear, c);
}

const asIs = (v: number): number => v;
/**
 * `combinedMargin`, the same arithmetic, with NaN for its null (nothing applied): a number either way,
 * so not boxed on its way back from a call V8 does not inline (two for every hole of every candidate).
 */
function marginOf(tensionLb: number, shearLb: number, tensionAllowableLb: number, shearAllowableLb: number): number {
  if (tensionLb <= 0 && shearLb <= 0) return NaN;
  const rt = tensionLb <= 0 ? 0 : tensionAllowableLb > 0 ? tensionLb / tensionAllowableLb : Infinity;
  const rs = shearLb <= 0 ? 0 : shearAllowableLb > 0 ? shearLb / shearAllowableLb : Infinity;
  const r = rs === 0 ? rt : rt === 0 ? rs : Math.hypot(rt, rs);
  return Number.isFinite(r) ? 1 / r - 1 : -1;
}
const marginOrNull = (m: number): number | null => (m !== m ? null : m);
/** The lower of a hole's two margins, a missing one counting as no limit. */
const lowerMargin = (a: number, b: number): number => Math.min(a !== a ? Infinity : a, b !== b ? Infinity : b);

/**
 * One hole after another, in order along the line: its zone, its share of the line, the largest loads
 * over that share and its margins (NaN for none). Every load and position is sampled at the same
 * stations, and the holes ascend: a cursor each for the shares' starts, their ends and the holes finds
 * them among the stations in a step or two.
 */
class HoleWalk {
  zone = 0;
  tributaryIn = 0;
  tension = 0;
  shear = 0;
  msLimit = NaN;
  msUltimate = NaN;
  /** the station index after the hole, for its station and drawing position */
  after = 0;
  private z = 0;
  private readonly fromAt: StationCursor;
  private readonly toAt: StationCursor;
  private readonly holeAt: StationCursor;

  constructor(
    private readonly positions: number[],
    private readonly zones: Zone[],
    private readonly lineData: PreparedLine,
    private readonly c: Capacity,
  ) {
    this.fromAt = new StationCursor(lineData.along);
    this.toAt = new StationCursor(lineData.along);
    this.holeAt = new StationCursor(lineData.along);
  }

  /** Hole k, the holes taken in order. */
  step(k: number): void {
    const pos = this.positions;
    const zones = this.zones;
    const { along, tension, shear, noShear } = this.lineData;
    const n = along.length;
    const c = this.c;
    const h = pos[k];
    // Positions and zones both ascend: the zone of a hole is the first that reaches it, found by walking on.
    while (this.z < zones.length && !(h <= zones[this.z].to + EPS)) this.z++;
    // The end rivets' shares run to the line's ends: what lies beyond them is theirs too.
    const lo = k === 0 ? along[0] : h - (h - pos[k - 1]) / 2;
    const hi = k === pos.length - 1 ? along[along.length - 1] : h + (pos[k + 1] - h) / 2;
    const tributaryIn = hi - lo;
    // maxOver(lo, hi), the stations bracketing the share found once for the tension and the shear
    const first = Math.max(0, this.fromAt.after(lo) - 1);
    const last = Math.min(n - 1, this.toAt.after(hi));
    const t = tension.maxBetween(first, last) * tributaryIn;
    const v = noShear ? 0 : shear.maxBetween(first, last) * tributaryIn;
    this.zone = this.z < zones.length ? this.z : 0;
    this.tributaryIn = tributaryIn;
    this.tension = t;
    this.shear = v;
    this.msLimit = marginOf(t, v, c.tl, c.sl);
    this.msUltimate = marginOf(UF * t, UF * v, c.tu, c.su);
    this.after = this.holeAt.after(h);
  }
}

/** The worst hole of a zone as its report states it. */
interface WorstHole {
  index: number;
  position: number;
  after: number;
  tension: number;
  shear: number;
  msLimit: number;
  msUltimate: number;
}

/**
 * The holes of a schedule, worked out without making an object of each: how many, how many have a
 * negative margin and the first of them, and per zone its holes and the one with the lowest margin (the
 * first of equals). `objects` works them out again as a result states them (the rib study keeps the
 * holes of one candidate only).
 */
export class HoleSet {
  readonly count: number;
  /** holes with a negative margin, and the index of the first (−1 for none) */
  readonly failing: number;
  readonly firstFailing: number;
  readonly zoneCount: number[];
  readonly zoneWorst: (WorstHole | null)[];
  private readonly width: number;

  constructor(
    readonly positions: number[],
    private readonly zones: Zone[],
    private readonly lineData: PreparedLine,
    private readonly prefix: string,
    private readonly c: Capacity,
  ) {
    const count = positions.length;
    this.count = count;
    this.width = count > 99 ? 3 : 2;
    this.zoneCount = new Array<number>(zones.length).fill(0);
    this.zoneWorst = new Array<WorstHole | null>(zones.length).fill(null);
    let failing = 0;
    let firstFailing = -1;
    const walk = new HoleWalk(positions, zones, lineData, c);
    for (let k = 0; k < count; k++) {
      walk.step(k);
      const lowest = lowerMargin(walk.msLimit, walk.msUltimate);
      if (lowest < -EPS) {
        if (failing === 0) firstFailing = k;
        failing++;
      }
      const z = walk.zone;
      this.zoneCount[z]++;
      let worst = this.zoneWorst[z];
      if (worst === null || lowest < lowerMargin(worst.msLimit, worst.msUltimate)) {
        // one record a zone, written over by each new worst
        worst ??= this.zoneWorst[z] = {
          index: 0,
          position: NaN,
          after: 0,
          tension: NaN,
          shear: NaN,
          msLimit: NaN,
          msUltimate: NaN,
        };
        worst.index = k;
        worst.position = positions[k];
        worst.after = walk.after;
        worst.tension = walk.tension;
        worst.shear = walk.shear;
        worst.msLimit = walk.msLimit;
        worst.msUltimate = walk.msUltimate;
      }
    }
    this.failing = failing;
    this.firstFailing = firstFailing;
  }

  id(k: number): string {
    return `${this.prefix}-${String(k + 1).padStart(this.width, '0')}`;
  }

  stationAt(position: number, after: number): number {
    return this.lineData.station.atIndex(position, after);
  }

  /**
   * The holes as a schedule states them; with `line` null, without the line's name on each (the rib study
   * says it once), and with every number through `round` (the rib study stores them to 4 decimals).
   */
  objects(line: string, round?: (v: number) => number): ScheduleHole[];
  objects(line: null, round?: (v: number) => number): Omit<ScheduleHole, 'line'>[];
  objects(line: string | null, round: (v: number) => number = asIs): (ScheduleHole | Omit<ScheduleHole, 'line'>)[] {
    // Without the line: the rib study's one kept candidate, not a hot path, so the name is taken off
    // afterwards (the rest keep their order) rather than spelled out in another pair of literals.
    if (line === null) return this.objects('', round).map(({ line: _line, ...hole }) => hole);
    const { x, y } = this.lineData;
    const holes: ScheduleHole[] = new Array(this.count);
    const walk = new HoleWalk(this.positions, this.zones, this.lineData, this.c);
    for (let k = 0; k < this.count; k++) {
      walk.step(k);
      const p = this.positions[k];
      const after = walk.after;
      const id = this.id(k);
      const stationIn = round(this.stationAt(p, after));
      const alongIn = round(p);
      const zone = round(walk.zone);
      const tributaryIn = round(walk.tributaryIn);
      const t = walk.tension;
      const appliedLimitLb = round(t);
      const appliedUltimateLb = round(UF * t);
      const appliedLimitShearLb = round(walk.shear);
      const ms = marginOrNull(walk.msLimit);
      const msLimit = ms === null ? null : round(ms);
      const mu = marginOrNull(walk.msUltimate);
      const msUltimate = mu === null ? null : round(mu);
      // Literals rather than a spread (each skin panel schedules every line for every candidate): one
      // shape per kind of line, and the same key order every way.
      holes[k] =
        x && y
          ? {
              id,
              line,
              stationIn,
              alongIn,
              xIn: round(x.atIndex(p, after)),
              yIn: round(y.atIndex(p, after)),
              zone,
              tributaryIn,
              appliedLimitLb,
              appliedUltimateLb,
              appliedLimitShearLb,
              msLimit,
              msUltimate,
            }
          : {
              id,
              line,
              stationIn,
              alongIn,
              zone,
              tributaryIn,
              appliedLimitLb,
              appliedUltimateLb,
              appliedLimitShearLb,
              msLimit,
              msUltimate,
            };
    }
    return holes;
  }
}

/** Per zone: its holes, and the one with the lowest margin (the first of equals). */
function reportZones(zones: Zone[], holes: HoleSet, lineData: PreparedLine, c: Capacity): ScheduleZone[] {
  const reports: ScheduleZone[] = new Array(zones.length);
  for (let i = 0; i < zones.length; i++) {
    const z = zones[i];
    const w = holes.zoneWorst[i];
    const t = w ? w.tension : 0;
    reports[i] = {
      fromIn: lineData.station.at(z.from),
      toIn: lineData.station.at(z.to),
      fromAlongIn: z.from,
      toAlongIn: z.to,
      pitchIn: z.pitch,
      count: holes.zoneCount[i],
      worstStationIn: w ? holes.stationAt(w.position, w.after) : lineData.station.at((z.from + z.to) / 2),
      worstHoleId: w ? holes.id(w.index) : null,
      appliedLimitLb: t,
      appliedUltimateLb: w ? UF * t : 0,
      limitAllowableLb: c.tl,
      ultimateAllowableLb: c.tu,
      appliedLimitShearLb: w ? w.shear : 0,
      msLimit: w ? marginOrNull(w.msLimit) : null,
      msUltimate: w ? marginOrNull(w.msUltimate) : null,
    };
  }
  return reports;
}
