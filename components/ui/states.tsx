import { Children, isValidElement, useRef } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { ApiError, errorMessage } from '@/lib/api-client';
import { Button } from './button';
import { useFocusOnMount } from './focus';
import { Mono, Txt } from './text';

export function LoadingState({ what = 'Loading' }: { what?: string }) {
  return (
    <View style={styles.box} testID="loading" accessibilityLiveRegion="polite">
      <ActivityIndicator color={colors.accent} />
      <Txt tone="soft">{what}…</Txt>
    </View>
  );
}

export function ErrorState({ error, title, onRetry }: { error: unknown; title?: string; onRetry?: () => void }) {
  const net = error instanceof ApiError && error.isNetwork;
  return (
    <View style={[styles.box, styles.error]} testID="error" accessibilityRole="alert">
      <Txt bold tone="error">
        {title ?? (net ? 'No connection' : 'That did not work')}
      </Txt>
      <Txt>{errorMessage(error)}</Txt>
      {onRetry ? <Button label="Try again" variant="secondary" onPress={onRetry} testID="retry" /> : null}
    </View>
  );
}

export function EmptyState({ title, body, action }: { title: string; body?: string; action?: React.ReactNode }) {
  return (
    <View style={styles.box} testID="empty">
      <Txt bold>{title}</Txt>
      {body ? (
        <Txt tone="soft" align="center">
          {body}
        </Txt>
      ) : null}
      {action}
    </View>
  );
}

/**
 * A one-line message inside a form or a section (not a whole screen). `focusOnShow` moves focus to it
 * when it appears: the answer to what the person just did (a failed sign-in), where they read on from.
 */
/**
 * Plain words, however JSX split them: "Signed off{by ? ` by ${by}` : ''}." is an array of strings, and
 * outside a Txt it fell to the browser's serif face.
 */
function isWords(children: React.ReactNode): boolean {
  const kids = Children.toArray(children);
  const word = (c: unknown) => typeof c === 'string' || typeof c === 'number';
  // Words with a value set inline ("replaces serial <Mono>…</Mono>") are one line of text too.
  const inline = (c: unknown) => isValidElement(c) && (c.type === Mono || c.type === Txt);
  return kids.some(word) && kids.every((c) => word(c) || inline(c));
}

export function Notice({
  tone = 'info',
  children,
  testID,
  focusOnShow,
}: {
  tone?: 'info' | 'error' | 'ok' | 'caution';
  children: React.ReactNode;
  testID?: string;
  focusOnShow?: boolean;
}) {
  const c =
    tone === 'error' ? colors.error : tone === 'ok' ? colors.ok : tone === 'caution' ? colors.caution : colors.accent;
  const bg = tone === 'error' ? colors.errorSoft : tone === 'caution' ? colors.cautionSoft : colors.paperRaised;
  const ref = useRef<View>(null);
  useFocusOnMount(ref, !!focusOnShow);
  return (
    <View
      ref={ref}
      testID={testID}
      accessibilityRole={tone === 'error' ? 'alert' : undefined}
      accessibilityLiveRegion="polite"
      style={[styles.notice, { borderLeftColor: c, backgroundColor: bg }]}
    >
      {isWords(children) ? <Txt tone={tone === 'error' ? 'error' : 'ink'}>{children}</Txt> : children}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { padding: space.xl, alignItems: 'center', justifyContent: 'center', gap: space.md },
  error: { borderWidth: hairline, borderColor: colors.error, backgroundColor: colors.errorSoft, margin: space.lg },
  notice: { borderLeftWidth: 4, paddingVertical: space.sm, paddingHorizontal: space.md, gap: space.xs },
});
