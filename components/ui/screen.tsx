import { useRouter, type Href } from 'expo-router';
import { TabIcon } from '@/components/navigation/tab-icon';
import { useRef, useState } from 'react';
import { Pressable, ScrollView, StyleSheet, useWindowDimensions, View, type ScrollViewProps } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { colors, hairline, space, touch } from '@/constants/theme';
import { useSession } from '@/hooks/use-session';
import { Button } from './button';
import { keepScrollReachable, useHeadingFocus } from './focus';
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
  /** The link to the person's own account page; off on that page itself. */
  accountLink?: boolean;
  /** Focus the title when the screen opens (a screen opened to do one thing, e.g. flag a hole). */
  focusTitle?: boolean;
};

/**
 * A window this short (a phone at 200 % text, a phone on its side) cannot spare a fixed header: the
 * header and tab bar left 175 of 422 px for the part. Below it the header scrolls away with the page.
 */
const SHORT_WINDOW = 560;

/** The title block of a sheet: title, what it is, and the controls that apply to the whole screen. */
export function ScreenHeader({ title, subtitle, backTo, account, right, accountLink = true, focusTitle }: HeaderProps) {
  const router = useRouter();
  const insets = useSafeAreaInsets();
  const { signOut, status, user } = useSession();
  const signedIn = status === 'signed-in';
  // Where the work continues: the title of a screen opened for one task, or of the first screen after
  // signing in (asked for by the sign-in form); taken once, when the screen opens.
  const titleRef = useRef<React.ComponentRef<typeof Txt>>(null);
  // In a short window the header scrolls away with the page, so it can give its words all the lines they need.
  const lines = useWindowDimensions().height < SHORT_WINDOW ? undefined : 2;
  useHeadingFocus(titleRef, !!focusTitle);
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
          <Txt
            ref={titleRef}
            variant="title"
            accessibilityRole="header"
            aria-level={1}
            numberOfLines={lines}
            testID="screen-title"
          >
            {title}
          </Txt>
          {subtitle ? (
            <Txt variant="small" tone="soft" numberOfLines={lines}>
              {subtitle}
            </Txt>
          ) : null}
        </View>
        <View style={styles.right}>
          {right}
          {account ? <UnitsSwitch /> : null}
          {signedIn && accountLink ? (
            // On every signed-in screen: the person's own page (password, sign out everywhere). Only the
            // figure on a detail screen, where the title needs the room; the first name beside it on a tab.
            <Pressable
              accessibilityRole="button"
              accessibilityLabel={`Your account${user ? `: ${user.name}` : ''}`}
              testID="account"
              hitSlop={4}
              onPress={() => router.push('/account')}
              style={({ pressed }) => [styles.account, pressed && { opacity: 0.75 }]}
            >
              <TabIcon glyph="session" color={colors.accent} size={22} />
              {account ? (
                <Txt bold tone="accent" numberOfLines={1}>
                  {firstName(user?.name)}
                </Txt>
              ) : null}
            </Pressable>
          ) : null}
          {account && signedIn ? (
            <Button label="Sign out" variant="quiet" compact testID="sign-out" onPress={() => void signOut()} />
          ) : null}
        </View>
      </View>
    </View>
  );
}

/** "Maren" of "Maren Holt": enough to recognise oneself by in a crowded header. */
function firstName(name: string | undefined): string {
  const first = (name ?? '').trim().split(/\s+/)[0] ?? '';
  return first.length > 14 ? `${first.slice(0, 13)}…` : first || 'Account';
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
  const { height } = useWindowDimensions();
  // Chosen once, when the screen opens: a phone's keyboard shortens the window too, and moving the
  // header then would remount it under the person typing.
  const [short] = useState(() => height < SHORT_WINDOW);
  const headerScrolls = scroll && short;
  const scrollRef = useRef<ScrollView>(null);
  const body = <View style={[styles.body, !full && styles.narrow]}>{children}</View>;
  return (
    <View style={styles.page} testID={testID}>
      {headerScrolls ? null : <ScreenHeader {...header} />}
      {scroll ? (
        <ScrollView
          ref={scrollRef}
          style={{ flex: 1 }}
          contentContainerStyle={[{ paddingBottom: space.xxl * 2 }, contentStyle]}
          keyboardShouldPersistTaps="handled"
          onContentSizeChange={() => keepScrollReachable(scrollRef.current, header.title)}
        >
          {headerScrolls ? <ScreenHeader {...header} /> : null}
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
  // May shrink and wrap: on a narrow window (200 % text) the units switch and the account link go onto
  // lines of their own instead of running off the edge.
  right: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    flexWrap: 'wrap',
    flexShrink: 1,
    maxWidth: '100%',
  },
  account: {
    minHeight: touch,
    minWidth: touch,
    paddingHorizontal: space.sm,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.xs,
  },
  body: { flex: 1, padding: space.lg, gap: space.xl, width: '100%', alignSelf: 'center' },
  narrow: { maxWidth: 760 },
});
