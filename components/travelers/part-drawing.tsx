import { useMemo, useState } from 'react';
import { Platform, ScrollView, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Polygon, Polyline, Text as SvgText } from 'react-native-svg';
import type { Hole, TravelerDetail } from '@/db/contracts';
import { colors, fonts, space, statusColors } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { holeShapes, holeStatusLabels, MarkGlyph } from '@/components/ui/status-mark';
import { useUnits } from '@/hooks/use-units';
import { linePath, makeProjection, outlineBounds, placeHoles, smallestPitch, type Bounds } from './part-geometry';

type Zoom = 'fit' | 'closer' | 'closest';
const zoomFactor: Record<Zoom, number> = { fit: 1, closer: 2.5, closest: 6 };

/** testID for SVG shapes: react-native-svg passes unknown props through to the DOM on the web. */
function svgTestId(id: string): object {
  return Platform.OS === 'web' ? { 'data-testid': id } : { testID: id };
}

type Props = {
  detail: Pick<TravelerDetail, 'outline' | 'lines' | 'holes' | 'chordIn'>;
  /** Holes of the run being picked, drawn with a halo. */
  runIds?: ReadonlySet<string>;
  focusId?: string | null;
  onHolePress?: (hole: Hole) => void;
};

/**
 * The part in side view at true scale: outline, each fastener line along its surface, every hole in
 * its status mark. Thin ribs are long and shallow, so the drawing zooms and scrolls sideways.
 */
