import { useState } from 'react';
import { View } from 'react-native';
import Svg, { Circle, G, Line, Polygon, Text as SvgText } from 'react-native-svg';
import { toDisplay } from '@/constants/units';
import { colors, fonts, space } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { Legend, LegendItem, LegendSwatch, PlotFrame, svgTestId } from './plot-frame';
import { linearScale, niceAxis, tickLabel } from './plot-scale';
import type { StudyCandidate } from './study-result';

const LIMIT = colors.ink;
const ULTIMATE = colors.accent;
const M = { left: 58, right: 14, top: 14, bottom: 46 };
const HEIGHT = 300;

export type LoadSeries = {
  xs: number[];
  limit: number[];
  ultimate: number[];
  limitAllowable: number;
  ultimateAllowable: number;
  x: { lo: number; hi: number; step: number; ticks: number[] };
  y: { lo: number; hi: number; step: number; ticks: number[] };
};

/**
 * The plot's data in display units: station along the chord against load per rivet, and the axes that
 * hold every point and both allowables with a little room above.
 */
export function loadSeries(
  holes: { stationIn: number; appliedLimitLb: number; appliedUltimateLb: number }[],
  allowables: { tensionLimitLb: number; tensionUltimateLb: number },
  chordIn: number,
  system: 'imperial' | 'metric',
): LoadSeries {
  const len = (v: number) => toDisplay('length', v, system);
  const f = (v: number) => toDisplay('force', v, system);
  const xs = holes.map((h) => len(h.stationIn));
  const limit = holes.map((h) => f(h.appliedLimitLb));
  const ultimate = holes.map((h) => f(h.appliedUltimateLb));
  const limitAllowable = f(allowables.tensionLimitLb);
  const ultimateAllowable = f(allowables.tensionUltimateLb);
  const top = Math.max(limitAllowable, ultimateAllowable, ...ultimate, ...limit, 1e-6) * 1.08;
  return {
    xs,
    limit,
    ultimate,
    limitAllowable,
    ultimateAllowable,
    x: niceAxis(0, Math.max(len(chordIn), ...xs), 6),
    y: niceAxis(0, top, 5),
  };
}

/**
 * Per-rivet limit and ultimate load along the chord for one candidate, against the allowables: every
 * mark below its line is a rivet that holds.
 */
