import type {
  SkinCandidate,
  SkinPanelResult,
  StudyCandidate,
  WingCondition,
  WingRib,
  WingStudyResult,
  WingTradeRow,
} from '@/lib/engineering-results';
import { sameCandidate, type CandidateKey } from './study-result';

/**
 * The stored result of a whole-wing study as the screen reads it (the engine's own types, in in, lb,
 * psi, KEAS). `readWingResult` checks its shape before anything is drawn.
 */
export type { SkinCandidate, SkinPanelResult, WingCondition, WingRib, WingTradeRow };
export type WingResult = Pick<
  WingStudyResult,
  | 'kind'
  | 'design'
  | 'planform'
  | 'tail'
  | 'airfoil'
  | 'conditions'
  | 'ribs'
  | 'skins'
  | 'trade'
  | 'rules'
  | 'warnings'
  | 'caution'
>;

const isArr = (v: unknown): v is unknown[] => Array.isArray(v);

export function readWingResult(raw: unknown): WingResult | null {
  if (!raw || typeof raw !== 'object') return null;
  const r = raw as Partial<WingResult>;
  if (
    r.kind !== 'wing' ||
    !isArr(r.conditions) ||
    !isArr(r.ribs) ||
    !isArr(r.skins) ||
    !r.trade ||
    !isArr(r.trade.uniform) ||
    !r.planform
  )
    return null;
  if (!r.ribs.every((rib) => rib && typeof rib === 'object' && rib.study && isArr(rib.study.candidates) && rib.loads))
    return null;
  return {
    ...(r as WingResult),
    rules: isArr(r.rules) ? (r.rules as string[]) : [],
    warnings: isArr(r.warnings) ? (r.warnings as string[]) : [],
    caution: typeof r.caution === 'string' ? r.caution : '',
  };
}

/**
 * A wing keeps zones for a few candidates only (a rib's recommendation and the one-for-all choice, a
 * panel's recommendation); the others are their verdicts and figures. Only those with zones can be
 * shown in a zone table or applied to a part.
 */
export const hasZones = (c: { lines: unknown[] } | null | undefined): boolean => !!c && c.lines.length > 0;

export function ribCandidate(rib: WingRib, key: CandidateKey | null | undefined): StudyCandidate | null {
  return rib.study.candidates.find((c) => sameCandidate(c, key)) ?? null;
}

export function skinCandidate(panel: SkinPanelResult, key: CandidateKey | null | undefined): SkinCandidate | null {
  return panel.candidates.find((c) => sameCandidate(c, key)) ?? null;
}

/** What the rib's zones can be shown for: its recommendation, then the wing's one-for-all choice. */
export function ribChoices(
  rib: WingRib,
  uniform: CandidateKey | null,
): { key: CandidateKey; why: 'recommended' | 'uniform' | 'both' }[] {
  const out: { key: CandidateKey; why: 'recommended' | 'uniform' | 'both' }[] = [];
  const rec = rib.study.recommended;
  if (rec && hasZones(ribCandidate(rib, rec)))
    out.push({ key: rec, why: sameCandidate(rec, uniform) ? 'both' : 'recommended' });
  if (uniform && !sameCandidate(rec, uniform) && hasZones(ribCandidate(rib, uniform)))
    out.push({ key: uniform, why: 'uniform' });
  return out;
}

/** A skin panel's recommendation: the only candidate of a panel stored with its zones. */
export function skinChoices(panel: SkinPanelResult): CandidateKey[] {
  return panel.recommended && hasZones(skinCandidate(panel, panel.recommended)) ? [panel.recommended] : [];
}

/** testIDs carry names: letters, digits and dashes only ("W-101–W-102 upper" → "W-101-W-102-upper"). */
export const idPart = (name: string): string => name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '');
