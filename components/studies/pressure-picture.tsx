import { useMemo, useState } from 'react';
import { View } from 'react-native';
import Svg, { G, Line, Polygon, Polyline, Text as SvgText } from 'react-native-svg';
import { colors, fonts, space } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { ArrowHead, Legend, LegendItem, LegendSwatch, PlotFrame, svgTestId } from './plot-frame';
import {
  boundsOf,
  fitProjection,
  growBox,
  largestCp,
  pressureArrows,
  splitOutline,
  type PressureArrow,
  type Projection,
} from './plot-scale';
import type { StudyResult } from './study-result';

const SUCTION = colors.accent;
const PRESSURE = colors.caution;
/** The largest |Cp| of the study is drawn this fraction of the chord long. */
const REACH = 0.2;
const KPA_PER_PSI = 6.894757;

/** Which conditions' arrows to draw: every other sample is enough to read, all near the nose. */
function thinArrows(arrows: PressureArrow[]): PressureArrow[] {
  return arrows.filter((a, i) => a.xc < 0.06 || i % 2 === 0);
}

function Arrows({ arrows, proj, side }: { arrows: PressureArrow[]; proj: Projection; side: string }) {
  return (
    <G>
      {/* The curve through the arrow tips reads as the pressure distribution itself. */}
      <Polyline
        points={arrows.map((a) => `${proj.x(a.x1)},${proj.y(a.y1)}`).join(' ')}
        fill="none"
        stroke={colors.inkSoft}
        strokeWidth={1.25}
        {...svgTestId(`cp-curve-${side}`)}
      />
      {thinArrows(arrows).map((a, i) => {
        const x0 = proj.x(a.x0),
          y0 = proj.y(a.y0),
          x1 = proj.x(a.x1),
          y1 = proj.y(a.y1);
        const len = Math.hypot(x1 - x0, y1 - y0);
        if (len < 1.5) return null;
        const color = a.suction ? SUCTION : PRESSURE;
        const head = Math.min(6, len * 0.45);
        return (
          <G key={i}>
            <Line x1={x0} y1={y0} x2={x1} y2={y1} stroke={color} strokeWidth={1.1} />
            {len > 5 ? (
              a.suction ? (
                <ArrowHead x={x1} y={y1} dx={x1 - x0} dy={y1 - y0} size={head} color={color} />
              ) : (
                <ArrowHead x={x0} y={y0} dx={x0 - x1} dy={y0 - y1} size={head} color={color} />
              )
            ) : null}
          </G>
        );
      })}
    </G>
  );
}

/**
 * The rib outline with the chordwise pressure of one flight condition drawn normal to its surface:
 * suction arrows point away from the skin (it pulls the skin off the rib flange, the load the rivets
 * carry), pressure arrows point at it. Every condition is drawn to the same scale.
 */
