import { combinedMargin, jointAllowables, type JointAllowables } from './allowables';
import type { CouponTest } from './coupons';
import { EngineeringInputError } from './errors';
import { layoutRules, layoutRuleText } from './layout';
import { findRivet, type RivetSpec, type SheetMaterial } from './materials';
import { ENGINEERING_CAUTION, type EngineeringResult } from './result';
import { ULTIMATE_FACTOR } from './rivet-loads';
import { prepareStations, StationCursor, type PreparedLine, type StationLoad } from './station-loads';
import { STUDY_BUDGET, requireStudyBound } from './bounds';
import { coarsenRuns, groupIntoZones, placeHoles, type Zone } from './zoning';

export { prepareStations, type PreparedLine, type StationLoad } from './station-loads';

/**
 * The pitch schedule of one fastener line (step 7 of the chain): the pitch each station needs, clamped
 * to the layout rules and rounded down to a practical increment; the stations grouped into a few zones
 * whose pitch never exceeds what any station in the zone needs; holes placed from the line's ends at the
 * edge distance; and, per zone, the worst rivet's loads, allowables and margins.
 */

/** The supplier's layout choices for a line. */
export interface ScheduleSettings {
  /** largest pitch, in rivet diameters (typically 8 to 10) */
  maxPitchDiameters: number;
  pitchIncrementIn: number;
  maxZones: number;
}

/**
 * What every study that schedules candidates takes beside its loads: the sheet, the gauge × rivet
 * candidates, the layout, the build-time proxy, and the supplier's coupons and catalogue data.
 */
