import { StyleSheet, View } from 'react-native';
import Svg, { Circle, G, Path, Rect } from 'react-native-svg';
import { holeStatuses, type FindingStatus, type HoleStatus, findingStatusLabels, dispositionLabels, type Disposition } from '@/db/contracts';
import { colors, hairline, radius, space, statusColors } from '@/constants/theme';
import { Txt } from './text';

/** Each hole status has its own shape as well as its own colour. */
export type MarkShape = 'open-circle' | 'dot' | 'triangle' | 'square' | 'diamond' | 'ringed-check';

export const holeShapes: Record<HoleStatus, MarkShape> = {
  pending: 'open-circle',
  installed: 'dot',
  flagged: 'triangle',
  held: 'square',
  reworked: 'diamond',
  accepted: 'ringed-check',
};

export const holeStatusLabels: Record<HoleStatus, string> = {
  pending: 'Pending', installed: 'Installed', flagged: 'Flagged', held: 'Held', reworked: 'Reworked', accepted: 'Accepted',
};

export const holeStatusHelp: Record<HoleStatus, string> = {
  pending: 'not riveted yet',
  installed: 'riveted',
  flagged: 'suspect, waiting for the inspector',
  held: 'stop: rework, repair or scrap ordered',
  reworked: 'rework done, waiting to be checked',
  accepted: 'passed by the inspector',
};

/** The SVG of one mark centred on (cx, cy) with radius r, for use inside an <Svg>. */
export function MarkGlyph({ shape, color, cx, cy, r, strokeWidth }: {
  shape: MarkShape; color: string; cx: number; cy: number; r: number; strokeWidth?: number;
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
    case 'ringed-check': {
      const inner = r * 0.72;
      const k = inner * 0.55;
      return (
        <G>
          <Circle cx={cx} cy={cy} r={r - sw / 4} fill="none" stroke={color} strokeWidth={sw / 2} />
          <Circle cx={cx} cy={cy} r={inner} fill={color} />
          <Path
            d={`M ${cx - k} ${cy} L ${cx - k * 0.25} ${cy + k * 0.7} L ${cx + k} ${cy - k * 0.6}`}
            fill="none" stroke={colors.paperRaised} strokeWidth={Math.max(1.2, inner * 0.3)} strokeLinecap="round" strokeLinejoin="round"
          />
        </G>
      );
    }
  }
}

/** A hole status mark on its own, e.g. in a list or the legend. */
export function HoleMark({ status, size = 20 }: { status: HoleStatus; size?: number }) {
  const shape = holeShapes[status];
  return (
    <View
      testID={`mark-${status}`}
      accessibilityLabel={`${holeStatusLabels[status]} (${shape.replace('-', ' ')})`}
      style={{ width: size, height: size }}
    >
      <Svg width={size} height={size} viewBox={`0 0 ${size} ${size}`}>
        <MarkGlyph shape={shape} color={statusColors[status]} cx={size / 2} cy={size / 2} r={size / 2 - 1} />
      </Svg>
    </View>
  );
}

export function HoleStatusLegend({ counts }: { counts?: Partial<Record<HoleStatus, number>> }) {
  return (
    <View style={styles.legend} testID="hole-legend">
      {holeStatuses.map((s) => (
        <View key={s} style={styles.legendItem}>
          <HoleMark status={s} size={18} />
          <Txt variant="small">{holeStatusLabels[s]}</Txt>
          {counts ? <Txt variant="small" tone="faint" style={{ fontVariant: ['tabular-nums'] }}>{counts[s] ?? 0}</Txt> : null}
        </View>
      ))}
    </View>
  );
}

/** Finding statuses borrow the hole marks they lead to, with the words beside them. */
const findingShape: Record<FindingStatus, { shape: MarkShape; color: string }> = {
  flagged: { shape: 'triangle', color: statusColors.flagged },
  in_review: { shape: 'open-circle', color: statusColors.flagged },
  dispositioned: { shape: 'square', color: statusColors.held },
  rework_done: { shape: 'diamond', color: statusColors.reworked },
  verified: { shape: 'ringed-check', color: statusColors.accepted },
  closed: { shape: 'ringed-check', color: colors.inkFaint },
};

export function FindingStatusTag({ status, disposition }: { status: FindingStatus; disposition?: Disposition | null }) {
  const m = findingShape[status];
  return (
    <View style={[styles.tag, { borderColor: m.color }]} testID={`finding-status-${status}`}>
      <Svg width={14} height={14} viewBox="0 0 14 14">
        <MarkGlyph shape={m.shape} color={m.color} cx={7} cy={7} r={6} />
      </Svg>
      <Txt variant="small" bold>{findingStatusLabels[status]}</Txt>
      {disposition ? <Txt variant="small" tone="soft">· {dispositionLabels[disposition]}</Txt> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  tag: {
    flexDirection: 'row', flexWrap: 'wrap', flexShrink: 1, maxWidth: '100%', alignItems: 'center', gap: space.xs, alignSelf: 'flex-start',
    borderWidth: hairline, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2,
    backgroundColor: colors.paperRaised,
  },
});
