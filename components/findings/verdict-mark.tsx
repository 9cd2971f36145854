import { View } from 'react-native';
import Svg, { Circle, Path, Rect } from 'react-native-svg';
import { colors } from '@/constants/theme';
import { paperStroke } from '@/components/ui/status-mark';

/** Pass: a ringed tick in green. Fail: a square with a cross in red. Shape and colour both tell it. */
export function VerdictMark({ pass, size = 20 }: { pass: boolean; size?: number }) {
  const s = size;
  const k = s * 0.28;
  const c = s / 2;
  const strokeWidth = Math.max(1.6, s * 0.12);
  return (
    <View
      style={{ width: s, height: s }}
      role="img"
      aria-label={pass ? 'meets (tick in a circle)' : 'fails (cross in a square)'}
    >
      <Svg width={s} height={s} viewBox={`0 0 ${s} ${s}`}>
        {pass ? (
          <>
            <Circle cx={c} cy={c} r={c - 1} fill={colors.ok} />
            <Path
              d={`M ${c - k} ${c} L ${c - k * 0.25} ${c + k * 0.75} L ${c + k} ${c - k * 0.65}`}
              strokeWidth={strokeWidth}
              {...paperStroke}
            />
          </>
        ) : (
          <>
            <Rect x={1} y={1} width={s - 2} height={s - 2} fill={colors.error} />
            <Path
              d={`M ${c - k} ${c - k} L ${c + k} ${c + k} M ${c + k} ${c - k} L ${c - k} ${c + k}`}
              strokeWidth={strokeWidth}
              {...paperStroke}
            />
          </>
        )}
      </Svg>
    </View>
  );
}
