import { forwardRef } from 'react';
import {
  ActivityIndicator,
  Pressable,
  StyleSheet,
  View,
  type PressableProps,
  type StyleProp,
  type ViewStyle,
} from 'react-native';
import { colors, fonts, radius, space, touch, type as typeScale } from '@/constants/theme';
import { installFocusRing } from './focus-ring';
import { Txt } from './text';

installFocusRing();

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

type Props = Omit<PressableProps, 'children' | 'style'> & {
  label: string;
  variant?: Variant;
  busy?: boolean;
  /** Text shown while busy; the label otherwise. */
  busyLabel?: string;
  compact?: boolean;
  icon?: React.ReactNode;
  style?: StyleProp<ViewStyle>;
  /** A button that stays pressed in (a mode that is on): `aria-pressed`, as a button takes no `aria-selected`. */
  selected?: boolean;
};

export const Button = forwardRef<View, Props>(function Button(
  {
    label,
    variant = 'primary',
    busy,
    busyLabel,
    disabled,
    compact,
    icon,
    style,
    selected,
    accessibilityLabel,
    ...rest
  },
  ref,
) {
  const off = disabled || busy;
  const filled = variant === 'primary' || variant === 'danger' || selected;
  const bg = variant === 'danger' ? colors.error : colors.accent;
  return (
    <Pressable
      ref={ref}
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel ?? label}
      aria-disabled={!!off}
      aria-busy={!!busy}
      aria-pressed={selected}
      disabled={off}
      hitSlop={4}
      {...rest}
      style={({ pressed }) => [
        styles.base,
        compact && styles.compact,
        filled && { backgroundColor: bg, borderColor: bg },
        variant === 'secondary' && !selected && styles.secondary,
        variant === 'quiet' && !selected && styles.quiet,
        pressed && !off && { opacity: 0.75 },
        off && { opacity: 0.45 },
        style,
      ]}
    >
      <View style={styles.row}>
        {busy ? <ActivityIndicator size="small" color={filled ? colors.accentInk : colors.accent} /> : icon}
        <Txt numberOfLines={2} style={[styles.text, { color: filled ? colors.accentInk : colors.accent }]}>
          {busy && busyLabel ? busyLabel : label}
        </Txt>
      </View>
    </Pressable>
  );
});

const styles = StyleSheet.create({
  base: {
    minHeight: touch,
    minWidth: touch,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    borderRadius: radius.md,
    borderWidth: 2,
    justifyContent: 'center',
    alignItems: 'center',
  },
  compact: { paddingHorizontal: space.md },
  secondary: { backgroundColor: colors.paperRaised, borderColor: colors.accent },
  quiet: { backgroundColor: 'transparent', borderColor: 'transparent' },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  text: { ...typeScale.body, fontFamily: fonts.textBold },
});
