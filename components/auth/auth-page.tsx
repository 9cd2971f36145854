import { KeyboardAvoidingView, Platform, ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { colors, hairline, space } from '@/constants/theme';
import { Rule, Sheet } from '@/components/ui/sheet';
import { Mono, Txt } from '@/components/ui/text';

/**
 * The frame of the pages a person sees before they are in: sign in, join from an invitation, ask for
 * and set a new password. One narrow sheet under the product's name, readable on a phone at the bench.
 */
export function AuthPage({
  heading,
  children,
  testID,
}: {
  heading: string;
  children: React.ReactNode;
  testID?: string;
}) {
  const insets = useSafeAreaInsets();
  return (
    <KeyboardAvoidingView behavior={Platform.OS === 'ios' ? 'padding' : undefined} style={styles.page} testID={testID}>
      <ScrollView
        contentContainerStyle={[styles.scroll, { paddingTop: insets.top + space.xxl }]}
        keyboardShouldPersistTaps="handled"
      >
        <View style={styles.titleBlock}>
          <Txt variant="display">Pitchcard</Txt>
          <Txt tone="soft">Travelers and rivet inspection for riveted aluminum airframes.</Txt>
        </View>
        <Sheet style={styles.sheet}>
          <Txt variant="heading" accessibilityRole="header">
            {heading}
          </Txt>
          <Rule />
          {children}
        </Sheet>
        <View style={styles.foot}>
          <Mono variant="small" tone="faint">
            in · lb / mm · N
          </Mono>
          <Txt variant="small" tone="faint">
            An aid for the shop floor. The supplier’s approved data and your authority govern.
          </Txt>
        </View>
      </ScrollView>
    </KeyboardAvoidingView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.paper },
  scroll: {
    padding: space.lg,
    gap: space.xl,
    alignItems: 'stretch',
    width: '100%',
    maxWidth: 480,
    alignSelf: 'center',
  },
  titleBlock: { gap: space.xs, borderBottomWidth: 2, borderBottomColor: colors.ink, paddingBottom: space.md },
  sheet: { gap: space.lg },
  foot: { gap: space.xs, borderTopWidth: hairline, borderTopColor: colors.rule, paddingTop: space.md },
});
