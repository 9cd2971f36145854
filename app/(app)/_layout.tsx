import { Tabs } from 'expo-router';
import { colors, fonts, hairline } from '@/constants/theme';
import { allTabRoutes, tabsFor } from '@/components/navigation/role-tabs';
import { TabIcon } from '@/components/navigation/tab-icon';
import { useSession } from '@/hooks/use-session';
import { useTickOutboxSender } from '@/hooks/use-tick-outbox';
import { useWide } from '@/hooks/use-wide';

export const unstable_settings = { initialRouteName: 'index' };

export default function AppLayout() {
  const { user } = useSession();
  useTickOutboxSender();
  const wide = useWide();
  const shown = tabsFor(user);
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
          minHeight: 64,
          ...(wide ? { minWidth: 200, width: 200 } : null),
        },
        tabBarActiveBackgroundColor: wide ? colors.accentSoft : undefined,
        tabBarLabelStyle: { fontFamily: fonts.textBold, fontSize: 14 },
        tabBarItemStyle: { minHeight: 56 },
        sceneStyle: { backgroundColor: colors.paper },
      }}
    >
      {allTabRoutes.map((name) => {
        const tab = shown.find((t) => t.name === name);
        return (
          <Tabs.Screen
            key={name}
            name={name}
            options={tab ? {
              title: tab.title,
              tabBarButtonTestID: tab.testID,
              tabBarAccessibilityLabel: tab.title,
              tabBarIcon: ({ color }) => <TabIcon glyph={tab.glyph} color={String(color)} />,
            } : { href: null }}
          />
        );
      })}
    </Tabs>
  );
}
