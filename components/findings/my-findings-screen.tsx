import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { FlatList, View } from 'react-native';
import { isOpenFinding } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { LoadMore } from '@/components/ui/load-more';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useFindingsQuery } from '@/hooks/queries/findings';
import { pagedItems } from '@/hooks/queries/paged';
import { FindingRow } from './finding-row';

/** The builder's own findings: what waits on the inspector or the design authority, and the work ordered. */
export function MyFindingsScreen() {
  const router = useRouter();
  const [show, setShow] = useState<'open' | 'all'>('open');
  // Open or all is asked of the server, newest first, a page at a time.
  const q = useFindingsQuery({ status: show === 'open' ? 'open' : undefined }, { keepPrevious: true });
  // While the other choice loads, the rows of the last one stay shown, less those it does not take.
  const rows = useMemo(
    () => pagedItems(q.data).filter((f) => show === 'all' || isOpenFinding(f.status)),
    [q.data, show],
  );
  return (
    <Screen title="Findings" subtitle="Findings on your builds" account scroll={false} testID="my-findings-screen">
      {q.isPending ? (
        <LoadingState what="Loading findings" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : (
        <FlatList
          data={rows}
          keyExtractor={(f) => f.id}
          renderItem={({ item }) => <FindingRow f={item} onPress={() => router.push(`/findings/${item.id}`)} />}
          ListHeaderComponent={
            <View style={{ paddingBottom: space.md }}>
              <Choice
                testIDPrefix="findings-show"
                value={show}
                onChange={setShow}
                options={[
                  { value: 'open', label: 'Open' },
                  { value: 'all', label: 'All' },
                ]}
              />
            </View>
          }
          ListEmptyComponent={
            q.isPlaceholderData ? null : (
              <EmptyState
                title={show === 'open' ? 'No open findings.' : 'No findings yet.'}
                body="Flag a suspect hole from its traveler; it shows here until it is closed."
              />
            )
          }
          ListFooterComponent={
            <LoadMore
              hasNextPage={q.hasNextPage}
              isFetchingNextPage={q.isFetchingNextPage}
              fetchNextPage={q.fetchNextPage}
              shown={rows.length}
              what="findings"
              testID="findings-more"
            />
          }
          refreshing={q.isRefetching && !q.isFetchingNextPage}
          onRefresh={() => void q.refetch()}
        />
      )}
    </Screen>
  );
}
