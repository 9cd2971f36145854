import { Text, type TextProps, type TextStyle } from 'react-native';
import { colors, fonts, type as typeScale, type TextVariant } from '@/constants/theme';

type Props = TextProps & {
  variant?: TextVariant;
  bold?: boolean;
  tone?: 'ink' | 'soft' | 'faint' | 'accent' | 'error' | 'caution' | 'inverse';
  align?: TextStyle['textAlign'];
};

const toneColor = {
  ink: colors.ink, soft: colors.inkSoft, faint: colors.inkFaint, accent: colors.accent,
  error: colors.error, caution: colors.caution, inverse: colors.accentInk,
} as const;

/** Running text in Atkinson Hyperlegible. */
export function Txt({ variant = 'body', bold, tone = 'ink', align, style, ...rest }: Props) {
  const heading = variant === 'display' || variant === 'title' || variant === 'heading';
  return (
    <Text
      {...rest}
      style={[
        typeScale[variant],
        { color: toneColor[tone], fontFamily: bold || heading ? fonts.textBold : fonts.text, textAlign: align },
        variant === 'label' && { textTransform: 'uppercase' },
        style,
      ]}
    />
  );
}

/** Numbers, hole ids, codes: IBM Plex Mono so columns line up and 0/O, 1/l never mix. */
export function Mono({ variant = 'body', bold, tone = 'ink', align, style, ...rest }: Props) {
  return (
    <Text
      {...rest}
      style={[
        typeScale[variant],
        { color: toneColor[tone], fontFamily: bold ? fonts.monoBold : fonts.mono, textAlign: align, letterSpacing: 0 },
        style,
      ]}
    />
  );
}

export function Label(props: Props) {
  return <Txt variant="label" tone="soft" {...props} />;
}
