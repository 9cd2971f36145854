import { Tabs } from 'expo-router';
import { useWindowDimensions } from 'react-native';
import { colors, fonts, hairline } from '@/constants/theme';
import { allTabRoutes, mayOpen, tabsFor } from '@/components/navigation/role-tabs';
import { TabIcon } from '@/components/navigation/tab-icon';
import { TabLabel, tabLabelFit } from '@/components/navigation/tab-label';
import { useSession } from '@/hooks/use-session';
import { useWide } from '@/hooks/use-wide';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export const unstable_settings = { initialRouteName: 'index' };

export default function AppLayout() {
  const { user } = useSession();
  const wide = useWide();
  const { width } = useWindowDimensions();
  const shown = tabsFor(user);
  // A supplier's six tabs share a phone's width: their labels get a smaller size and a second line.
  const fit = tabLabelFit(width, shown.length, wide);
  return (
    <Tabs
      backBehavior="history"
      screenOptions={{
        headerShown: false,
        tabBarPosition: wide ? 'left' : 'bottom',
        tabBarVariant: wide ? 'material' : 'uikit',
        tabBarActiveTintColor: colors.accent,
        tabBarInactiveTintColor: colors.inkSoft,
        tabBarStyle: {
          backgroundColor: colors.paper,
          borderColor: colors.ink,
          borderTopWidth: wide ? 0 : hairline,
          borderRightWidth: wide ? hairline : 0,
          minHeight: fit.barMinHeight,
          ...(wide ? { minWidth: 200, width: 200 } : null),
        },
        tabBarActiveBackgroundColor: wide ? colors.accentSoft : undefined,
        tabBarLabelStyle: { fontFamily: fonts.textBold, fontSize: 14 },
        tabBarItemStyle: { minHeight: 56, ...(wide ? null : { paddingHorizontal: fit.itemPadding }) },
        sceneStyle: { backgroundColor: colors.paper },
      }}
    >
      {allTabRoutes.map((name) => {
        const tab = shown.find((t) => t.name === name);
        // Another role's page is closed: opened by a link, it sends the person to their own first page.
        return (
          <Tabs.Protected key={name} guard={mayOpen(user?.role, name)}>
            <Tabs.Screen
              name={name}
              options={
                tab
                  ? {
                      title: tab.title,
                      tabBarButtonTestID: tab.testID,
                      tabBarAccessibilityLabel: tab.title,
                      tabBarIcon: ({ color }) => <TabIcon glyph={tab.glyph} color={String(color)} />,
                      ...(wide
                        ? null
                        : {
                            tabBarLabel: ({ color }) => (
                              <TabLabel
                                text={fit.short ? (tab.short ?? tab.title) : tab.title}
                                color={String(color)}
                                fontSize={fit.fontSize}
                              />
                            ),
                          }),
                    }
                  : { href: null }
              }
            />
          </Tabs.Protected>
        );
      })}
    </Tabs>
  );
}