export function PressurePicture({ result, internalCp = 0 }: { result: StudyResult; internalCp?: number }) {
  const units = useUnits();
  const conditions = result.conditions;
  const [id, setId] = useState(conditions[0]?.id ?? '');
  const c = conditions.find((x) => x.id === id) ?? conditions[0];
  const chord = result.outline.chordIn;
  const surfaces = useMemo(() => splitOutline(result.outline.points), [result.outline.points]);
  const maxCp = useMemo(() => Math.max(0.5, largestCp(conditions, internalCp)), [conditions, internalCp]);
  const perCp = (REACH * chord) / maxCp;

  if (!c) return <Txt tone="soft">This result has no flight conditions to draw.</Txt>;
  const upper = pressureArrows(surfaces.upper, c.cp.upper, 'upper', chord, perCp, internalCp);
  const lower = pressureArrows(surfaces.lower, c.cp.lower, 'lower', chord, perCp, internalCp);
  const box = growBox(
    boundsOf([...result.outline.points, ...[...upper, ...lower].map((a): [number, number] => [a.x1, a.y1])]),
    { right: chord * 0.02 },
  );
  const peak = [
    ...c.cp.upper.map((s) => ({ ...s, side: 'upper' })),
    ...c.cp.lower.map((s) => ({ ...s, side: 'lower' })),
  ].reduce((m, s) => (s.cp < m.cp ? s : m), { xc: 0, cp: Infinity, side: 'upper' });
  const q = units.system === 'metric' ? `${(c.qPsi * KPA_PER_PSI).toFixed(2)} kPa` : `${c.qPsi.toFixed(3)} psi`;

  return (
    <View style={{ gap: space.md }} testID="pressure-picture">
      <Choice
        testIDPrefix="cp-condition"
        value={c.id}
        onChange={setId}
        options={conditions.map((x) => ({ value: x.id, label: x.label }))}
      />
      <PlotFrame testID="pressure-plot" placeholderHeight={260}>
        {(width) => {
          const proj = fitProjection(box, width, 18, 460);
          const unitCp = perCp * proj.scale;
          return (
            <Svg
              width={width}
              height={proj.height + 26}
              accessibilityLabel={`Pressure on the rib, ${c.label}: peak suction Cp ${peak.cp.toFixed(2)} on the ${peak.side} surface`}
            >
              <Line
                x1={proj.x(0)}
                y1={proj.y(0)}
                x2={proj.x(chord)}
                y2={proj.y(0)}
                stroke={colors.ruleStrong}
                strokeWidth={1}
                strokeDasharray="8 4 2 4"
              />
              <Polygon
                points={result.outline.points.map(([x, y]) => `${proj.x(x)},${proj.y(y)}`).join(' ')}
                fill={colors.paperRaised}
                stroke={colors.ink}
                strokeWidth={1.5}
                {...svgTestId('cp-outline')}
              />
              <Arrows arrows={upper} proj={proj} side="upper" />
              <Arrows arrows={lower} proj={proj} side="lower" />
              {/* Scale bar: how long Cp = 1 is drawn. */}
              <G>
                <Line
                  x1={width - 18 - unitCp}
                  y1={proj.height + 12}
                  x2={width - 18}
                  y2={proj.height + 12}
                  stroke={colors.ink}
                  strokeWidth={2}
                />
                {[width - 18 - unitCp, width - 18].map((x, end) => (
                  <Line
                    key={end}
                    x1={x}
                    y1={proj.height + 7}
                    x2={x}
                    y2={proj.height + 17}
                    stroke={colors.ink}
                    strokeWidth={1}
                  />
                ))}
                <SvgText
                  x={width - 24 - unitCp}
                  y={proj.height + 16}
                  fontSize={12}
                  fontFamily={fonts.mono}
                  fill={colors.ink}
                  textAnchor="end"
                >
                  Cp 1.0
                </SvgText>
                <SvgText x={18} y={proj.height + 16} fontSize={12} fontFamily={fonts.mono} fill={colors.inkSoft}>
                  LE
                </SvgText>
              </G>
            </Svg>
          );
        }}
      </PlotFrame>
      <Legend>
        <LegendItem swatch={<LegendSwatch color={SUCTION} mark="arrow" />}>
          <Txt variant="small">suction: pulls the skin off the flange</Txt>
        </LegendItem>
        <LegendItem swatch={<LegendSwatch color={PRESSURE} mark="arrow" />}>
          <Txt variant="small">pressure: pushes the skin on</Txt>
        </LegendItem>
      </Legend>
      <Txt variant="small" testID="cp-condition-facts">
        <Mono variant="small" bold>
          n {c.n.toFixed(2)}
        </Mono>{' '}
        · <Mono variant="small">{Math.round(c.speedKeas)} KEAS</Mono> · q <Mono variant="small">{q}</Mono> · CL{' '}
        <Mono variant="small">{c.clNeeded.toFixed(2)}</Mono> · α <Mono variant="small">{c.alphaDeg.toFixed(1)}°</Mono> ·
        peak suction Cp{' '}
        <Mono variant="small" bold>
          {peak.cp.toFixed(2)}
        </Mono>{' '}
        at x/c <Mono variant="small">{peak.xc.toFixed(3)}</Mono> on the {peak.side} surface · {c.pressureSource}
      </Txt>
    </View>
  );
}
