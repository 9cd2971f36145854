/**
 * Conversions used at the edges (forms, reports). Inside the core everything is in inches, pounds force,
 * seconds, psi, radians and knots EAS. Factors are exact by definition unless noted.
 */
export const MM_PER_IN = 25.4;
export const IN_PER_FT = 12;
export const SQIN_PER_SQFT = 144;
export const KG_PER_LB = 0.45359237;
export const STANDARD_GRAVITY_M_S2 = 9.80665;
export const N_PER_LBF = KG_PER_LB * STANDARD_GRAVITY_M_S2; // 4.4482216152605
export const PA_PER_PSI = N_PER_LBF / (0.0254 * 0.0254); // 6894.757…
export const FT_PER_S_PER_KNOT = 1852 / 3600 / 0.3048; // 1.6878098571…

export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const ftToIn = (ft: number): number => ft * IN_PER_FT;
export const inToFt = (inches: number): number => inches / IN_PER_FT;
export const lbfToN = (lbf: number): number => lbf * N_PER_LBF;
export const nToLbf = (n: number): number => n / N_PER_LBF;
export const psiToKpa = (psi: number): number => (psi * PA_PER_PSI) / 1000;
export const kpaToPsi = (kpa: number): number => (kpa * 1000) / PA_PER_PSI;
export const psfToPsi = (psf: number): number => psf / SQIN_PER_SQFT;
export const psiToPsf = (psi: number): number => psi * SQIN_PER_SQFT;
export const lbToKg = (lb: number): number => lb * KG_PER_LB;
export const kgToLb = (kg: number): number => kg / KG_PER_LB;
export const lbPerInToNPerMm = (lbPerIn: number): number => lbfToN(lbPerIn) / MM_PER_IN;
export const nPerMmToLbPerIn = (nPerMm: number): number => nToLbf(nPerMm * MM_PER_IN);
export const inLbToNm = (inLb: number): number => lbfToN(inLb) * 0.0254;
export const nmToInLb = (nm: number): number => nToLbf(nm / 0.0254);
export const knotsToFtPerS = (kt: number): number => kt * FT_PER_S_PER_KNOT;
export const degToRad = (deg: number): number => (deg * Math.PI) / 180;
export const radToDeg = (rad: number): number => (rad * 180) / Math.PI;
