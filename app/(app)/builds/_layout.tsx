import { Stack } from 'expo-router';
import { colors } from '@/constants/theme';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export const unstable_settings = { initialRouteName: 'index' };

export default function Layout() {
  return <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: colors.paper } }} />;
}
