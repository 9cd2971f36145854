import type { ReactElement, ReactNode } from 'react';
import { FlatList, StyleSheet, View } from 'react-native';
import { space } from '@/constants/theme';
import { LoadMore, nextPage } from './load-more';
import { ErrorState, LoadingState } from './states';

/** What the list needs of an infinite query (TanStack Query's result has all of it). */
type PagedQuery = {
  isPending: boolean;
  isError: boolean;
  error: unknown;
  isRefetching: boolean;
  hasNextPage: boolean;
  isFetchingNextPage: boolean;
  fetchNextPage: () => unknown;
  refetch: () => unknown;
};

/**
 * A screen's paged list: loading and error states while there are no rows to show, then the rows with
 * pull-to-refresh, `filters` above them (the choices and search box, spaced alike on every list screen)
 * and, at the foot, the count and the next page (<LoadMore/>).
 */
export function PagedList<T extends { id: string }>({
  q,
  rows,
  loading,
  what,
  moreTestID,
  renderRow,
  filters,
  empty,
}: {
  q: PagedQuery;
  rows: readonly T[];
  /** The loading state's words ("Loading parts"). */
  loading: string;
  /** What the rows are, for the foot's count ("12 parts shown"). */
  what: string;
  moreTestID: string;
  renderRow: (row: T) => ReactElement;
  /** What narrows the list, above the rows. */
  filters?: ReactNode;
  empty: ReactElement | null;
}) {
  if (q.isPending) return <LoadingState what={loading} />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => void q.refetch()} />;
  return (
    <FlatList
      data={rows}
      keyExtractor={(r) => r.id}
      renderItem={({ item }) => renderRow(item)}
      ListHeaderComponent={filters ? <View style={styles.filters}>{filters}</View> : null}
      ListEmptyComponent={empty}
      ListFooterComponent={<LoadMore {...nextPage(q)} shown={rows.length} what={what} testID={moreTestID} />}
      refreshing={q.isRefetching && !q.isFetchingNextPage}
      onRefresh={() => void q.refetch()}
    />
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.md, paddingBottom: space.md },
});
