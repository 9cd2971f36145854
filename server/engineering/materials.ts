import { EngineeringInputError } from './errors';
import type { RivetSpec, SheetMaterial } from '../../lib/engineering-results';

/**
 * Sheet materials and rivets the core knows by name. A supplier may pass its own entries (same shape)
 * in a study's `materialData` / `rivetData`; they take precedence over these. Every entry says where its
 * numbers come from: several are as remembered from MMPDS / MIL-HDBK-5 or are typical trade values, and
 * must be checked against the supplier's approved data before they carry a design.
 */

export const MATERIALS: SheetMaterial[] = [
  {
    key: '6061-T6',
    description: '6061-T6 sheet, 0.010–0.249 in',
    ftuPsi: 42000,
    ftyPsi: 36000,
    fsuPsi: 27000,
    fbruPsi: { e15: 67000, e20: 88000 },
    fbryPsi: { e15: 50000, e20: 58000 },
    densityLbPerIn3: 0.098,
    fcyPsi: 35000,
    compressiveModulusPsi: 10.1e6,
    poissonRatio: 0.33,
    source: "MMPDS / MIL-HDBK-5 S-basis, values from memory: verify against the supplier's approved data",
  },
  {
    key: '2024-T3',
    description: '2024-T3 bare sheet, 0.010–0.128 in',
    ftuPsi: 64000,
    ftyPsi: 47000,
    fsuPsi: 39000,
    fbruPsi: { e15: 104000, e20: 129000 },
    fbryPsi: { e15: 73000, e20: 88000 },
    densityLbPerIn3: 0.1,
    fcyPsi: 39000,
    compressiveModulusPsi: 10.7e6,
    poissonRatio: 0.33,
    source: "MMPDS / MIL-HDBK-5 A-basis, values from memory: verify against the supplier's approved data",
  },
];

/** Stock sheet gauges of the trade, in (common practice). */
export const STOCK_GAUGES_IN = [0.016, 0.02, 0.025, 0.032, 0.04, 0.05, 0.063];

const AD_FSU_PSI = 30000;
const AD_SOURCE =
  'MS20470/MS20426 2117-T4 (AD), driven F_su 30 ksi on the MIL-HDBK-5 Table 8.1.2 hole diameters (F_su from memory)';
const PULLED_SOURCE =
  "generic aluminium-body pulled (blind) rivet with a steel mandrel: typical catalogue-order strengths (common practice), not a standard's values: enter the supplier's approved data";

// Nominal size, the hole the strength tables use, and the drill of common practice.
const SIZES = [
  { dash: 3, label: '3/32', d: 3 / 32, hole: 0.096, drill: { name: '#40', diameterIn: 0.098 } },
  { dash: 4, label: '1/8', d: 1 / 8, hole: 0.1285, drill: { name: '#30', diameterIn: 0.1285 } },
  { dash: 5, label: '5/32', d: 5 / 32, hole: 0.159, drill: { name: '#21', diameterIn: 0.159 } },
  { dash: 6, label: '3/16', d: 3 / 16, hole: 0.191, drill: { name: '#11', diameterIn: 0.191 } },
  { dash: 8, label: '1/4', d: 1 / 4, hole: 0.257, drill: { name: 'F', diameterIn: 0.257 } },
];

// Pulled rivets (lb): the dash-4 tension of about 150 lb is the figure of the trade; the other sizes
// follow it roughly by diameter squared.
const PULLED_STRENGTH: Record<number, { shearLb: number; tensionLb: number }> = {
  3: { shearLb: 70, tensionLb: 90 },
  4: { shearLb: 120, tensionLb: 150 },
  5: { shearLb: 190, tensionLb: 230 },
  6: { shearLb: 260, tensionLb: 320 },
};

