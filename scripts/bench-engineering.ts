/**
 * Benchmark of the engineering core: the time for one whole rib study (all flight conditions, six
 * gauges × three rivet sizes) at 40, 80, 160 and 320 panels; within it the flow solution (influence
 * matrix, one LU factorisation, two solves serving every condition); and the LU factorisation on its
 * own with its fitted O(N³) constant; the rib study as a ratio to that LU (target ≤ 3×); and the demo kit's
 * whole wing (ten ribs at their stations, eighteen skin panels; target under a second). Medians of several
 * runs after a warm-up.
 *
 *   npx tsx scripts/bench-engineering.ts            (npm run bench:engineering)
 */
import {
  buildAirfoil,
  luFactor,
  ribStudy,
  solvePanelMethod,
  wingStudy,
  type RibStudyInput,
  type WingStudyInput,
} from '../server/engineering';
import { DEMO_ENGINE_COUPONS, DEMO_STUDY_INPUTS, DEMO_WING_INPUTS } from '../server/dev/demo-inputs';

const WARM_UP = 5;
const RUNS = 21;
const TARGET_MS = 100;
/** the rib study at 160 panels against the LU factorisation of its own size, in the same run */
const TARGET_LU_RATIO = 3;
/** A ten-rib wing with its skin panels: under a second; fewer runs (each is a few hundred ms). */
const WING_TARGET_MS = 1000;
const WING_RUNS = 7;

/**
 * A light two-seat kit's inner wing rib, a typical case: the demo's rib study (same kit weight and area,
 * material, gauges, pitch steps and zones) on a 58 in NACA 23015 rib of a slower kit (45 / 110 KEAS),
 * 14.5 in rib spacing, flange lines 1 % to 98 % of the chord, three pulled rivets up to 16 diameters apart.
 */
const study = (panels: number): RibStudyInput => ({
  ...DEMO_STUDY_INPUTS,
  kit: { ...DEMO_STUDY_INPUTS.kit, meanChordIn: 58, stallSpeedKeas: 45, cruiseSpeedKeas: 110 },
  airfoil: { kind: 'naca', designation: '23015' },
  rib: { chordIn: 58, spacingIn: 14.5, flangeWidthIn: 0.75, skinGaugeIn: 0.025 },
  lines: [
    { name: 'upper', surface: 'upper', startXc: 0.01, endXc: 0.98 },
    { name: 'lower', surface: 'lower', startXc: 0.01, endXc: 0.98 },
  ],
  rivetCandidates: ['PULLED-4', 'PULLED-5', 'PULLED-6'],
  maxPitchDiameters: 16,
  panels,
  coupons: DEMO_ENGINE_COUPONS,
});

function medianMs(run: () => void, runs = RUNS): number {
  for (let i = 0; i < WARM_UP; i++) run();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

/**
 * A study's time against the LU factorisation of the same size measured in the same run: the
 * factorisation is the one step that must grow as n³, and everything else should cost a small multiple
 * of it, whatever the machine.
 */
function luRatioLine(label: string, studyMs: number, luMs: number, target: number): string {
  const ratio = studyMs / luMs;
  return `${label} / LU factor at 160 panels: ${ratio.toFixed(1)}× (target ≤ ${target}×): ${ratio <= target ? 'met' : 'NOT met'}`;
}

/** A well-conditioned dense matrix of the panel system's size (N panels → N + 2 unknowns). */
function testMatrix(n: number): Float64Array {
  const a = new Float64Array(n * n);
  let seed = 12345;
  for (let i = 0; i < a.length; i++) {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    a[i] = seed / 2147483648 - 0.5;
  }
  for (let i = 0; i < n; i++) a[i * n + i] += n;
  return a;
}

const result = ribStudy(study(160));
const panelCounts = [40, 80, 160, 320];
const rows = panelCounts.map((panels) => {
  const input = study(panels);
  const studyMs = medianMs(() => ribStudy(input));
  const geometry = buildAirfoil(input.airfoil, panels);
  const flowMs = medianMs(() => solvePanelMethod(geometry.points, geometry.leadingEdgeIndex));
  const n = panels + 2;
  const a = testMatrix(n);
  const luMs = medianMs(() => luFactor(a, n));
  return { panels, unknowns: n, studyMs, flowMs, luMs };
});

// Least-squares fit of t = c·n³ to the LU times.
const c = rows.reduce((s, r) => s + r.luMs * r.unknowns ** 3, 0) / rows.reduce((s, r) => s + r.unknowns ** 6, 0);

console.log(
  `engineering core benchmark (median of ${RUNS} runs after ${WARM_UP} warm-up runs; Node ${process.version})`,
);
console.log(
  `rib study: ${result.conditions.length} conditions, ${result.candidates.length} gauge × rivet candidates, ${result.lines.length} fastener lines\n`,
);
console.log('panels  unknowns  rib study (ms)  flow solution (ms)  LU factor (ms)  LU fit c·n³ (ms)');
for (const r of rows) {
  console.log(
    [
      String(r.panels).padStart(6),
      String(r.unknowns).padStart(8),
      r.studyMs.toFixed(2).padStart(14),
      r.flowMs.toFixed(2).padStart(18),
      r.luMs.toFixed(3).padStart(14),
      (c * r.unknowns ** 3).toFixed(3).padStart(16),
    ].join('  '),
  );
}
console.log(
  `(the rest of the study: loads, ${result.candidates.length * result.lines.length} line schedules and the trade table, hardly depends on the panel count)`,
);
console.log(
  `\nLU constant: t ≈ ${(c * 1e6).toFixed(3)} ns × n³ (${(2 / 3 / (c * 1e6)).toFixed(2)} GFLOP/s at 2n³/3 flops)`,
);
const at160 = rows.find((r) => r.panels === 160)!;
console.log(
  `rib study at 160 panels: ${at160.studyMs.toFixed(1)} ms (target well under ${TARGET_MS} ms): ${at160.studyMs < TARGET_MS / 2 ? 'met' : 'NOT met'}`,
);
console.log(luRatioLine('rib study', at160.studyMs, at160.luMs, TARGET_LU_RATIO));
// The demo kit's whole wing: ten ribs each at its own station, eighteen skin panels (the seed's study).
const wingInput = {
  ...DEMO_WING_INPUTS,
  coupons: DEMO_ENGINE_COUPONS,
} as WingStudyInput;
const wing = wingStudy(wingInput);
const wingMs = medianMs(() => wingStudy(wingInput), WING_RUNS);
console.log(
  `whole wing, ${wing.ribs.length} ribs and ${wing.skins.length} skin panels (${wing.work.candidates} rib candidates, ${wing.work.skinSchedules} skin line schedules): ` +
    `${wingMs.toFixed(0)} ms (target under ${WING_TARGET_MS} ms): ${wingMs < WING_TARGET_MS ? 'met' : 'NOT met'}`,
);
console.log(
  `recommended: ${result.recommended ? `${result.recommended.gaugeIn} in with ${result.recommended.rivet}` : 'none feasible'}`,
);
