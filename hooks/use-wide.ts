import { useWindowDimensions } from 'react-native';
import { widePx } from '@/constants/theme';

/** Two panes from about 900 px; the phone gets one column. */
export function useWide(): boolean {
  const { width } = useWindowDimensions();
  return width >= widePx;
}
