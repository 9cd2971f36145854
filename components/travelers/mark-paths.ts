import { colors } from '@/constants/theme';
import type { MarkShape } from '@/components/ui/status-mark';

/** One SVG path drawing the same mark at many points: its outline data and how it is painted. */
export type MarkLayer = {
  d: string;
  fill: string;
  stroke?: string;
  strokeWidth?: number;
  round?: boolean;
};

const f = (n: number) => String(Math.round(n * 100) / 100);

/** A circle as path data: two half arcs. */
function circle(cx: number, cy: number, r: number): string {
  return `M${f(cx - r)} ${f(cy)}a${f(r)} ${f(r)} 0 1 0 ${f(2 * r)} 0a${f(r)} ${f(r)} 0 1 0 ${f(-2 * r)} 0Z`;
}

function poly(pts: [number, number][], close = true): string {
  return `M${pts.map(([x, y]) => `${f(x)} ${f(y)}`).join('L')}${close ? 'Z' : ''}`;
}

/**
 * The marks of every hole in one status as one to three paths, in the same shapes and proportions as
 * MarkGlyph (components/ui/status-mark.tsx): a 2,000-hole part drew 2,000 SVG groups; this draws at
 * most three elements a status, so a drawing of any size costs the page about the same.
 */
export function markLayers(
  shape: MarkShape,
  color: string,
  at: readonly { x: number; y: number }[],
  r: number,
): MarkLayer[] {
  if (!at.length) return [];
  const sw = Math.max(1.5, r * 0.28);
  const each = (g: (cx: number, cy: number) => string) => at.map((p) => g(p.x, p.y)).join('');
  switch (shape) {
    case 'open-circle':
      return [
        { d: each((x, y) => circle(x, y, r - sw / 2)), fill: colors.paperRaised, stroke: color, strokeWidth: sw },
      ];
    case 'dot':
      return [{ d: each((x, y) => circle(x, y, r)), fill: color }];
    case 'triangle': {
      const h = r * 1.9;
      const half = r * 1.1;
      return [
        {
          d: each((x, y) =>
            poly([
              [x, y - h * 0.6],
              [x + half, y + h * 0.4],
              [x - half, y + h * 0.4],
            ]),
          ),
          fill: color,
        },
      ];
    }
    case 'square': {
      const s = r * 1.6;
      return [
        {
          d: each((x, y) =>
            poly([
              [x - s / 2, y - s / 2],
              [x + s / 2, y - s / 2],
              [x + s / 2, y + s / 2],
              [x - s / 2, y + s / 2],
            ]),
          ),
          fill: color,
        },
      ];
    }
    case 'diamond': {
      const d = r * 1.2;
      return [
        {
          d: each((x, y) =>
            poly([
              [x, y - d],
              [x + d, y],
              [x, y + d],
              [x - d, y],
            ]),
          ),
          fill: color,
        },
      ];
    }
    case 'hourglass': {
      const w = r * 0.95;
      return [
        {
          d: each((x, y) =>
            poly([
              [x - w, y - w],
              [x + w, y - w],
              [x, y],
              [x + w, y + w],
              [x - w, y + w],
              [x, y],
            ]),
          ),
          fill: color,
        },
      ];
    }
    case 'ringed-check': {
      const inner = r * 0.72;
      const k = inner * 0.55;
      return [
        { d: each((x, y) => circle(x, y, r - sw / 4)), fill: 'none', stroke: color, strokeWidth: sw / 2 },
        { d: each((x, y) => circle(x, y, inner)), fill: color },
        {
          d: each((x, y) =>
            poly(
              [
                [x - k, y],
                [x - k * 0.25, y + k * 0.7],
                [x + k, y - k * 0.6],
              ],
              false,
            ),
          ),
          fill: 'none',
          stroke: colors.paperRaised,
          strokeWidth: Math.max(1.2, inner * 0.3),
          round: true,
        },
      ];
    }
  }
}

/** Rings around many points (the run being picked) as one path. */
export function ringsPath(at: readonly { x: number; y: number }[], r: number): string {
  return at.map((p) => circle(p.x, p.y, r)).join('');
}