export interface CandidateSettings extends ScheduleSettings {
  material: string;
  gaugeCandidates: number[];
  rivetCandidates: string[];
  /** build-time proxy; 1.5 min per solid rivet and 1.0 per pulled rivet when absent */
  minutesPerHole?: number;
  coupons?: CouponTest[];
  pullThroughFallbackFraction?: number;
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface PitchScheduleInput extends ScheduleSettings {
  line: string;
  /** hole id prefix, "U" gives U-01, U-02…; from the line name when absent */
  holePrefix?: string;
  stations: StationLoad[];
  material: string;
  gaugeIn: number;
  rivetSpec: string;
  coupons?: CouponTest[];
  pullThroughFallbackFraction?: number;
  materialData?: SheetMaterial[];
  rivetData?: RivetSpec[];
}

export interface ScheduleZone {
  fromIn: number;
  toIn: number;
  fromAlongIn: number;
  toAlongIn: number;
  pitchIn: number;
  count: number;
  worstStationIn: number;
  worstHoleId: string | null;
  appliedLimitLb: number;
  appliedUltimateLb: number;
  limitAllowableLb: number;
  ultimateAllowableLb: number;
  appliedLimitShearLb: number;
  msLimit: number | null;
  msUltimate: number | null;
}

export interface ScheduleHole {
  id: string;
  line: string;
  stationIn: number;
  alongIn: number;
  xIn?: number;
  yIn?: number;
  zone: number;
  tributaryIn: number;
  appliedLimitLb: number;
  appliedUltimateLb: number;
  appliedLimitShearLb: number;
  msLimit: number | null;
  msUltimate: number | null;
}

export interface InsufficientRange {
  fromIn: number;
  toIn: number;
  /** the pitch the worst station there would need, in (below the 3D minimum) */
  neededPitchIn: number;
}

export interface AllowableSummary {
  tensionLimitLb: number;
  tensionUltimateLb: number;
  tensionBasis: 'coupons' | 'fallback';
  tensionGoverning: string;
  shearLimitLb: number;
  shearUltimateLb: number;
  shearGoverning: string;
}

export interface PitchScheduleResult extends EngineeringResult<PitchScheduleInput> {
  line: string;
  rivetSpec: string;
  drill: { name: string; diameterIn: number };
  gaugeIn: number;
  feasible: boolean;
  reasons: string[];
  lengthIn: number;
  layout: { edgeDistanceIn: number; minPitchIn: number; maxPitchIn: number; pitchIncrementIn: number };
  allowables: AllowableSummary;
  zones: ScheduleZone[];
  holes: ScheduleHole[];
  insufficient: InsufficientRange[];
}

const EPS = 1e-9;
/** read once: an imported binding read in the hot loop costs a getter call once compiled to CommonJS (tsx, jest) */
const UF = ULTIMATE_FACTOR;

export function validateScheduleSettings(s: ScheduleSettings, rivetDiameterIn: number): void {
  const maxD = requireStudyBound(s.maxPitchDiameters, 'maxPitchDiameters');
  const inc = requireStudyBound(s.pitchIncrementIn, 'pitchIncrementIn');
  const maxPitch = maxD * rivetDiameterIn;
  if (inc > maxPitch + EPS) {
    throw new EngineeringInputError('pitchIncrementIn', `the pitch increment (${inc} in) is larger than the maximum pitch (${maxPitch.toFixed(3)} in)`);
  }
  requireStudyBound(s.maxZones, 'maxZones');
}

/**
 * Pitches tried for a rivet: every multiple of the increment from the maximum pitch down to just above
 * the 3D minimum, then the minimum itself. The loop that builds it runs this many times.
 */
export function pitchGridSize(s: Pick<ScheduleSettings, 'maxPitchDiameters' | 'pitchIncrementIn'>, rivetDiameterIn: number): number {
  return Math.max(0, Math.floor((s.maxPitchDiameters * rivetDiameterIn) / s.pitchIncrementIn + EPS)) + 1;
}

/** Refuses an increment so fine that the pitch grid of the largest rivet outgrows the budget. */
export function requirePitchGrid(s: ScheduleSettings, largestRivetDiameterIn: number): number {
  const size = pitchGridSize(s, largestRivetDiameterIn);
  if (size > STUDY_BUDGET.pitchGrid) {
    const coarsest = (s.maxPitchDiameters * largestRivetDiameterIn) / (STUDY_BUDGET.pitchGrid - 1);
    throw new EngineeringInputError(
      'pitchIncrementIn',
      `an increment of ${s.pitchIncrementIn} in makes ${size.toLocaleString('en-US')} pitches to try up to ${s.maxPitchDiameters}D of a ${largestRivetDiameterIn.toFixed(3)} in rivet; at most ${STUDY_BUDGET.pitchGrid}: use an increment of at least ${(Math.ceil(coarsest * 1000) / 1000).toFixed(3)} in`,
    );
  }
  return size;
}

/** Load per inch of pitch relative to the allowables: pitch × demand ≤ 1 passes. Infinity for a zero allowable. */
function demand(tension: number, shear: number, tensionAllowable: number, shearAllowable: number): number {
  const rt = tension > 0 ? (tensionAllowable > 0 ? tension / tensionAllowable : Infinity) : 0;
  const rs = shear > 0 ? (shearAllowable > 0 ? shear / shearAllowable : Infinity) : 0;
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

type AllowablesInput = Pick<PitchScheduleInput, 'material' | 'gaugeIn' | 'rivetSpec' | 'coupons' | 'pullThroughFallbackFraction' | 'materialData' | 'rivetData'>;

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
export function pitchSchedule(input: PitchScheduleInput, prepared?: PreparedLine, allowables?: JointAllowables): PitchScheduleResult {
  const rivet = findRivet(input.rivetSpec, input.rivetData);
  const layout = layoutRules(rivet);
  validateScheduleSettings(input, layout.diameterIn);
  requirePitchGrid(input, layout.diameterIn);
  const lineData = prepared ?? prepareStations(input.stations);
  const allow = allowables ?? scheduleAllowables(input);
  const rules = [
    'per-rivet load = largest pull per inch over the rivet\'s share of the line × its share (half the gap to each neighbour; an end rivet\'s share runs on to the line\'s end)',
    'required pitch: limit load ≤ limit allowable and 1.5 × limit load ≤ ultimate allowable (14 CFR 23.303, 23.305)',
    `${layoutRuleText(rivet.countersunk)}; pitch ≤ ${input.maxPitchDiameters}D; rounded down to ${input.pitchIncrementIn} in (the 3D minimum itself is allowed)`,
    `at most ${input.maxZones} zones; each zone's pitch is the smallest any of its stations needs; a zone is added only if it saves a rivet`,
    ...allow.rules,
  ];
  const warnings = [...allow.warnings];
  const reasons: string[] = [];
  const line = input.line;
  const prefix = input.holePrefix ?? holePrefixFor(line);
  const { stations, along, lengthIn } = lineData;

  const { tension: ta, shear: sa } = allow;
  const cap: Capacity = { tl: ta.limitLb, tu: ta.ultimateLb, sl: sa.limitLb, su: sa.ultimateLb };

  const minPitch = layout.minPitchIn;
  const maxPitch = input.maxPitchDiameters * layout.diameterIn;
  const inc = input.pitchIncrementIn;
  const grid: number[] = [];
  for (let k = Math.floor(maxPitch / inc + EPS); k * inc > minPitch + EPS; k--) grid.push(k * inc);
  grid.push(minPitch);

  const { needPitch, shortPitch } = stationNeeds(lineData, grid, cap);
  const n = along.length;

  // The end rivets carry more than a pitch: the first carries the pull from the line's start, the edge
  // distance ahead of it, as well as half the gap behind it (the last, mirrored). Their share is
  // edge + p/2, which is more than p wherever p < 2·edge; the stretch the first (last) gap spans is held
  // to the largest pitch at which the end rivet carries that share.
  const edge = layout.minEdgeIn;
  const endNeeds = [endNeed('first', lineData, grid, edge, cap), endNeed('last', lineData, grid, edge, cap)];
  const twoEnds = lengthIn >= 2 * edge + minPitch - EPS;
  if (twoEnds) {
    const [first, final] = endNeeds;
    // how far from each end the end rivet's pitch holds: its gap, the edge distance and a station spacing
    const firstTo = along[0] + (edge + first.pitch + lineData.spacingIn);
    const lastFrom = along[n - 1] - (edge + final.pitch + lineData.spacingIn);
    for (let i = 0; i < n; i++) {
      if (along[i] <= firstTo && first.pitch < needPitch[i]) needPitch[i] = first.pitch;
      if (along[i] >= lastFrom && final.pitch < needPitch[i]) needPitch[i] = final.pitch;
    }
    for (const e of endNeeds) {
      if (!e.passes) {
        reasons.push(
          `the ${e.end} rivet carries the pull over the ${edge.toFixed(3)} in edge distance beyond it as well as half the gap to its neighbour: even at the ${minPitch.toFixed(3)} in (3D) minimum it is overloaded: ${input.gaugeIn} in with ${rivet.code} is insufficient`,
        );
      }
    }
  }

  const insufficient = insufficientRanges(stations, shortPitch);
  for (const r of insufficient) {
    reasons.push(
      `from station ${r.fromIn.toFixed(2)} to ${r.toIn.toFixed(2)} in the rivet would need a pitch of ${r.neededPitchIn.toFixed(3)} in, below the ${minPitch.toFixed(3)} in (3D) minimum: ${input.gaugeIn} in with ${rivet.code} is insufficient`,
    );
  }
  if (ta.limitLb <= 0 || ta.ultimateLb <= 0) reasons.push(`the pull-through allowable of ${input.gaugeIn} in ${allow.material} with ${rivet.code} is zero by its coupons`);

  const runs = pitchRuns(along, needPitch);
  const coarse = coarsenRuns(runs);
  if (coarse.merged) {
    warnings.push(`the needed pitch changes ${runs.length} times along ${line}: neighbouring stretches were merged, each keeping the tighter pitch, before zoning`);
  }
  const zones = groupIntoZones(coarse.runs, input.maxZones);

  const start = along[0] + edge;
  const end = along[n - 1] - edge;
  const placed = placeHoles(zones, start, end, minPitch);
  if (placed.positions.length === 0) reasons.push(`the line (${lengthIn.toFixed(3)} in) is shorter than twice the ${edge.toFixed(3)} in edge distance`);
  if (placed.note) warnings.push(placed.note);

  const holes = scheduleHoles(placed.positions, zones, lineData, line, prefix, cap);
  const failing = holes.filter((h) => lowestMargin(h) < -EPS);
  if (failing.length > 0 && insufficient.length === 0) {
    reasons.push(`${failing.length} rivet(s) have a negative margin of safety (first ${failing[0].id})`);
  }
  const zoneReports = reportZones(zones, holes, lineData, cap);

  // Spelled out rather than `...envelope(…)` followed by more fields: V8 builds such a literal some 50
  // times slower, and a rib study makes one per candidate and line.
  return {
    inputs: input,
    rules,
    warnings,
    caution: ENGINEERING_CAUTION,
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
    holes,
    insufficient,
  };
}

/*
 * The helpers below are module functions, not closures made inside the schedule: tsx (which runs the
 * benchmark) compiles with esbuild's keepNames, which names every closure as it is made (a
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

/** Whether station i passes at grid pitch g, with the windows of every pitch. */
function passesAt(grid: number[], tension: Float64Array[], shear: Float64Array[], c: Capacity, i: number, g: number): boolean {
  return passes(grid[g], tension[g][i], shear[g][i], c);
}

/**
 * The pitch every station needs: the longest on the grid (longest first, the 3D minimum last) that
 * carries the largest load within its reach. Where not even the minimum does, the pitch it would need
 * is kept in `shortPitch` (NaN elsewhere). This is the hot loop of a study (every station of every line
 * for every candidate): typed arrays, and no object per station.
 */
function stationNeeds(lineData: PreparedLine, grid: number[], c: Capacity): { needPitch: Float64Array; shortPitch: Float64Array } {
  const n = lineData.along.length;
  const last = grid.length - 1;
  const tension: Float64Array[] = [];
  const shear: Float64Array[] = [];
  for (const p of grid) {
    const w = lineData.windowMax(p);
    tension.push(w.tension);
    shear.push(w.shear);
  }
  const needPitch = new Float64Array(n);
  const shortPitch = new Float64Array(n).fill(NaN);
  let hint = last >> 1;
  for (let i = 0; i < n; i++) {
    // Passing is monotone in the pitch (a longer pitch carries more, over a wider window), so the first
    // passing grid index is found by bisection. Neighbouring stations mostly need the same pitch: the
    // previous station's answer is tried first, which takes one or two checks instead of a bisection.
    let lo: number;
    let hi: number;
    if (passesAt(grid, tension, shear, c, i, hint)) {
      if (hint === 0 || !passesAt(grid, tension, shear, c, i, hint - 1)) {
        needPitch[i] = grid[hint];
        continue;
      }
      lo = 0;
      hi = hint - 1;
    } else {
      lo = Math.min(hint + 1, last);
      hi = last;
    }
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (passesAt(grid, tension, shear, c, i, mid)) hi = mid;
      else lo = mid + 1;
    }
    hint = lo;
    needPitch[i] = grid[lo];
    if (!passesAt(grid, tension, shear, c, i, lo)) {
      const w = tension[last][i];
      const q = shear[last][i];
      shortPitch[i] = 1 / Math.max(demand(w, q, c.tl, c.sl), UF * demand(w, q, c.tu, c.su));
    }
  }
  return { needPitch, shortPitch };
}

/** The longest pitch on the grid at which an end rivet carries its share: the edge distance and half a gap. */
function endNeed(end: 'first' | 'last', lineData: PreparedLine, grid: number[], edge: number, c: Capacity): { end: 'first' | 'last'; pitch: number; passes: boolean } {
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
  const { along, tension, shear } = lineData;
  const a0 = along[0];
  const a1 = along[along.length - 1];
  const share = edge + pitch / 2;
  const lo = end === 'first' ? a0 : Math.max(a0, a1 - share);
  const hi = end === 'first' ? Math.min(a1, a0 + share) : a1;
  return passes(share, tension.maxOver(lo, hi), shear.maxOver(lo, hi), c);
}

/** Neighbouring stations that not even the minimum pitch carries, as ranges with the pitch they would need. */
function insufficientRanges(stations: StationLoad[], shortPitch: Float64Array): InsufficientRange[] {
  const ranges: InsufficientRange[] = [];
  for (let i = 0; i < shortPitch.length; i++) {
    if (Number.isNaN(shortPitch[i])) continue;
    const range = ranges[ranges.length - 1];
    if (range && i > 0 && !Number.isNaN(shortPitch[i - 1])) {
      range.toIn = stations[i].stationIn;
      range.neededPitchIn = Math.min(range.neededPitchIn, shortPitch[i]);
    } else ranges.push({ fromIn: stations[i].stationIn, toIn: stations[i].stationIn, neededPitchIn: shortPitch[i] });
  }
  return ranges;
}

/** Stretches of one needed pitch; each station stands for the line halfway to its neighbours. */
function pitchRuns(along: number[], needPitch: Float64Array): Zone[] {
  const n = along.length;
  const runs: Zone[] = [];
  for (let i = 0; i < n; i++) {
    const from = i === 0 ? along[0] : (along[i - 1] + along[i]) / 2;
    const to = i === n - 1 ? along[i] : (along[i] + along[i + 1]) / 2;
    const run = runs[runs.length - 1];
    if (run && Math.abs(run.pitch - needPitch[i]) < EPS) run.to = to;
    else runs.push({ from, to, pitch: needPitch[i] });
  }
  return runs;
}

/** Each hole with its share of the line, the largest loads over that share and its margins. */
function scheduleHoles(pos: number[], zones: Zone[], lineData: PreparedLine, line: string, prefix: string, c: Capacity): ScheduleHole[] {
  const { along, tension, shear, station, x, y } = lineData;
  const n = along.length;
  // Every load and position is sampled at the same stations, and the holes ascend: a cursor each for the
  // shares' starts, their ends and the holes finds them among the stations in a step or two.
  const fromAt = new StationCursor(along);
  const toAt = new StationCursor(along);
  const holeAt = new StationCursor(along);
  const width = pos.length > 99 ? 3 : 2;
  const holes: ScheduleHole[] = [];
  // Positions and zones both ascend: the zone of a hole is the first that reaches it, found by walking on.
  let z = 0;
  for (let k = 0; k < pos.length; k++) {
    const h = pos[k];
    while (z < zones.length && !(h <= zones[z].to + EPS)) z++;
    // The end rivets' shares run to the line's ends: what lies beyond them is theirs too.
    const lo = k === 0 ? along[0] : h - (h - pos[k - 1]) / 2;
    const hi = k === pos.length - 1 ? along[along.length - 1] : h + (pos[k + 1] - h) / 2;
    const tributaryIn = hi - lo;
    // maxOver(lo, hi), the stations bracketing the share found once for the tension and the shear
    const first = Math.max(0, fromAt.after(lo) - 1);
    const last = Math.min(n - 1, toAt.after(hi));
    const t = tension.maxBetween(first, last) * tributaryIn;
    const v = shear.maxBetween(first, last) * tributaryIn;
    const id = `${prefix}-${String(k + 1).padStart(width, '0')}`;
    const after = holeAt.after(h);
    const stationIn = station.atIndex(h, after);
    const zone = z < zones.length ? z : 0;
    const msLimit = combinedMargin(t, v, c.tl, c.sl);
    const msUltimate = combinedMargin(UF * t, UF * v, c.tu, c.su);
    // Two literals rather than a spread: one shape per kind of line, and the same key order either way.
    holes.push(
      x && y
        ? { id, line, stationIn, alongIn: h, xIn: x.atIndex(h, after), yIn: y.atIndex(h, after), zone, tributaryIn, appliedLimitLb: t, appliedUltimateLb: UF * t, appliedLimitShearLb: v, msLimit, msUltimate }
        : { id, line, stationIn, alongIn: h, zone, tributaryIn, appliedLimitLb: t, appliedUltimateLb: UF * t, appliedLimitShearLb: v, msLimit, msUltimate },
    );
  }
  return holes;
}

const lowestMargin = (h: ScheduleHole) => Math.min(h.msLimit ?? Infinity, h.msUltimate ?? Infinity);

/** Per zone: its holes, and the one with the lowest margin (the first of equals), in one pass over the holes. */
function reportZones(zones: Zone[], holes: ScheduleHole[], lineData: PreparedLine, c: Capacity): ScheduleZone[] {
  const count = new Array<number>(zones.length).fill(0);
  const worstOf = new Array<ScheduleHole | null>(zones.length).fill(null);
  for (const h of holes) {
    count[h.zone]++;
    const w = worstOf[h.zone];
    if (w === null || lowestMargin(h) < lowestMargin(w)) worstOf[h.zone] = h;
  }
  return zones.map((z, i) => {
    const worst = worstOf[i];
    return {
      fromIn: lineData.station.at(z.from),
      toIn: lineData.station.at(z.to),
      fromAlongIn: z.from,
      toAlongIn: z.to,
      pitchIn: z.pitch,
      count: count[i],
      worstStationIn: worst ? worst.stationIn : lineData.station.at((z.from + z.to) / 2),
      worstHoleId: worst ? worst.id : null,
      appliedLimitLb: worst ? worst.appliedLimitLb : 0,
      appliedUltimateLb: worst ? worst.appliedUltimateLb : 0,
      limitAllowableLb: c.tl,
      ultimateAllowableLb: c.tu,
      appliedLimitShearLb: worst ? worst.appliedLimitShearLb : 0,
      msLimit: worst ? worst.msLimit : null,
      msUltimate: worst ? worst.msUltimate : null,
    };
  });
}
