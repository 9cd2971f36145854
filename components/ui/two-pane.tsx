import { View } from 'react-native';
import { space } from '@/constants/theme';
import { useWide } from '@/hooks/use-wide';

/** One column on a phone; side by side from about 900 px. */
export function TwoPane({
  left,
  right,
  leftWidth = 0.55,
}: {
  left: React.ReactNode;
  right: React.ReactNode;
  leftWidth?: number;
}) {
  const wide = useWide();
  if (!wide) {
    return (
      <View style={{ gap: space.xl }}>
        {left}
        {right}
      </View>
    );
  }
  return (
    <View style={{ flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' }}>
      <View style={{ flex: leftWidth, gap: space.xl, minWidth: 0 }}>{left}</View>
      <View style={{ flex: 1 - leftWidth, gap: space.xl, minWidth: 0 }}>{right}</View>
    </View>
  );
}