export function PartDrawing({ detail, runIds, focusId, onHolePress }: Props) {
  const units = useUnits();
  const [width, setWidth] = useState(0);
  const [zoom, setZoom] = useState<Zoom>('fit');

  const bounds: Bounds = useMemo(() => {
    const b = outlineBounds(detail.outline);
    // Flat lines can run past the outline (a panel's overhang); keep them in the picture.
    for (const l of detail.lines) b.maxX = Math.max(b.maxX, l.startIn + l.lengthIn);
    if (b.maxY - b.minY < 1e-6) { b.maxY += 0.5; b.minY -= 0.5; }
    return b;
  }, [detail.outline, detail.lines]);

  const placed = useMemo(() => placeHoles(detail.outline, detail.lines, detail.holes), [detail.outline, detail.lines, detail.holes]);

  const pad = 28;
  const spanX = Math.max(1e-6, bounds.maxX - bounds.minX);
  const spanY = bounds.maxY - bounds.minY;
  const fit = width > 0 ? (width - 2 * pad) / spanX : 0;
  // A shallow part is hard to see at "fit": start so it is at least ~110 px deep, up to 3× wider.
  const shallowBoost = fit > 0 ? Math.min(3, Math.max(1, 110 / (spanY * fit))) : 1;
  const scale = fit * (zoom === 'fit' ? 1 : zoomFactor[zoom] * shallowBoost);
  const proj = makeProjection(bounds, scale, pad);
  const pitchPx = smallestPitch(detail.lines) * scale;
  const r = Math.max(3, Math.min(10, pitchPx * 0.36));
  // Each hole's tap target reaches halfway to its nearest neighbour, so targets never overlap.
  const hitRadius = useMemo(() => {
    const byLine = new Map<string, typeof placed>();
    for (const h of placed) byLine.set(h.line, [...(byLine.get(h.line) ?? []), h]);
    const out = new Map<string, number>();
    for (const hs of byLine.values()) {
      const sorted = [...hs].sort((a, b) => a.seq - b.seq);
      sorted.forEach((h, i) => {
        const d = (o?: { x: number; y: number }) => (o ? Math.hypot(o.x - h.x, o.y - h.y) * scale : Infinity);
        const near = Math.min(d(sorted[i - 1]), d(sorted[i + 1]));
        out.set(h.holeId, Math.max(2, Math.min(24, near / 2)));
      });
    }
    return out;
  }, [placed, scale]);
  const svgH = proj.height + 34;

  const gridStep = scale * 1 >= 10 ? 1 : scale * 5 >= 10 ? 5 : 10;
  const rulerStep = scale * 5 >= 40 ? 5 : scale * 10 >= 40 ? 10 : 20;

  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));

  return (
    <View style={{ gap: space.sm }}>
      <Choice
        testIDPrefix="zoom"
        value={zoom}
        onChange={setZoom}
        options={[{ value: 'fit', label: 'Whole part' }, { value: 'closer', label: 'Closer' }, { value: 'closest', label: 'Closest' }]}
      />
      <View onLayout={onLayout} style={styles.frame} testID="part-drawing">
        {width > 0 ? (
          <ScrollView horizontal showsHorizontalScrollIndicator contentContainerStyle={{ minWidth: width }}>
            <Svg
              width={Math.max(width, proj.width)}
              height={svgH}
              accessibilityLabel={`Drawing of the part with ${detail.holes.length} holes`}
            >
              {/* Drafting grid, one line per inch (or every 5 or 10 when zoomed out). */}
              <G opacity={0.9}>
                {Array.from({ length: Math.floor(spanX / gridStep) + 1 }, (_, i) => {
                  const x = proj.x(bounds.minX + i * gridStep);
                  return <Line key={`gx${i}`} x1={x} y1={pad / 2} x2={x} y2={proj.height - pad / 2} stroke={colors.grid} strokeWidth={1} />;
                })}
              </G>
              <Polygon
                points={detail.outline.map(([x, y]) => `${proj.x(x)},${proj.y(y)}`).join(' ')}
                fill={colors.paperRaised}
                stroke={colors.ink}
                strokeWidth={1.5}
              />
              {detail.lines.map((line) => {
                const pts = linePath(detail.outline, detail.lines, line);
                const [sx, sy] = pts[0];
                return (
                  <G key={line.code}>
                    <Polyline
                      points={pts.map(([x, y]) => `${proj.x(x)},${proj.y(y)}`).join(' ')}
                      fill="none"
                      stroke={colors.accent}
                      strokeWidth={1}
                      strokeDasharray="6 3"
                    />
                    <SvgText
                      x={proj.x(sx) - 4}
                      y={proj.y(sy) + (line.surface === 'lower' ? 16 : -8)}
                      fontSize={12}
                      fontFamily={fonts.monoBold}
                      fill={colors.accent}
                      textAnchor="end"
                    >
                      {line.code}
                    </SvgText>
                  </G>
                );
              })}
              {placed.map((h) => {
                const cx = proj.x(h.x);
                const cy = proj.y(h.y);
                const inRun = runIds?.has(h.holeId);
                const focused = focusId === h.holeId;
                return (
                  <G key={h.holeId}>
                    {inRun ? <Circle cx={cx} cy={cy} r={r + 4} fill={colors.accentSoft} stroke={colors.accent} strokeWidth={1} /> : null}
                    <MarkGlyph shape={holeShapes[h.status]} color={statusColors[h.status]} cx={cx} cy={cy} r={r} />
                    {focused ? <Circle cx={cx} cy={cy} r={r + 6} fill="none" stroke={colors.accent} strokeWidth={2.5} /> : null}
                    {onHolePress ? (
                      <Circle
                        cx={cx}
                        cy={cy}
                        r={hitRadius.get(h.holeId) ?? r}
                        fill="transparent"
                        onPress={() => onHolePress(h)}
                        accessibilityLabel={`${h.holeId}, ${holeStatusLabels[h.status]}`}
                        {...svgTestId(`drawing-hole-${h.holeId}`)}
                      />
                    ) : null}
                  </G>
                );
              })}
              {/* Station ruler along the chord, from the leading edge. */}
              <G>
                <Line x1={proj.x(bounds.minX)} y1={proj.height + 6} x2={proj.x(bounds.maxX)} y2={proj.height + 6} stroke={colors.ink} strokeWidth={1} />
                {Array.from({ length: Math.floor(spanX / rulerStep) + 1 }, (_, i) => {
                  const xi = bounds.minX + i * rulerStep;
                  const x = proj.x(xi);
                  return (
                    <G key={`r${i}`}>
                      <Line x1={x} y1={proj.height + 2} x2={x} y2={proj.height + 10} stroke={colors.ink} strokeWidth={1} />
                      <SvgText x={x} y={proj.height + 24} fontSize={11} fontFamily={fonts.mono} fill={colors.inkSoft} textAnchor="middle">
                        {units.ruler(xi)}
                      </SvgText>
                    </G>
                  );
                })}
              </G>
            </Svg>
          </ScrollView>
        ) : (
          <View style={{ height: 140 }} />
        )}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderWidth: 1, borderColor: colors.ink, backgroundColor: colors.paper, overflow: 'hidden' },
});
