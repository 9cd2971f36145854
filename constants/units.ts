/**
 * One stored system (inches, pounds) and a display switch to millimetres and newtons. Everything the
 * server sends is in inches and pounds; these helpers convert at the screen's edge only.
 */
export type UnitSystem = 'imperial' | 'metric';

export const unitSystems: readonly UnitSystem[] = ['imperial', 'metric'];
export const unitSystemLabels: Record<UnitSystem, string> = { imperial: 'in · lb', metric: 'mm · N' };

export const MM_PER_IN = 25.4;
export const N_PER_LBF = 4.4482216152605;
export const KG_PER_LB = 0.45359237;
export const M2_PER_FT2 = 0.09290304;

export type Quantity = 'length' | 'force' | 'mass' | 'area';

export function unitLabel(q: Quantity, system: UnitSystem): string {
  if (system === 'imperial') return { length: 'in', force: 'lb', mass: 'lb', area: 'sq ft' }[q];
  return { length: 'mm', force: 'N', mass: 'kg', area: 'm²' }[q];
}

/** Stored value (in, lbf, lb, sq ft) → the number shown in `system`. */
export function toDisplay(q: Quantity, stored: number, system: UnitSystem): number {
  if (system === 'imperial') return stored;
  switch (q) {
    case 'length':
      return stored * MM_PER_IN;
    case 'force':
      return stored * N_PER_LBF;
    case 'mass':
      return stored * KG_PER_LB;
    case 'area':
      return stored * M2_PER_FT2;
  }
}

/** A number typed in `system` → the stored value. */
export function fromDisplay(q: Quantity, shown: number, system: UnitSystem): number {
  if (system === 'imperial') return shown;
  switch (q) {
    case 'length':
      return shown / MM_PER_IN;
    case 'force':
      return shown / N_PER_LBF;
    case 'mass':
      return shown / KG_PER_LB;
    case 'area':
      return shown / M2_PER_FT2;
  }
}

function trimZeros(s: string, keep: number): string {
  // Keep at least `keep` decimals so a gauge reads 0.032, not 0.03200 or 0.032000.
  const [whole, frac = ''] = s.split('.');
  let f = frac;
  while (f.length > keep && f.endsWith('0')) f = f.slice(0, -1);
  return f.length ? `${whole}.${f}` : whole;
}

/** Digits for a length: sheet gauges and drill diameters need four places in inches. */
export function lengthNumber(inches: number, system: UnitSystem): string {
  if (!Number.isFinite(inches)) return '–';
  const v = toDisplay('length', inches, system);
  const a = Math.abs(v);
  if (system === 'imperial') {
    if (a < 1) return trimZeros(v.toFixed(4), 3);
    if (a < 100) return v.toFixed(2);
    return v.toFixed(1);
  }
  if (a < 10) return v.toFixed(2);
  if (a < 100) return v.toFixed(1);
  return v.toFixed(0);
}

/** Stations along a line: the same number of places for every hole, so a column reads evenly. */
export function stationNumber(inches: number, system: UnitSystem): string {
  if (!Number.isFinite(inches)) return '–';
  const v = toDisplay('length', inches, system);
  if (system === 'imperial') return v.toFixed(2);
  return Math.abs(v) >= 100 ? v.toFixed(0) : v.toFixed(1);
}

/** A ruler mark: whole units. */
export function rulerNumber(inches: number, system: UnitSystem): string {
  return String(Math.round(toDisplay('length', inches, system)));
}

export function formatLength(inches: number, system: UnitSystem): string {
  return `${lengthNumber(inches, system)} ${unitLabel('length', system)}`;
}

export function formatForce(lbf: number, system: UnitSystem): string {
  if (!Number.isFinite(lbf)) return '–';
  const v = toDisplay('force', lbf, system);
  const digits = Math.abs(v) >= 100 ? 0 : 1;
  return `${v.toFixed(digits)} ${unitLabel('force', system)}`;
}

export function formatMass(lb: number, system: UnitSystem): string {
  if (!Number.isFinite(lb)) return '–';
  const v = toDisplay('mass', lb, system);
  const digits = Math.abs(v) >= 100 ? 0 : 1;
  return `${v.toFixed(digits)} ${unitLabel('mass', system)}`;
}

export function formatArea(sqft: number, system: UnitSystem): string {
  if (!Number.isFinite(sqft)) return '–';
  const v = toDisplay('area', sqft, system);
  return `${v.toFixed(Math.abs(v) >= 100 ? 0 : 1)} ${unitLabel('area', system)}`;
}

/** Wing loading, stored as pounds per square foot; shown metric as kilograms per square metre, as pilots quote it. */
export function formatWingLoading(psf: number, system: UnitSystem): string {
  if (!Number.isFinite(psf)) return '–';
  if (system === 'imperial') return `${psf.toFixed(1)} psf`;
  return `${((psf * KG_PER_LB) / M2_PER_FT2).toFixed(1)} kg/m²`;
}

/** A ratio such as edge distance over diameter: "2.4 D". */
export function formatDiameters(ratio: number): string {
  if (!Number.isFinite(ratio)) return '–';
  return `${ratio.toFixed(1)} D`;
}

/**
 * Reads what a person typed into a number field: accepts a comma as the decimal mark and ignores
 * spaces. Returns undefined for an empty field and NaN for text that is not a number.
 */
export function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(/\s+/g, '').replace(',', '.');
  if (t === '') return undefined;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)$/.test(t)) return Number.NaN;
  return Number(t);
}

/** The number a field shows for a stored value, without the unit and without noise digits. */
export function editableNumber(q: Quantity, stored: number | undefined | null, system: UnitSystem): string {
  if (stored == null || !Number.isFinite(stored)) return '';
  const v = toDisplay(q, stored, system);
  return String(Number(v.toPrecision(6)));
}