export const RIVETS: RivetSpec[] = [
  ...SIZES.map((s): RivetSpec => ({
    code: `MS20470AD${s.dash}`,
    description: `solid rivet, universal head, 2117-T4, ${s.label} in`,
    kind: 'solid',
    family: 'MS20470AD',
    dash: s.dash,
    countersunk: false,
    nominalDiameterIn: s.d,
    holeDiameterIn: s.hole,
    drill: s.drill,
    fsuPsi: AD_FSU_PSI,
    densityLbPerIn3: 0.099,
    source: AD_SOURCE,
  })),
  ...SIZES.filter((s) => s.dash <= 6).map((s): RivetSpec => ({
    code: `MS20426AD${s.dash}`,
    description: `solid rivet, 100° countersunk head, 2117-T4, ${s.label} in`,
    kind: 'solid',
    family: 'MS20426AD',
    dash: s.dash,
    countersunk: true,
    nominalDiameterIn: s.d,
    holeDiameterIn: s.hole,
    drill: s.drill,
    fsuPsi: AD_FSU_PSI,
    densityLbPerIn3: 0.099,
    source: AD_SOURCE,
  })),
  ...SIZES.filter((s) => PULLED_STRENGTH[s.dash]).flatMap((s): RivetSpec[] => {
    const base = {
      kind: 'pulled' as const,
      dash: s.dash,
      nominalDiameterIn: s.d,
      holeDiameterIn: s.drill.diameterIn,
      drill: s.drill,
      shearLb: PULLED_STRENGTH[s.dash].shearLb,
      densityLbPerIn3: 0.13, // aluminium body with the retained mandrel head, estimated
      source: PULLED_SOURCE,
    };
    return [
      {
        ...base,
        code: `PULLED-${s.dash}`,
        description: `pulled rivet, protruding head, ${s.label} in`,
        family: 'PULLED',
        countersunk: false,
        tensionLb: PULLED_STRENGTH[s.dash].tensionLb,
      },
      // A countersunk head holds less in tension; 80 % of the protruding-head value is our assumption.
      {
        ...base,
        code: `PULLED-${s.dash}-CSK`,
        description: `pulled rivet, countersunk head, ${s.label} in`,
        family: 'PULLED-CSK',
        countersunk: true,
        tensionLb: Math.round(0.8 * PULLED_STRENGTH[s.dash].tensionLb),
      },
    ];
  }),
];

/**
 * The built-in entries by upper-cased key, the first of equals kept (as `find` over the list would): a
 * study looks a rivet up some hundred times. Rebuilt should the list change length.
 */
function byKey<T>(list: T[], key: (t: T) => string): () => Map<string, T> {
  let map = new Map<string, T>();
  let size = -1;
  return () => {
    if (size !== list.length) {
      map = new Map();
      for (const t of list) if (!map.has(key(t).toUpperCase())) map.set(key(t).toUpperCase(), t);
      size = list.length;
    }
    return map;
  };
}
const materialsByKey = byKey(MATERIALS, (m) => m.key);
const rivetsByCode = byKey(RIVETS, (r) => r.code);

export function findMaterial(key: string, extra: SheetMaterial[] = [], field = 'material'): SheetMaterial {
  const k = String(key ?? '')
    .trim()
    .toUpperCase();
  // The caller's entries first, then the built-in ones: [...extra, ...MATERIALS].find without the copy.
  const found =
    (extra.length > 0 ? extra.find((m) => m.key.toUpperCase() === k) : undefined) ?? materialsByKey().get(k);
  if (!found) {
    throw new EngineeringInputError(
      field,
      `unknown sheet material "${key}"; known: ${[...extra, ...MATERIALS].map((m) => m.key).join(', ')}`,
    );
  }
  return found;
}

export function findRivet(code: string, extra: RivetSpec[] = [], field = 'rivetSpec'): RivetSpec {
  const k = String(code ?? '')
    .trim()
    .toUpperCase();
  const found = (extra.length > 0 ? extra.find((r) => r.code.toUpperCase() === k) : undefined) ?? rivetsByCode().get(k);
  if (!found) throw new EngineeringInputError(field, `unknown rivet spec "${code}"`);
  return found;
}

/**
 * The catalogue rivet a drawing callout names. A solid rivet's callout may carry its length dash
 * (MS20470AD4-4: 1/8 in, 4/16 in long), which does not change the layout rules or strengths.
 */
export function findRivetByCallout(callout: string, extra: RivetSpec[] = [], field = 'rivetSpec'): RivetSpec {
  const k = String(callout ?? '')
    .trim()
    .toUpperCase();
  const base = k.match(/^(MS\d{5}[A-Z]+\d+)-\d+$/)?.[1];
  return findRivet(base ?? k, extra, field);
}

/** The same family's next larger size, or null at the top of the family. */
export function nextRivetSize(spec: RivetSpec, extra: RivetSpec[] = []): RivetSpec | null {
  const larger = [...extra, ...RIVETS]
    .filter((r) => r.family === spec.family && r.nominalDiameterIn > spec.nominalDiameterIn)
    .sort((a, b) => a.nominalDiameterIn - b.nominalDiameterIn);
  return larger[0] ?? null;
}
