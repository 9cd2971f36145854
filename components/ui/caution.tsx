import { StyleSheet, View } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { Txt } from './text';

export const cautionText =
  'An aid only. The supplier’s approved data, the applicable airworthiness rules and your local authority govern. ' +
  'Margins come from the inputs given. This is not certification.';

/** The caution line that goes wherever engineering numbers show. */
export function Caution({ text = cautionText, testID = 'caution' }: { text?: string; testID?: string }) {
  return (
    <View style={styles.box} testID={testID} accessibilityRole="text">
      <Txt variant="small" bold tone="caution">
        Caution
      </Txt>
      <Txt variant="small" tone="caution" style={{ flex: 1 }}>
        {text}
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    flexDirection: 'row',
    gap: space.sm,
    borderLeftWidth: 3,
    borderLeftColor: colors.caution,
    borderTopWidth: hairline,
    borderBottomWidth: hairline,
    borderColor: colors.rule,
    backgroundColor: colors.cautionSoft,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    flexWrap: 'wrap',
  },
});
