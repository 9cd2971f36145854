import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { FlatList, View } from 'react-native';
import type { TravelerSummary } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { TextBox } from '@/components/ui/field';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useTravelersQuery } from '@/hooks/queries/travelers';
import { liveFirst, TravelerCard } from './traveler-card';

type Show = 'open' | 'all' | 'signed';

/** The parts shown: by sign-off and text, live parts before replaced ones. */
export function filterTravelers(rows: readonly TravelerSummary[], show: Show, text: string): TravelerSummary[] {
  const t = text.trim().toLowerCase();
  return liveFirst(rows).filter((r) => {
    if (show === 'open' && r.signedOff) return false;
    if (show === 'signed' && !r.signedOff) return false;
    if (!t) return true;
    return [r.partNumber, r.partName, r.serial, r.shortCode, r.kitSerial].some((s) => s.toLowerCase().includes(t));
  });
}

/** Every part of the person's builds. */
export function TravelersScreen() {
  const router = useRouter();
  const q = useTravelersQuery();
  const [show, setShow] = useState<Show>('open');
  const [text, setText] = useState('');
  const rows = useMemo(() => filterTravelers(q.data ?? [], show, text), [q.data, show, text]);

  return (
    <Screen title="Parts" subtitle="The travelers of your builds" account scroll={false} testID="travelers-screen">
      {q.isPending ? <LoadingState what="Loading parts" />
        : q.isError ? <ErrorState error={q.error} onRetry={() => void q.refetch()} />
          : (
            <FlatList
              data={rows}
              keyExtractor={(r) => r.id}
              renderItem={({ item }) => <TravelerCard t={item} onPress={() => router.push(`/travelers/${item.id}`)} />}
              ListHeaderComponent={
                <View style={{ gap: space.md, paddingBottom: space.md }}>
                  <Choice
                    testIDPrefix="parts-show"
                    value={show}
                    onChange={setShow}
                    options={[{ value: 'open', label: 'In progress' }, { value: 'signed', label: 'Signed off' }, { value: 'all', label: 'All' }]}
                  />
                  <TextBox value={text} onChangeText={setText} placeholder="Find by part, serial or code" testID="parts-search" accessibilityLabel="Find a part" />
                </View>
              }
              ListEmptyComponent={
                <EmptyState
                  title={q.data?.length ? 'Nothing matches.' : 'No parts yet.'}
                  body={q.data?.length ? 'Try another filter or search.' : 'Parts appear here when a supplier ships you a build.'}
                />
              }
              refreshing={q.isRefetching}
              onRefresh={() => void q.refetch()}
            />
          )}
    </Screen>
  );
}
