import { StyleSheet, View, type ViewProps } from 'react-native';
import { colors, hairline, radius, space } from '@/constants/theme';
import { Label, Txt } from './text';

/** A sheet of the drawing: raised paper with a thin rule round it. */
export function Sheet({ style, ...rest }: ViewProps) {
  return <View {...rest} style={[styles.sheet, style]} />;
}

export function Rule({ strong, style }: { strong?: boolean; style?: ViewProps['style'] }) {
  return <View style={[{ height: hairline, backgroundColor: strong ? colors.ruleStrong : colors.rule }, style]} />;
}

/** A titled block on a screen, like a boxed area on a drawing with its name in the corner. */
export function Section({
  title,
  aside,
  children,
  testID,
  style,
}: {
  title: string;
  aside?: React.ReactNode;
  children?: React.ReactNode;
  testID?: string;
  style?: ViewProps['style'];
}) {
  return (
    <View testID={testID} style={[styles.section, style]}>
      <View style={styles.head}>
        <Label accessibilityRole="header" style={{ flex: 1 }}>
          {title}
        </Label>
        {aside}
      </View>
      <Rule strong />
      <View style={{ gap: space.md, paddingTop: space.md }}>{children}</View>
    </View>
  );
}

/** Term and value on one line, the value in the monospaced face when it is a number. */
export function KeyValue({ label, children, testID }: { label: string; children: React.ReactNode; testID?: string }) {
  return (
    <View style={styles.kv} testID={testID}>
      <Txt variant="small" tone="soft" style={{ minWidth: 120 }}>
        {label}
      </Txt>
      {/* minWidth 0: a long unbroken value (an address) may narrow the column instead of pushing it off the screen. */}
      <View style={{ flex: 1, minWidth: 0, alignItems: 'flex-start' }}>
        {typeof children === 'string' ? <Txt>{children}</Txt> : children}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  sheet: {
    backgroundColor: colors.paperRaised,
    borderColor: colors.rule,
    borderWidth: hairline,
    borderRadius: radius.sm,
    padding: space.lg,
    gap: space.md,
  },
  section: { gap: 0 },
  head: { flexDirection: 'row', alignItems: 'flex-end', paddingBottom: space.xs, gap: space.sm, minHeight: 28 },
  kv: { flexDirection: 'row', alignItems: 'baseline', gap: space.md, flexWrap: 'wrap' },
});
