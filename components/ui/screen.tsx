import { useRouter, type Href } from 'expo-router';
import { ScrollView, StyleSheet, View, type ScrollViewProps } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { colors, hairline, space, touch } from '@/constants/theme';
import { useSession } from '@/hooks/use-session';
import { Button } from './button';
import { Txt } from './text';
import { UnitsSwitch } from './units-switch';

type HeaderProps = {
  title: string;
  subtitle?: string;
  /** Where "Back" goes when there is no history (a deep link, a reload). */
  backTo?: Href;
  /** Tab screens show the units switch and sign-out. */
  account?: boolean;
  right?: React.ReactNode;
};

/** The title block of a sheet: title, what it is, and the controls that apply to the whole screen. */
export function ScreenHeader({ title, subtitle, backTo, account, right }: HeaderProps) {
  const router = useRouter();
  const insets = useSafeAreaInsets();
  const { signOut, status } = useSession();
  return (
    <View style={[styles.header, { paddingTop: insets.top + space.sm }]}>
      <View style={styles.headerRow}>
        {backTo ? (
          <Button
            label="‹ Back"
            variant="quiet"
            compact
            testID="back"
            accessibilityLabel="Back"
            onPress={() => (router.canGoBack() ? router.back() : router.replace(backTo))}
            style={{ marginLeft: -space.md }}
          />
        ) : null}
        <View style={{ flex: 1, minWidth: 160 }}>
          <Txt variant="title" accessibilityRole="header" numberOfLines={2} testID="screen-title">{title}</Txt>
          {subtitle ? <Txt variant="small" tone="soft" numberOfLines={2}>{subtitle}</Txt> : null}
        </View>
        <View style={styles.right}>
          {right}
          {account ? <UnitsSwitch /> : null}
          {account && status === 'signed-in' ? (
            <Button label="Sign out" variant="quiet" compact testID="sign-out" onPress={() => void signOut()} />
          ) : null}
        </View>
      </View>
    </View>
  );
}

type ScreenProps = HeaderProps & {
  children: React.ReactNode;
  /** Screens whose body is a FlatList scroll it themselves. */
  scroll?: boolean;
  contentStyle?: ScrollViewProps['contentContainerStyle'];
  testID?: string;
  /** Drop the max width, e.g. for tables and two-pane layouts. */
  full?: boolean;
};

export function Screen({ children, scroll = true, contentStyle, testID, full, ...header }: ScreenProps) {
  const body = (
    <View style={[styles.body, !full && styles.narrow]}>{children}</View>
  );
  return (
    <View style={styles.page} testID={testID}>
      <ScreenHeader {...header} />
      {scroll ? (
        <ScrollView
          style={{ flex: 1 }}
          contentContainerStyle={[{ paddingBottom: space.xxl * 2 }, contentStyle]}
          keyboardShouldPersistTaps="handled"
        >
          {body}
        </ScrollView>
      ) : (
        <View style={{ flex: 1 }}>{body}</View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.paper },
  header: {
    paddingHorizontal: space.lg,
    paddingBottom: space.sm,
    borderBottomWidth: hairline,
    borderBottomColor: colors.ink,
    backgroundColor: colors.paper,
  },
  headerRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap', minHeight: touch },
  right: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  body: { flex: 1, padding: space.lg, gap: space.xl, width: '100%', alignSelf: 'center' },
  narrow: { maxWidth: 760 },
});
