import { forwardRef } from 'react';
import { Pressable, StyleSheet, View, type PressableProps } from 'react-native';
import { colors } from '@/constants/theme';
import { installFocusRing } from './focus-ring';
import { Txt } from './text';

installFocusRing();

type KeyEvent = {
  key: string;
  repeat?: boolean;
  nativeEvent?: { repeat?: boolean };
  preventDefault: () => void;
  target: unknown;
  currentTarget: unknown;
};

/**
 * Space as well as Enter: react-native-web's Pressable presses on Enter for every role but on Space
 * only for buttons, so a checkbox or radio ignored Space and the page scrolled instead (a keyboard
 * user who pressed Space on "Rework" and then submitted recorded what was chosen before). Space is
 * taken on the control itself only, not from a field inside it, and held-down repeats are ignored.
 */
export function spaceActivates(
  onPress: (() => void) | undefined,
  disabled?: boolean | null,
  then?: (e: KeyEvent) => void,
) {
  return (e: KeyEvent) => {
    if ((e.key === ' ' || e.key === 'Spacebar') && e.target === e.currentTarget) {
      e.preventDefault();
      if (!disabled && !(e.repeat ?? e.nativeEvent?.repeat)) onPress?.();
    }
    then?.(e);
  };
}

export type ToggleProps = Omit<
  PressableProps,
  'role' | 'accessibilityRole' | 'onPress' | 'aria-checked' | 'aria-selected'
> & {
  /** A checkbox stands alone; a radio is one of a group (its parent carries role radiogroup). */
  kind: 'checkbox' | 'radio';
  checked: boolean;
  onPress: () => void;
};

/**
 * Every chip, box and option that is on or off: the checkbox or radio role with `aria-checked` (never
 * `aria-selected`, which these roles do not take), operated by tap, Enter and Space, with our focus ring.
 */
export const Toggle = forwardRef<View, ToggleProps>(function Toggle(
  { kind, checked, onPress, disabled, ...rest },
  ref,
) {
  const { onKeyDown } = rest as { onKeyDown?: (e: KeyEvent) => void };
  const keys = { onKeyDown: spaceActivates(onPress, disabled, onKeyDown) } as object;
  return (
    <Pressable
      ref={ref}
      accessibilityRole={kind}
      aria-checked={checked}
      aria-disabled={disabled || undefined}
      disabled={disabled}
      onPress={onPress}
      {...rest}
      {...keys}
    />
  );
});

/** The box a checkbox row draws (the row itself is the Toggle that carries the role and state). */
export function CheckBox({ on }: { on: boolean }) {
  return (
    <View style={[styles.box, on && { backgroundColor: colors.ink }]} aria-hidden>
      {on ? (
        <Txt bold tone="inverse" style={{ lineHeight: 20 }}>
          ✓
        </Txt>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    width: 28,
    height: 28,
    borderWidth: 2,
    borderColor: colors.ink,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.paperRaised,
  },
});
