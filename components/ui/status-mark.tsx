import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { Circle, G, Path, Rect } from 'react-native-svg';
import {
  dispositionLabels,
  findingClosureLabels,
  findingStatusLabels,
  holeStatuses,
  type Disposition,
  type FindingClosure,
  type FindingStatus,
  type HoleStatus,
} from '@/db/contracts';
import { colors, findingStatusColors, hairline, radius, space, statusColors } from '@/constants/theme';
import { Txt } from './text';

/** Each hole status has its own shape as well as its own colour; so has each finding state. */
export type MarkShape = 'open-circle' | 'dot' | 'triangle' | 'square' | 'diamond' | 'ringed-check' | 'hourglass';

export const holeShapes: Record<HoleStatus, MarkShape> = {
  pending: 'open-circle',
  installed: 'dot',
  flagged: 'triangle',
  held: 'square',
  reworked: 'diamond',
  accepted: 'ringed-check',
};

export const holeStatusLabels: Record<HoleStatus, string> = {
  pending: 'Pending',
  installed: 'Installed',
  flagged: 'Flagged',
  held: 'Held',
  reworked: 'Reworked',
  accepted: 'Accepted',
};

export const holeStatusHelp: Record<HoleStatus, string> = {
  pending: 'not riveted yet',
  installed: 'riveted',
  flagged: 'suspect, waiting for the inspector',
  held: 'stop: dispositioned, wait for the work ordered',
  reworked: 'work done, waiting for the inspector',
  accepted: 'passed by the inspector',
};

/** The paper-coloured line drawn over a filled mark (a tick, a cross), with rounded ends. */
export const paperStroke = {
  fill: 'none',
  stroke: colors.paperRaised,
  strokeLinecap: 'round',
  strokeLinejoin: 'round',
} as const;

/** The SVG of one mark centred on (cx, cy) with radius r, for use inside an <Svg>. */
export function MarkGlyph({
  shape,
  color,
  cx,
  cy,
  r,
  strokeWidth,
}: {
  shape: MarkShape;
  color: string;
  cx: number;
  cy: number;
  r: number;
  strokeWidth?: number;
}) {
  const sw = strokeWidth ?? Math.max(1.5, r * 0.28);
  switch (shape) {
    case 'open-circle':
      return <Circle cx={cx} cy={cy} r={r - sw / 2} fill={colors.paperRaised} stroke={color} strokeWidth={sw} />;
    case 'dot':
      return <Circle cx={cx} cy={cy} r={r} fill={color} />;
    case 'triangle': {
      const h = r * 1.9;
      const top = cy - h * 0.6;
      const base = cy + h * 0.4;
      const half = r * 1.1;
      return <Path d={`M ${cx} ${top} L ${cx + half} ${base} L ${cx - half} ${base} Z`} fill={color} />;
    }
    case 'square': {
      const s = r * 1.6;
      return <Rect x={cx - s / 2} y={cy - s / 2} width={s} height={s} fill={color} />;
    }
    case 'diamond': {
      const d = r * 1.2;
      return <Path d={`M ${cx} ${cy - d} L ${cx + d} ${cy} L ${cx} ${cy + d} L ${cx - d} ${cy} Z`} fill={color} />;
    }
    case 'hourglass': {
      // Two triangles tip to tip: waiting on someone else's word.
      const w = r * 0.95;
      const h = r * 0.95;
      return (
        <Path
          d={`M ${cx - w} ${cy - h} L ${cx + w} ${cy - h} L ${cx} ${cy} L ${cx + w} ${cy + h} L ${cx - w} ${cy + h} L ${cx} ${cy} Z`}
          fill={color}
        />
      );
    }
    case 'ringed-check': {
      const inner = r * 0.72;
      const k = inner * 0.55;
      return (
        <G>
          <Circle cx={cx} cy={cy} r={r - sw / 4} fill="none" stroke={color} strokeWidth={sw / 2} />
          <Circle cx={cx} cy={cy} r={inner} fill={color} />
          <Path
            d={`M ${cx - k} ${cy} L ${cx - k * 0.25} ${cy + k * 0.7} L ${cx + k} ${cy - k * 0.6}`}
            strokeWidth={Math.max(1.2, inner * 0.3)}
            {...paperStroke}
          />
        </G>
      );
    }
  }
}

/** What each shape is called, so that the mark can be told in words too. */
const shapeWords: Record<MarkShape, string> = {
  'open-circle': 'open circle',
  dot: 'dot',
  triangle: 'triangle',
  square: 'square',
  diamond: 'diamond',
  'ringed-check': 'ringed tick',
  hourglass: 'hourglass',
};

/**
 * The accessibility of a mark: an image named by its state and shape, or (`decorative`) hidden, where
 * the words beside it already say the state (a legend, a chip's own name, a tag) and it would only be
 * read twice.
 */
function markA11y(label: string, decorative?: boolean): object {
  return decorative ? { 'aria-hidden': true } : { role: 'img', 'aria-label': label };
}

