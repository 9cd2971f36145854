import { useState } from 'react';
import { Platform, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, Line, Polygon } from 'react-native-svg';
import { colors, space } from '@/constants/theme';

/** testID for SVG shapes: react-native-svg passes unknown props through to the DOM on the web. */
export function svgTestId(id: string): object {
  return Platform.OS === 'web' ? { 'data-testid': id } : { testID: id };
}

/** A bordered drawing area that measures its width and draws once it knows it. */
export function PlotFrame({
  children,
  testID,
  placeholderHeight = 200,
}: {
  children: (width: number) => React.ReactNode;
  testID?: string;
  placeholderHeight?: number;
}) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => {
    const w = Math.round(e.nativeEvent.layout.width);
    if (Math.abs(w - width) > 1) setWidth(w);
  };
  return (
    <View onLayout={onLayout} style={styles.frame} testID={testID}>
      {width > 0 ? children(width) : <View style={{ height: placeholderHeight }} />}
    </View>
  );
}

/** An arrowhead at (x, y) pointing along (dx, dy). */
export function ArrowHead({
  x,
  y,
  dx,
  dy,
  size,
  color,
}: {
  x: number;
  y: number;
  dx: number;
  dy: number;
  size: number;
  color: string;
}) {
  const len = Math.hypot(dx, dy) || 1;
  const ux = dx / len;
  const uy = dy / len;
  const bx = x - ux * size;
  const by = y - uy * size;
  const px = -uy * size * 0.5;
  const py = ux * size * 0.5;
  return <Polygon points={`${x},${y} ${bx + px},${by + py} ${bx - px},${by - py}`} fill={color} />;
}

/** A legend entry: a short sample of the stroke or mark beside its words. */
export function LegendSwatch({
  color,
  dash,
  mark,
}: {
  color: string;
  dash?: string;
  mark?: 'dot' | 'triangle' | 'arrow' | 'bar';
}) {
  return (
    <Svg width={34} height={16}>
      {mark === 'dot' ? (
        <Circle cx={17} cy={8} r={4} fill={color} />
      ) : mark === 'triangle' ? (
        <Polygon points="17,2 23,13 11,13" fill={colors.paperRaised} stroke={color} strokeWidth={1.75} />
      ) : mark === 'bar' ? (
        <Line x1={3} y1={8} x2={31} y2={8} stroke={color} strokeWidth={6} />
      ) : mark === 'arrow' ? (
        <>
          <Line x1={3} y1={8} x2={26} y2={8} stroke={color} strokeWidth={1.75} />
          <ArrowHead x={32} y={8} dx={1} dy={0} size={7} color={color} />
        </>
      ) : (
        <Line x1={2} y1={8} x2={32} y2={8} stroke={color} strokeWidth={2} strokeDasharray={dash} />
      )}
    </Svg>
  );
}

export function Legend({ children }: { children: React.ReactNode }) {
  return <View style={styles.legend}>{children}</View>;
}

export function LegendItem({ swatch, children }: { swatch: React.ReactNode; children: React.ReactNode }) {
  return (
    <View style={styles.item}>
      {swatch}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderWidth: 1, borderColor: colors.ink, backgroundColor: colors.paper, overflow: 'hidden' },
  legend: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xs },
  item: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
});
