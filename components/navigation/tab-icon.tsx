import Svg, { Circle, Line, Path, Rect } from 'react-native-svg';

export type TabGlyph =
  'bench' | 'parts' | 'findings' | 'review' | 'builds' | 'catalogue' | 'studies' | 'coupons' | 'session' | 'people';

/** Line drawings in the drafting style; the label under each says what it is. */
export function TabIcon({ glyph, color, size = 26 }: { glyph: TabGlyph; color: string; size?: number }) {
  const s = {
    stroke: color,
    strokeWidth: 2,
    fill: 'none',
    strokeLinecap: 'round' as const,
    strokeLinejoin: 'round' as const,
  };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24">
      {glyph === 'bench' && (
        <>
          <Path d="M3 8V4h4M17 4h4v4M21 16v4h-4M7 20H3v-4" {...s} />
          <Rect x={8} y={8} width={8} height={8} {...s} />
        </>
      )}
      {glyph === 'parts' && (
        <>
          <Path d="M3 14c4-6 14-7 18-3" {...s} />
          <Path d="M3 14h18v3H3z" {...s} />
          <Circle cx={7} cy={12.4} r={0.9} fill={color} />
          <Circle cx={11} cy={10.6} r={0.9} fill={color} />
          <Circle cx={15} cy={10.3} r={0.9} fill={color} />
        </>
      )}
      {glyph === 'findings' && <Path d="M12 4l9 16H3z M12 10v4 M12 17v0.5" {...s} />}
      {glyph === 'review' && (
        <>
          <Path d="M4 5h16M4 10h10M4 15h8M4 20h6" {...s} />
          <Path d="M14 17l2.5 2.5L21 14" {...s} />
        </>
      )}
      {glyph === 'builds' && (
        <>
          <Path d="M3 8l9-4 9 4v9l-9 4-9-4z" {...s} />
          <Path d="M3 8l9 4 9-4M12 12v9" {...s} />
        </>
      )}
      {glyph === 'catalogue' && (
        <>
          <Rect x={4} y={3} width={16} height={18} {...s} />
          <Line x1={8} y1={8} x2={16} y2={8} {...s} />
          <Line x1={8} y1={12} x2={16} y2={12} {...s} />
          <Line x1={8} y1={16} x2={13} y2={16} {...s} />
        </>
      )}
      {glyph === 'studies' && (
        <>
          <Path d="M3 15c3-5 12-6 18-2" {...s} />
          <Path d="M6 11V6M10 9.5V4M14 9V5M18 10V7" {...s} />
        </>
      )}
      {glyph === 'coupons' && (
        <>
          <Rect x={3} y={8} width={18} height={8} {...s} />
          <Circle cx={12} cy={12} r={1.6} {...s} />
          <Path d="M1 12h2M21 12h2" {...s} />
        </>
      )}
      {glyph === 'people' && (
        <>
          <Circle cx={9} cy={8} r={3.2} {...s} />
          <Path d="M2.5 20c.8-4 3.6-6 6.5-6s5.7 2 6.5 6" {...s} />
          <Circle cx={17} cy={7} r={2.6} {...s} />
          <Path d="M16.5 12.6c2.6 0 4.6 1.7 5.2 5" {...s} />
        </>
      )}
      {glyph === 'session' && (
        <>
          <Circle cx={12} cy={8} r={4} {...s} />
          <Path d="M4 21c1-5 5-7 8-7s7 2 8 7" {...s} />
        </>
      )}
    </Svg>
  );
}
