import { StyleSheet, View } from 'react-native';
import { unitSystemLabels, unitSystems } from '@/constants/units';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { useUnits } from '@/hooks/use-units';
import { Mono } from './text';
import { Toggle } from './toggle';

/** in·lb or mm·N for every number on screen; the choice is kept on the device. */
export function UnitsSwitch() {
  const { system, setSystem } = useUnits();
  return (
    <View style={styles.wrap} accessibilityRole="radiogroup" accessibilityLabel="Units" testID="units-switch">
      {unitSystems.map((s) => {
        const on = s === system;
        return (
          <Toggle
            key={s}
            kind="radio"
            checked={on}
            testID={`units-${s}`}
            accessibilityLabel={s === 'imperial' ? 'Inches and pounds' : 'Millimetres and newtons'}
            onPress={() => setSystem(s)}
            style={[styles.opt, s === unitSystems[0] ? styles.first : styles.last, on && styles.on]}
          >
            <Mono variant="small" bold={on} tone={on ? 'inverse' : 'soft'}>
              {unitSystemLabels[s]}
            </Mono>
          </Toggle>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  // Rounded by its ends rather than clipped: a clipping frame would cut off the focus ring.
  wrap: { flexDirection: 'row', borderWidth: hairline, borderColor: colors.ruleStrong, borderRadius: radius.md },
  first: { borderTopLeftRadius: radius.md - hairline, borderBottomLeftRadius: radius.md - hairline },
  last: { borderTopRightRadius: radius.md - hairline, borderBottomRightRadius: radius.md - hairline },
  opt: {
    minHeight: touch,
    minWidth: 64,
    paddingHorizontal: space.sm,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.paperRaised,
  },
  on: { backgroundColor: colors.ink },
});
