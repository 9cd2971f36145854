import { Text } from 'react-native';
import { fonts } from '@/constants/theme';

/**
 * How the labels under the phone's tab icons fit: at 14 px "Approvals", "Catalogue" and "Load studies"
 * were cut to "Appro…" in a supplier's six 65 px tabs. Narrow tabs take 12 px, two lines and less padding;
 * the bar grows to hold the second line.
 */
export function tabLabelFit(
  width: number,
  tabs: number,
  wide: boolean,
): { fontSize: number; itemPadding: number; barMinHeight: number; short: boolean } {
  const perTab = width / Math.max(1, tabs);
  if (wide || perTab >= 96) return { fontSize: 14, itemPadding: 5, barMinHeight: 64, short: false };
  // Under 72 px a tab's long words ("Catalogue", "Approvals") do not fit whole even at 12 px: their short names do.
  return { fontSize: 12, itemPadding: 1, barMinHeight: 72, short: perTab < 72 };
}

/** A tab's label under its icon: whole words over at most two lines, never cut inside a word. */
export function TabLabel({ text, color, fontSize }: { text: string; color: string; fontSize: number }) {
  return (
    <Text
      numberOfLines={2}
      style={{
        color,
        fontFamily: fonts.textBold,
        fontSize,
        lineHeight: Math.round(fontSize * 1.2),
        textAlign: 'center',
        marginTop: 2,
      }}
    >
      {text}
    </Text>
  );
}
