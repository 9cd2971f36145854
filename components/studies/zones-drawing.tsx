import { useMemo } from 'react';
import { View } from 'react-native';
import Svg, { Circle, G, Line, Polygon, Polyline, Text as SvgText } from 'react-native-svg';
import { colors, fonts, space } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { Legend, LegendItem, LegendSwatch, PlotFrame, svgTestId } from './plot-frame';
import { boundsOf, monoWidth, splitOutline, stackLabels, surfaceAt, surfaceBetween } from './plot-scale';
import { pitchNumber } from './study-numbers';
import type { LineLoads, StudyCandidate } from './study-result';

const ZONE_TONES = [colors.accent, colors.ink];
const ROW_PX = 22;
const FONT = 12;
const PAD = 18;

type Dim = { key: string; surface: 'upper' | 'lower'; fromIn: number; toIn: number; label: string; tone: string };

/**
 * The pitch schedule on the rib: each zone's stretch of its line drawn as a bar along the surface, the
 * holes as marks, and above (upper lines) or below (lower lines) a dimension line per zone with its
 * pitch, stacked so no two labels overlap.
 */
export function ZonesDrawing({
  outline,
  chordIn,
  candidate,
  lines,
}: {
  outline: [number, number][];
  chordIn: number;
  candidate: StudyCandidate;
  lines: LineLoads[];
}) {
  const units = useUnits();
  const surfaces = useMemo(() => splitOutline(outline), [outline]);
  const box = useMemo(() => boundsOf(outline), [outline]);
  const surfaceOf = (i: number) => lines[i]?.surface ?? (i === 0 ? 'upper' : 'lower');
  const several = (side: 'upper' | 'lower') => candidate.lines.filter((_, i) => surfaceOf(i) === side).length > 1;

  const dims: Dim[] = candidate.lines.flatMap((l, i) =>
    l.zones.map((z, k) => ({
      key: `${i}-${k}`,
      surface: surfaceOf(i),
      fromIn: z.fromIn,
      toIn: z.toIn,
      label: `${several(surfaceOf(i)) ? `${lines[i]?.holePrefix ?? i + 1} ` : ''}${pitchNumber(z.pitchIn, units.system)}`,
      tone: ZONE_TONES[k % 2],
    })),
  );

  return (
    <View style={{ gap: space.md }} testID="zones-drawing">
      <PlotFrame placeholderHeight={220}>
        {(width) => {
          const spanX = Math.max(1e-6, box.maxX - box.minX);
          const scale = (width - 2 * PAD) / spanX;
          const px = (x: number) => PAD + (x - box.minX) * scale;
          const rowsOf = (side: 'upper' | 'lower') => {
            const mine = dims.filter((d) => d.surface === side);
            const rows = stackLabels(
              mine.map((d) => {
                const mid = (px(d.fromIn) + px(d.toIn)) / 2;
                const w = monoWidth(d.label, FONT) + 4;
                return { x0: mid - w / 2, x1: mid + w / 2 };
              }),
            );
            return { mine, rows, count: rows.length ? Math.max(...rows) + 1 : 0 };
          };
          const up = rowsOf('upper');
          const down = rowsOf('lower');
          const topBand = PAD + up.count * ROW_PX;
          const bottomBand = PAD + down.count * ROW_PX + 22;
          const height = topBand + (box.maxY - box.minY) * scale + bottomBand;
          const py = (y: number) => topBand + (box.maxY - y) * scale;
          const rowY = (side: 'upper' | 'lower', r: number) =>
            side === 'upper' ? topBand - 8 - r * ROW_PX : py(box.minY) + 12 + r * ROW_PX;

          const drawDims = (set: ReturnType<typeof rowsOf>, side: 'upper' | 'lower') =>
            set.mine.map((d, j) => {
              const y = rowY(side, set.rows[j]);
              const a = px(d.fromIn),
                b = px(d.toIn);
              const surfA = py(surfaceAt(side === 'upper' ? surfaces.upper : surfaces.lower, d.fromIn, side).y);
              const labelY = side === 'upper' ? y - 4 : y + FONT + 1;
              return (
                <G key={`dim-${d.key}`}>
                  <Line
                    x1={a}
                    y1={y}
                    x2={a}
                    y2={surfA}
                    stroke={colors.ruleStrong}
                    strokeWidth={0.75}
                    strokeDasharray="2 3"
                  />
                  <Line x1={a} y1={y} x2={b} y2={y} stroke={d.tone} strokeWidth={1} />
                  <Line x1={a} y1={y - 4} x2={a} y2={y + 4} stroke={d.tone} strokeWidth={1} />
                  <Line x1={b} y1={y - 4} x2={b} y2={y + 4} stroke={d.tone} strokeWidth={1} />
                  <SvgText
                    x={(a + b) / 2}
                    y={labelY}
                    fontSize={FONT}
                    fontFamily={fonts.monoBold}
                    fill={d.tone}
                    textAnchor="middle"
                  >
                    {d.label}
                  </SvgText>
                </G>
              );
            });

          return (
            <Svg
              width={width}
              height={height}
              accessibilityLabel={`Pitch zones of ${candidate.gaugeIn} in with ${candidate.rivet} on the rib`}
            >
              <Polygon
                points={outline.map(([x, y]) => `${px(x)},${py(y)}`).join(' ')}
                fill={colors.paperRaised}
                stroke={colors.ink}
                strokeWidth={1.25}
              />
              {candidate.lines.map((l, i) => {
                const side = surfaceOf(i);
                const surf = side === 'upper' ? surfaces.upper : surfaces.lower;
                return (
                  <G key={l.line} {...svgTestId(`zones-line-${i}`)}>
                    {l.zones.map((z, k) => (
                      <Polyline
                        key={k}
                        points={surfaceBetween(surf, z.fromIn, z.toIn, side)
                          .map(([x, y]) => `${px(x)},${py(y)}`)
                          .join(' ')}
                        fill="none"
                        stroke={ZONE_TONES[k % 2]}
                        strokeOpacity={0.55}
                        strokeWidth={6}
                        {...svgTestId(`zone-${i}-${k}`)}
                      />
                    ))}
                    {l.holes.map((h) => {
                      const p =
                        h.xIn !== undefined && h.yIn !== undefined
                          ? { x: h.xIn, y: h.yIn }
                          : surfaceAt(surf, h.stationIn, side);
                      return (
                        <Circle
                          key={h.id}
                          cx={px(p.x)}
                          cy={py(p.y)}
                          r={2.2}
                          fill={colors.paperRaised}
                          stroke={colors.ink}
                          strokeWidth={1}
                        />
                      );
                    })}
                  </G>
                );
              })}
              {drawDims(up, 'upper')}
              {drawDims(down, 'lower')}
              {/* Station ruler: one mark every tenth of the chord. */}
              <G>
                {Array.from({ length: 11 }, (_, k) => {
                  const x = px(box.minX + (k / 10) * chordIn);
                  const y = height - 10;
                  return (
                    <G key={k}>
                      <Line x1={x} y1={y - 8} x2={x} y2={y - 3} stroke={colors.ink} strokeWidth={1} />
                      {k % 2 === 0 ? (
                        <SvgText
                          x={x}
                          y={y + 6}
                          fontSize={11}
                          fontFamily={fonts.mono}
                          fill={colors.inkSoft}
                          textAnchor="middle"
                        >
                          {units.ruler((k / 10) * chordIn)}
                        </SvgText>
                      ) : null}
                    </G>
                  );
                })}
              </G>
            </Svg>
          );
        }}
      </PlotFrame>
      <Legend>
        <LegendItem swatch={<LegendSwatch color={ZONE_TONES[0]} mark="bar" />}>
          <Txt variant="small">one zone of one pitch (zones alternate shades)</Txt>
        </LegendItem>
        <LegendItem swatch={<LegendSwatch color={colors.ink} mark="dot" />}>
          <Txt variant="small">a hole</Txt>
        </LegendItem>
      </Legend>
      <Txt variant="small" tone="soft">
        Pitch labels in <Mono variant="small">{units.label('length')}</Mono>; upper lines dimensioned above the rib,
        lower lines below. Ruler in <Mono variant="small">{units.label('length')}</Mono> from the leading edge.
      </Txt>
    </View>
  );
}
