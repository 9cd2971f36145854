import { Pressable, StyleSheet, View } from 'react-native';
import { unitSystemLabels, unitSystems } from '@/constants/units';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { useUnits } from '@/hooks/use-units';
import { Mono } from './text';

/** in·lb or mm·N for every number on screen; the choice is kept on the device. */
export function UnitsSwitch() {
  const { system, setSystem } = useUnits();
  return (
    <View style={styles.wrap} accessibilityRole="radiogroup" accessibilityLabel="Units" testID="units-switch">
      {unitSystems.map((s) => {
        const on = s === system;
        return (
          <Pressable
            key={s}
            testID={`units-${s}`}
            accessibilityRole="radio"
            aria-checked={on}
            accessibilityLabel={s === 'imperial' ? 'Inches and pounds' : 'Millimetres and newtons'}
            onPress={() => setSystem(s)}
            style={[styles.opt, on && styles.on]}
          >
            <Mono variant="small" bold={on} tone={on ? 'inverse' : 'soft'}>{unitSystemLabels[s]}</Mono>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flexDirection: 'row', borderWidth: hairline, borderColor: colors.ruleStrong, borderRadius: radius.md, overflow: 'hidden' },
  opt: { minHeight: touch, minWidth: 64, paddingHorizontal: space.sm, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.paperRaised },
  on: { backgroundColor: colors.ink },
});
