import { Platform } from 'react-native';
import type { FindingStatus, HoleStatus } from '@/db/contracts';

/**
 * The drafting-sheet look: warm paper, near-black ink, thin rules and one strong accent (cobalt, like a
 * blue drafting pencil). Status colours are a separate set and never stand alone: each status also has
 * its own shape (see components/ui/status-mark.tsx), so it reads in bad light and without colour vision.
 */
export const colors = {
  paper: '#F3EEE2',
  paperRaised: '#FBF8F1',
  paperSunk: '#E9E2D2',
  ink: '#1C1A16',
  inkSoft: '#47433B',
  inkFaint: '#6F695E',
  rule: '#CBC1AD',
  ruleStrong: '#9C917C',
  grid: '#E2DACA',
  accent: '#1F4BC2',
  accentInk: '#FFFFFF',
  accentSoft: '#DDE4F6',
  error: '#9B2A1C',
  errorSoft: '#F6E0DA',
  caution: '#7A5300',
  cautionSoft: '#F3E6C4',
  ok: '#2D6A3E',
  /**
   * Warnings in words ("1 open finding"), and the flagged mark: 4.7:1 on the paper and 5.2:1 on the raised
   * paper, so it passes as small text (the orange it replaces was 4.47:1).
   */
  warning: '#BD3D0A',
  /**
   * The keyboard focus ring (components/ui/focus-ring.ts). A lighter cobalt than the accent so that it
   * reads against both ends of the sheet: 4.4:1 on the paper, 3.4:1 on the ink of a chosen chip (the
   * accent is 2.3:1 there), 3.9:1 or more on every tinted background.
   */
  focus: '#3A66E0',
} as const;

/**
 * Flagged and held are both "something is wrong here" and both warm, so under deuteranopia hue cannot
 * tell them apart (the earlier orange and ochre were ΔE 2.6 apart there): held is a deep umber, 19 L*
 * darker than flagged, which keeps them ΔE 29 apart under simulated deuteranopia, besides their shapes
 * (triangle, square). Each mark is 3:1 or more on the paper (held: 9.5:1); where a mark sits on the
 * ink of a chosen chip it is drawn on a paper disc (status-mark.tsx), since held is near the ink.
 */
export const statusColors: Record<HoleStatus, string> = {
  pending: '#6B655A',
  installed: '#2D6A3E',
  flagged: colors.warning,
  held: '#553600',
  reworked: '#6A3D9E',
  accepted: '#0D6C70',
};

/**
 * A finding's states, each its own colour (and, in status-mark.tsx, its own shape). The states that put
 * holes in a hole status share that status's colour, so the traveler and the finding read alike;
 * waiting for the design authority and closed have colours no hole status uses.
 */
export const findingStatusColors: Record<FindingStatus, string> = {
  raised: statusColors.flagged,
  awaiting_approval: '#8B2F6B',
  work_ordered: statusColors.held,
  work_done: statusColors.reworked,
  closed: '#3D4650',
};

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;

/** Gloved hands: nothing you press is smaller than this. */
export const touch = 48;

export const radius = { sm: 2, md: 4 } as const;

export const hairline = 1;

/** Two panes from about this width. */
export const widePx = 900;

const webStack = (name: string, fallback: string) => (Platform.OS === 'web' ? `${name}, ${fallback}` : name);

export const fonts = {
  text: webStack('AtkinsonHyperlegible_400Regular', 'system-ui, sans-serif'),
  textBold: webStack('AtkinsonHyperlegible_700Bold', 'system-ui, sans-serif'),
  mono: webStack('IBMPlexMono_400Regular', 'ui-monospace, monospace'),
  monoBold: webStack('IBMPlexMono_600SemiBold', 'ui-monospace, monospace'),
} as const;

export const type = {
  display: { fontSize: 30, lineHeight: 36 },
  title: { fontSize: 24, lineHeight: 30 },
  heading: { fontSize: 20, lineHeight: 26 },
  body: { fontSize: 18, lineHeight: 26 },
  small: { fontSize: 15, lineHeight: 21 },
  label: { fontSize: 13, lineHeight: 18, letterSpacing: 0.8 },
} as const;

export type TextVariant = keyof typeof type;