/**
 * A hole status mark on its own, e.g. in a list or the legend. `onInk` draws it on a paper disc, for a
 * chosen (ink) chip: held's umber is close to the ink.
 */
export function HoleMark({
  status,
  size = 20,
  decorative,
  onInk,
}: {
  status: HoleStatus;
  size?: number;
  decorative?: boolean;
  onInk?: boolean;
}) {
  const shape = holeShapes[status];
  return (
    <View
      testID={`mark-${status}`}
      {...markA11y(`${holeStatusLabels[status]} (${shapeWords[shape]})`, decorative)}
      style={{ width: size, height: size }}
    >
      <Svg width={size} height={size} viewBox={`0 0 ${size} ${size}`}>
        {onInk ? <Circle cx={size / 2} cy={size / 2} r={size / 2} fill={colors.paperRaised} /> : null}
        <MarkGlyph
          shape={shape}
          color={statusColors[status]}
          cx={size / 2}
          cy={size / 2}
          r={onInk ? size / 2 - 2.5 : size / 2 - 1}
        />
      </Svg>
    </View>
  );
}

/**
 * Every hole status with its mark and, given `counts`, how many holes are in it: a list, each item
 * read as "Flagged, 1" (the mark itself is hidden, as its words are right beside it).
 */
export function HoleStatusLegend({ counts }: { counts?: Partial<Record<HoleStatus, number>> }) {
  return (
    <View style={styles.legend} testID="hole-legend" role="list" aria-label="Hole status key">
      {holeStatuses.map((s) => (
        <View
          key={s}
          style={styles.legendItem}
          role="listitem"
          aria-label={`${holeStatusLabels[s]} (${shapeWords[holeShapes[s]]})${counts ? `: ${counts[s] ?? 0}` : ''}`}
        >
          <HoleMark status={s} size={18} decorative />
          <Txt variant="small" aria-hidden>
            {holeStatusLabels[s]}
          </Txt>
          {counts ? (
            <Txt variant="small" tone="soft" style={{ fontVariant: ['tabular-nums'] }} aria-hidden>
              {counts[s] ?? 0}
            </Txt>
          ) : null}
        </View>
      ))}
    </View>
  );
}

/**
 * A finding's states: no two share a shape, and closed has a shape no open state uses. The states that
 * hold holes in a hole status borrow that status's mark (raised = flagged, work ordered = held, work done
 * = reworked), so the traveler and the finding read alike; waiting for the design authority is an hourglass.
 */
export const findingShapes: Record<FindingStatus, MarkShape> = {
  raised: 'triangle',
  awaiting_approval: 'hourglass',
  work_ordered: 'square',
  work_done: 'diamond',
  closed: 'ringed-check',
};

/** A finding state's mark on its own (lists, legends); `decorative` where its words are beside it. */
export function FindingMark({
  status,
  size = 14,
  decorative,
}: {
  status: FindingStatus;
  size?: number;
  decorative?: boolean;
}) {
  const shape = findingShapes[status];
  return (
    <View
      testID={`finding-mark-${status}`}
      {...markA11y(`${findingStatusLabels[status]} (${shapeWords[shape]})`, decorative)}
      style={{ width: size, height: size }}
    >
      <Svg width={size} height={size} viewBox={`0 0 ${size} ${size}`}>
        <MarkGlyph shape={shape} color={findingStatusColors[status]} cx={size / 2} cy={size / 2} r={size / 2 - 1} />
      </Svg>
    </View>
  );
}

/** The frame of a status in words beside its mark, edged in the status's colour: a finding's, a notice's. */
export function TagFrame({ color, testID, children }: { color: string; testID?: string; children: ReactNode }) {
  return (
    <View style={[styles.tag, { borderColor: color }]} testID={testID}>
      {children}
    </View>
  );
}

/**
 * A finding's state: its mark, its words, and what it came to. A closed finding says how it closed
 * (closure); an open one names the disposition it is working to, when there is one.
 */
export function FindingStatusTag({
  status,
  disposition,
  closure,
}: {
  status: FindingStatus;
  disposition?: Disposition | null;
  closure?: FindingClosure | null;
}) {
  const color = findingStatusColors[status];
  return (
    <TagFrame color={color} testID={`finding-status-${status}`}>
      <FindingMark status={status} decorative />
      <Txt variant="small" bold>
        {findingStatusLabels[status]}
      </Txt>
      {status === 'closed' && closure ? (
        <Txt variant="small" testID="closure">
          · {findingClosureLabels[closure]}
        </Txt>
      ) : disposition ? (
        <Txt variant="small" tone="soft">
          · {dispositionLabels[disposition]}
        </Txt>
      ) : null}
    </TagFrame>
  );
}

const styles = StyleSheet.create({
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  tag: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    flexShrink: 1,
    maxWidth: '100%',
    alignItems: 'center',
    gap: space.xs,
    alignSelf: 'flex-start',
    borderWidth: hairline,
    borderRadius: radius.sm,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    backgroundColor: colors.paperRaised,
  },
});
