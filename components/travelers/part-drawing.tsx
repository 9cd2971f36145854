import { useMemo, useState } from 'react';
import { Platform, ScrollView, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Polygon, Polyline, Text as SvgText } from 'react-native-svg';
import { holeStatuses, type Hole, type HoleStatus, type TravelerDetail } from '@/db/contracts';
import { colors, fonts, space, statusColors } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { holeShapes, holeStatusLabels } from '@/components/ui/status-mark';
import { Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { markLayers, ringsPath } from './mark-paths';
import { linePath, makeProjection, outlineBounds, placeHoles, smallestPitch, type Bounds } from './part-geometry';

type Zoom = 'fit' | 'closer' | 'closest';
const zoomFactor: Record<Zoom, number> = { fit: 1, closer: 2.5, closest: 6 };

/** A mark is never drawn smaller than this across (px): below it a triangle and a square look alike. */
const MARK_MIN = 12;
/** The smallest tap target on the drawing (px, WCAG 2.5.8); closer holes are picked in the holes list. */
const TARGET_MIN = 24;

/**
 * Where marks overlap (a whole part on a phone), the ones that ask for attention are drawn last, on
 * top: a flagged or held hole is never hidden under its pending neighbours. Each status is one layer.
 */
const drawOrder: Record<HoleStatus, number> = {
  pending: 0,
  installed: 1,
  accepted: 2,
  reworked: 3,
  held: 4,
  flagged: 5,
};

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
    if (b.maxY - b.minY < 1e-6) {
      b.maxY += 0.5;
      b.minY -= 0.5;
    }
    return b;
  }, [detail.outline, detail.lines]);

  const placed = useMemo(
    () => placeHoles(detail.outline, detail.lines, detail.holes),
    [detail.outline, detail.lines, detail.holes],
  );

  const pad = 28;
  const spanX = Math.max(1e-6, bounds.maxX - bounds.minX);
  const spanY = bounds.maxY - bounds.minY;
  const fit = width > 0 ? (width - 2 * pad) / spanX : 0;
  // A shallow part is hard to see at "fit": start so it is at least ~110 px deep, up to 3× wider.
  const shallowBoost = fit > 0 ? Math.min(3, Math.max(1, 110 / (spanY * fit))) : 1;
  const scale = fit * (zoom === 'fit' ? 1 : zoomFactor[zoom] * shallowBoost);
  const proj = makeProjection(bounds, scale, pad);
  const pitchPx = smallestPitch(detail.lines) * scale;
  const r = Math.max(MARK_MIN / 2, Math.min(10, pitchPx * 0.36));
  // Each hole's tap target reaches halfway to its nearest neighbour, so targets never overlap.
  const { hitRadius, closest } = useMemo(() => {
    const byLine = new Map<string, typeof placed>();
    for (const h of placed) {
      const on = byLine.get(h.line);
      if (on) on.push(h);
      else byLine.set(h.line, [h]);
    }
    const out = new Map<string, number>();
    let nearest = Infinity;
    for (const hs of byLine.values()) {
      const sorted = [...hs].sort((a, b) => a.seq - b.seq);
      sorted.forEach((h, i) => {
        const d = (o?: { x: number; y: number }) => (o ? Math.hypot(o.x - h.x, o.y - h.y) * scale : Infinity);
        const near = Math.min(d(sorted[i - 1]), d(sorted[i + 1]));
        nearest = Math.min(nearest, near);
        out.set(h.holeId, Math.min(TARGET_MIN, near / 2));
      });
    }
    return { hitRadius: out, closest: nearest };
  }, [placed, scale]);
  // Holes are picked on the drawing only at a zoom where every target is 24 px or more; closer than
  // that (a whole rib on a phone) a tap could not say which hole was meant, and the holes list below
  // ticks and flags the same holes with large chips.
  const pickable = !!onHolePress && width > 0 && closest >= TARGET_MIN;
  const marks = useMemo(() => {
    const byStatus = new Map<HoleStatus, { x: number; y: number }[]>();
    for (const h of placed) {
      const at = byStatus.get(h.status) ?? [];
      at.push({ x: proj.x(h.x), y: proj.y(h.y) });
      byStatus.set(h.status, at);
    }
    return holeStatuses
      .slice()
      .sort((a, b) => drawOrder[a] - drawOrder[b])
      .flatMap((st) => markLayers(holeShapes[st], statusColors[st], byStatus.get(st) ?? [], r));
    // proj is remade each render from these same numbers.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [placed, scale, r, bounds]);
  const runPlaced = useMemo(() => (runIds?.size ? placed.filter((h) => runIds.has(h.holeId)) : []), [placed, runIds]);
  const focusPlaced = focusId ? placed.find((h) => h.holeId === focusId) : undefined;
  const summary = useMemo(() => {
    const n: Partial<Record<HoleStatus, number>> = {};
    for (const h of detail.holes) n[h.status] = (n[h.status] ?? 0) + 1;
    return holeStatuses
      .filter((st) => n[st])
      .map((st) => `${n[st]} ${holeStatusLabels[st].toLowerCase()}`)
      .join(', ');
  }, [detail.holes]);
  const svgW = Math.max(width, Math.ceil(proj.width));
  const scrolls = svgW > width + 1;
  const svgH = proj.height + 34;

  const gridStep = scale * 1 >= 10 ? 1 : scale * 5 >= 10 ? 5 : 10;
  const rulerStep = scale * 5 >= 40 ? 5 : scale * 10 >= 40 ? 10 : 20;

  // The frame's inside: its outer width less its two borders (a drawing 2 px too wide made the whole
  // part scroll by 2 px, a scroll region a keyboard could not reach).
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.floor(e.nativeEvent.layout.width) - 2 * FRAME_BORDER);

  return (
    <View style={{ gap: space.sm }}>
      <Choice
        testIDPrefix="zoom"
        label="Zoom of the drawing"
        value={zoom}
        onChange={setZoom}
        options={[
          { value: 'fit', label: 'Whole part' },
          { value: 'closer', label: 'Closer' },
          { value: 'closest', label: 'Closest' },
        ]}
      />
      <View onLayout={onLayout} style={styles.frame} testID="part-drawing">
        {width > 0 ? (
          <ScrollView
            horizontal
            showsHorizontalScrollIndicator
            contentContainerStyle={{ minWidth: width }}
            // Zoomed in, the drawing scrolls sideways: a keyboard can scroll it only if it takes focus.
            {...(scrolls ? { focusable: true, role: 'region', 'aria-label': 'Drawing, scrolls sideways' } : {})}
          >
            <Svg
              width={svgW}
              height={svgH}
              // One picture with its facts in words; each hole is in the holes list, so the marks are not read one by one.
              role="img"
              accessibilityLabel={`Drawing of the part with ${detail.holes.length} holes: ${summary}`}
            >
              {/* Drafting grid, one line per inch (or every 5 or 10 when zoomed out). */}
              <G opacity={0.9}>
                {Array.from({ length: Math.floor(spanX / gridStep) + 1 }, (_, i) => {
                  const x = proj.x(bounds.minX + i * gridStep);
                  return (
                    <Line
                      key={`gx${i}`}
                      x1={x}
                      y1={pad / 2}
                      x2={x}
                      y2={proj.height - pad / 2}
                      stroke={colors.grid}
                      strokeWidth={1}
                    />
                  );
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
              {/* The run being picked: a halo under each of its marks. */}
              {runPlaced.length ? (
                <Path
                  d={ringsPath(
                    runPlaced.map((h) => ({ x: proj.x(h.x), y: proj.y(h.y) })),
                    r + 4,
                  )}
                  fill={colors.accentSoft}
                  stroke={colors.accent}
                  strokeWidth={1}
                  aria-hidden
                />
              ) : null}
              {/* One path per status and layer, whatever the number of holes (see mark-paths.ts). */}
              {marks.map((m, i) => (
                <Path
                  key={i}
                  d={m.d}
                  fill={m.fill}
                  stroke={m.stroke}
                  strokeWidth={m.strokeWidth}
                  strokeLinecap={m.round ? 'round' : undefined}
                  strokeLinejoin={m.round ? 'round' : undefined}
                  aria-hidden
                />
              ))}
              {focusPlaced ? (
                <Circle
                  cx={proj.x(focusPlaced.x)}
                  cy={proj.y(focusPlaced.y)}
                  r={r + 6}
                  fill="none"
                  stroke={colors.accent}
                  strokeWidth={2.5}
                  aria-hidden
                />
              ) : null}
              {pickable
                ? placed.map((h) => (
                    <Circle
                      key={h.holeId}
                      cx={proj.x(h.x)}
                      cy={proj.y(h.y)}
                      r={hitRadius.get(h.holeId) ?? TARGET_MIN / 2}
                      fill="transparent"
                      onPress={() => onHolePress?.(h)}
                      aria-hidden
                      {...svgTestId(`drawing-hole-${h.holeId}`)}
                    />
                  ))
                : null}
              {/* Station ruler along the chord, from the leading edge. */}
              <G>
                <Line
                  x1={proj.x(bounds.minX)}
                  y1={proj.height + 6}
                  x2={proj.x(bounds.maxX)}
                  y2={proj.height + 6}
                  stroke={colors.ink}
                  strokeWidth={1}
                />
                {Array.from({ length: Math.floor(spanX / rulerStep) + 1 }, (_, i) => {
                  const xi = bounds.minX + i * rulerStep;
                  const x = proj.x(xi);
                  return (
                    <G key={`r${i}`}>
                      <Line
                        x1={x}
                        y1={proj.height + 2}
                        x2={x}
                        y2={proj.height + 10}
                        stroke={colors.ink}
                        strokeWidth={1}
                      />
                      <SvgText
                        x={x}
                        y={proj.height + 24}
                        fontSize={11}
                        fontFamily={fonts.mono}
                        fill={colors.inkSoft}
                        textAnchor="middle"
                      >
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
      {onHolePress && width > 0 && !pickable ? (
        <Txt variant="small" tone="soft" testID="drawing-pick-hint">
          Zoom closer to pick a hole on the drawing, or use the holes list.
        </Txt>
      ) : null}
    </View>
  );
}

const FRAME_BORDER = 1;

const styles = StyleSheet.create({
  frame: { borderWidth: FRAME_BORDER, borderColor: colors.ink, backgroundColor: colors.paper, overflow: 'hidden' },
});
