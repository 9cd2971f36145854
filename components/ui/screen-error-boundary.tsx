import type { ErrorBoundaryProps } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { colors, space } from '@/constants/theme';
import { ErrorState } from './states';

/**
 * What a route shows when drawing it threw: Expo Router renders a route module's `ErrorBoundary` export
 * in place of that route. The error in plain words and "Try again" (which draws the route anew),
 * instead of a blank page. The root layout and every tab export it, so a screen that fails takes down
 * its own tab only, and the tab bar stays to go elsewhere.
 */
export function ScreenErrorBoundary({ error, retry }: ErrorBoundaryProps) {
  return (
    <View style={styles.page} testID="screen-error">
      <ErrorState
        error={error}
        title="This screen stopped working"
        onRetry={() => {
          void retry();
        }}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, padding: space.lg, backgroundColor: colors.paper },
});