export function LoadPlot({ candidate, chordIn }: { candidate: StudyCandidate; chordIn: number }) {
  const units = useUnits();
  const [lineIdx, setLineIdx] = useState(0);
  const line = candidate.lines[Math.min(lineIdx, candidate.lines.length - 1)];
  if (!line) return <Txt tone="soft">This candidate has no fastener lines.</Txt>;
  const s = loadSeries(line.holes, line.allowables, chordIn, units.system);
  const lu = units.label('length');
  const fu = units.label('force');
  const over = line.holes.filter((h) => (h.msLimit ?? 0) < 0 || (h.msUltimate ?? 0) < 0).length;

  return (
    <View style={{ gap: space.md }} testID="load-plot">
      {candidate.lines.length > 1 ? (
        <Choice
          testIDPrefix="load-line"
          value={String(lineIdx)}
          onChange={(v) => setLineIdx(Number(v))}
          options={candidate.lines.map((l, i) => ({ value: String(i), label: l.line }))}
        />
      ) : null}
      <PlotFrame placeholderHeight={HEIGHT}>
        {(width) => {
          const sx = linearScale(s.x.lo, s.x.hi, M.left, width - M.right);
          const sy = linearScale(s.y.lo, s.y.hi, HEIGHT - M.bottom, M.top);
          const x0 = M.left,
            x1 = width - M.right,
            yBase = HEIGHT - M.bottom;
          const xEvery = Math.max(1, Math.ceil((s.x.ticks.length * 44) / Math.max(1, x1 - x0)));
          return (
            <Svg
              width={width}
              height={HEIGHT}
              accessibilityLabel={`Load per rivet along ${line.line}: ${line.holes.length} rivets, limit allowable ${units.force(line.allowables.tensionLimitLb)}, ultimate allowable ${units.force(line.allowables.tensionUltimateLb)}`}
            >
              {s.y.ticks.map((t) => (
                <G key={`y${t}`}>
                  <Line x1={x0} y1={sy(t)} x2={x1} y2={sy(t)} stroke={colors.grid} strokeWidth={1} />
                  <SvgText
                    x={x0 - 6}
                    y={sy(t) + 4}
                    fontSize={12}
                    fontFamily={fonts.mono}
                    fill={colors.inkSoft}
                    textAnchor="end"
                  >
                    {tickLabel(t, s.y.step)}
                  </SvgText>
                </G>
              ))}
              {s.x.ticks.map((t, i) => (
                <G key={`x${t}`}>
                  <Line x1={sx(t)} y1={yBase} x2={sx(t)} y2={yBase + 5} stroke={colors.ink} strokeWidth={1} />
                  {i % xEvery === 0 ? (
                    <SvgText
                      x={sx(t)}
                      y={yBase + 18}
                      fontSize={12}
                      fontFamily={fonts.mono}
                      fill={colors.inkSoft}
                      textAnchor={i === s.x.ticks.length - 1 ? 'end' : i === 0 ? 'start' : 'middle'}
                    >
                      {tickLabel(t, s.x.step)}
                    </SvgText>
                  ) : null}
                </G>
              ))}
              <Line x1={x0} y1={yBase} x2={x1} y2={yBase} stroke={colors.ink} strokeWidth={1.25} />
              <Line x1={x0} y1={M.top} x2={x0} y2={yBase} stroke={colors.ink} strokeWidth={1.25} />
              <SvgText
                x={(x0 + x1) / 2}
                y={HEIGHT - 8}
                fontSize={12}
                fontFamily={fonts.text}
                fill={colors.inkSoft}
                textAnchor="middle"
              >
                station aft of the leading edge, {lu}
              </SvgText>
              <SvgText
                x={14}
                y={(M.top + yBase) / 2}
                fontSize={12}
                fontFamily={fonts.text}
                fill={colors.inkSoft}
                textAnchor="middle"
                transform={`rotate(-90 14 ${(M.top + yBase) / 2})`}
              >
                load per rivet, {fu}
              </SvgText>

              {[
                { id: 'allowable-ultimate', at: s.ultimateAllowable, stroke: ULTIMATE, dash: '10 5' },
                { id: 'allowable-limit', at: s.limitAllowable, stroke: LIMIT, dash: '3 4' },
              ].map((a) => (
                <Line
                  key={a.id}
                  x1={x0}
                  y1={sy(a.at)}
                  x2={x1}
                  y2={sy(a.at)}
                  stroke={a.stroke}
                  strokeWidth={2}
                  strokeDasharray={a.dash}
                  {...svgTestId(a.id)}
                />
              ))}

              {s.xs.map((x, i) => {
                const h = line.holes[i];
                const bad = (h.msLimit ?? 0) < 0 || (h.msUltimate ?? 0) < 0;
                const cx = sx(x);
                const uy = sy(s.ultimate[i]);
                return (
                  <G key={h.id}>
                    <Polygon
                      points={`${cx},${uy - 5} ${cx + 4.5},${uy + 3.5} ${cx - 4.5},${uy + 3.5}`}
                      fill={colors.paperRaised}
                      stroke={bad ? colors.error : ULTIMATE}
                      strokeWidth={1.5}
                    />
                    <Circle cx={cx} cy={sy(s.limit[i])} r={3} fill={bad ? colors.error : LIMIT} />
                  </G>
                );
              })}
            </Svg>
          );
        }}
      </PlotFrame>
      <Legend>
        <LegendItem swatch={<LegendSwatch color={LIMIT} mark="dot" />}>
          <Txt variant="small">limit load per rivet</Txt>
        </LegendItem>
        <LegendItem swatch={<LegendSwatch color={ULTIMATE} mark="triangle" />}>
          <Txt variant="small">ultimate load per rivet (1.5 × limit)</Txt>
        </LegendItem>
        <LegendItem swatch={<LegendSwatch color={LIMIT} dash="3 4" />}>
          <Txt variant="small">
            limit allowable{' '}
            <Mono variant="small" bold>
              {units.force(line.allowables.tensionLimitLb)}
            </Mono>
          </Txt>
        </LegendItem>
        <LegendItem swatch={<LegendSwatch color={ULTIMATE} dash="10 5" />}>
          <Txt variant="small">
            ultimate allowable{' '}
            <Mono variant="small" bold>
              {units.force(line.allowables.tensionUltimateLb)}
            </Mono>
          </Txt>
        </LegendItem>
      </Legend>
      <Txt variant="small" tone={over ? 'error' : 'soft'} testID="load-plot-summary">
        {line.line}:{' '}
        <Mono variant="small" bold>
          {line.holes.length}
        </Mono>{' '}
        rivets
        {over ? (
          <>
            ,{' '}
            <Mono variant="small" bold>
              {over}
            </Mono>{' '}
            above an allowable (marked red)
          </>
        ) : (
          ', every one under both allowables'
        )}
        {' · '}pull-through allowable from{' '}
        {line.allowables.tensionBasis === 'coupons' ? 'your coupon tests' : 'the conservative fallback (no coupons)'}
      </Txt>
    </View>
  );
}
