import { useEffect, useLayoutEffect, useRef } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from './button';
import { Txt } from './text';

type Props = {
  /** From the infinite query: whether a further page exists, whether one is on its way, and how to ask for it. */
  hasNextPage: boolean;
  isFetchingNextPage: boolean;
  fetchNextPage: () => unknown;
  /** How many rows are shown, said beside the button so a reader knows the list goes on. */
  shown: number;
  what?: string;
  testID?: string;
};

/** The next-page pieces of an infinite query, as <LoadMore/> takes them: `<LoadMore {...nextPage(q)} … />`. */
export function nextPage(q: Pick<Props, 'hasNextPage' | 'isFetchingNextPage' | 'fetchNextPage'>) {
  return { hasNextPage: q.hasNextPage, isFetchingNextPage: q.isFetchingNextPage, fetchNextPage: q.fetchNextPage };
}

/**
 * The foot of a paged list: loads the next page when it scrolls into view (web) and is a plain button
 * everywhere, so a keyboard, a screen reader or a test can always ask for more.
 */
export function LoadMore({
  hasNextPage,
  isFetchingNextPage,
  fetchNextPage,
  shown,
  what = 'rows',
  testID = 'load-more',
}: Props) {
  const ref = useRef<View>(null);
  // Read by the observer: kept up to date once each render is committed (not while drawing).
  const busy = useRef(false);
  useLayoutEffect(() => {
    busy.current = isFetchingNextPage;
  }, [isFetchingNextPage]);

  useEffect(() => {
    if (Platform.OS !== 'web' || !hasNextPage || typeof IntersectionObserver === 'undefined') return;
    const node = ref.current as unknown as Element | null;
    if (!node) return;
    const seen = new IntersectionObserver(
      (entries) => {
        if (entries.some((e) => e.isIntersecting) && !busy.current) fetchNextPage();
      },
      { rootMargin: '400px 0px' },
    );
    seen.observe(node);
    return () => seen.disconnect();
  }, [hasNextPage, fetchNextPage]);

  if (!hasNextPage)
    return shown > 0 ? (
      <Txt tone="soft" style={styles.end} testID={`${testID}-end`}>
        All {shown} {what} shown
      </Txt>
    ) : null;
  return (
    <View ref={ref} style={styles.foot}>
      <Txt tone="soft">
        {shown} {what} shown
      </Txt>
      <Button
        label="Load more"
        variant="secondary"
        busy={isFetchingNextPage}
        busyLabel="Loading more…"
        onPress={() => fetchNextPage()}
        testID={testID}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  foot: { alignItems: 'center', gap: space.sm, paddingVertical: space.md },
  end: { textAlign: 'center', paddingVertical: space.md },
});
