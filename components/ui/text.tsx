import { Platform, Text, type TextProps, type TextStyle } from 'react-native';
import { colors, fonts, type as typeScale, type TextVariant } from '@/constants/theme';

type Props = TextProps & {
  /** The text's node, e.g. to move focus to a heading (a plain prop since React 19). */
  ref?: React.Ref<Text>;
  variant?: TextVariant;
  bold?: boolean;
  tone?: 'ink' | 'soft' | 'faint' | 'accent' | 'error' | 'caution' | 'warning' | 'inverse';
  align?: TextStyle['textAlign'];
};

const toneColor = {
  ink: colors.ink,
  soft: colors.inkSoft,
  faint: colors.inkFaint,
  accent: colors.accent,
  error: colors.error,
  caution: colors.caution,
  warning: colors.warning,
  inverse: colors.accentInk,
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

/** The longest text still read as one value (a callout, a size with its unit, a hole id, "8 / 55"). */
const TOKEN_MAX = 24;

function plain(children: React.ReactNode): string | null {
  if (typeof children === 'string' || typeof children === 'number') return String(children);
  if (Array.isArray(children)) {
    let s = '';
    for (const c of children) {
      const p = plain(c);
      if (p === null) return null;
      s += p;
    }
    return s;
  }
  return children == null || typeof children === 'boolean' ? '' : null;
}

/**
 * A value is read whole or not at all: "MS20470AD4", "#30", "0.125 in", "U-03" broken over two lines
 * read as two values (at 200 % text a narrow cell broke them mid-value). So on the web a short value
 * never wraps inside; the line breaks before it instead. Longer monospaced text (an address, a
 * fingerprint, a mail) wraps as running text does.
 */
const keepWhole = Platform.OS === 'web' ? ({ whiteSpace: 'nowrap' } as unknown as TextStyle) : null;
/** An address has no spaces to break at: it may break anywhere rather than run off a phone's screen. */
const breakAnywhere = Platform.OS === 'web' ? ({ overflowWrap: 'anywhere' } as unknown as TextStyle) : null;

/** Numbers, hole ids, codes: IBM Plex Mono so columns line up and 0/O, 1/l never mix. */
export function Mono({
  variant = 'body',
  bold,
  tone = 'ink',
  align,
  style,
  children,
  wrap,
  ...rest
}: Props & {
  /** Long monospaced text that may wrap anywhere a line of text would. */
  wrap?: boolean;
}) {
  const text = plain(children);
  // An address (e-mail or link) is no value read at a glance, and a phone's row may be narrower than it.
  const address = text !== null && (text.includes('@') || text.includes('://'));
  // A short value stays on one line; a list of values (", " or " · " between them) breaks between them.
  const listed = text !== null && /,\s|\s·\s/.test(text);
  const whole = !wrap && !address && !listed && rest.numberOfLines == null && text !== null && text.length <= TOKEN_MAX;
  // A longer run of values ("U-11 U-12 U-13 …", "0.016 in · MS20426AD3") breaks between them, never
  // inside one: a browser would break "U-12" after its hyphen, or a number from its unit.
  const byToken = keepWhole && !whole && !wrap && !address && rest.numberOfLines == null && text !== null;
  return (
    <Text
      {...rest}
      style={[
        typeScale[variant],
        { color: toneColor[tone], fontFamily: bold ? fonts.monoBold : fonts.mono, textAlign: align, letterSpacing: 0 },
        whole && keepWhole,
        address && breakAnywhere,
        style,
      ]}
    >
      {byToken ? tokensKeptWhole(text) : children}
    </Text>
  );
}

/** A unit, a clock's half-day or a separator: kept on the line of what it follows. */
const FOLLOWER = /^(in|mm|lb|N|kN|kg|g|psf|psi|D|AM|PM|ft|m|m²|kg\/m²|°|%|·|–|\/)[,.;:]?$/;

/** Groups of words read as one value: "0.016 in", "12:46 PM"; a separator stays with what it follows. */
export function valueGroups(text: string): string[] {
  const groups: string[] = [];
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (groups.length && FOLLOWER.test(word)) groups[groups.length - 1] += ` ${word}`;
    else groups.push(word);
  }
  return groups;
}

function tokensKeptWhole(text: string): React.ReactNode[] {
  const lead = /^\s/.test(text) ? ' ' : '';
  const trail = /\s$/.test(text) ? ' ' : '';
  const out: React.ReactNode[] = lead ? [lead] : [];
  valueGroups(text).forEach((g, i) => {
    if (i) out.push(' ');
    out.push(
      g.length <= TOKEN_MAX ? (
        <Text key={i} style={keepWhole}>
          {g}
        </Text>
      ) : (
        g
      ),
    );
  });
  if (trail) out.push(trail);
  return out;
}

export function Label(props: Props) {
  return <Txt variant="label" tone="soft" {...props} />;
}
