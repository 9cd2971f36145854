import { useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useCallback, useMemo, useState } from 'react';
import { FlatList, View } from 'react-native';
import { space } from '@/constants/theme';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { TwoPane } from '@/components/ui/two-pane';
import { liveFirst, TravelerCard } from '@/components/travelers/traveler-card';
import { UnsentNotices } from '@/components/travelers/unsent-notices';
import { errorMessage } from '@/lib/api-client';
import { pagedItems } from '@/hooks/queries/paged';
import { lookupTraveler, useTravelersQuery } from '@/hooks/queries/travelers';
import { Scanner } from './scanner';
import { ShortCodeEntry } from './short-code-entry';

/** The builder's bench: scan or type a label to open its part; the parts in progress below. */
export function BenchScreen() {
  const router = useRouter();
  const qc = useQueryClient();
  // Only the parts not yet signed off, a page at a time; the loaded ones are shown nearest done first.
  const parts = useTravelersQuery({ show: 'open' });
  const [scanProblem, setScanProblem] = useState<string | null>(null);

  const open = useCallback(
    async (code: string) => {
      const { id } = await lookupTraveler(qc, code);
      router.push(`/travelers/${id}`);
    },
    [qc, router],
  );

  const onScanned = useCallback(
    async (text: string) => {
      setScanProblem(null);
      try {
        await open(text);
      } catch (e) {
        setScanProblem(`That label did not open a part of yours: ${errorMessage(e)}`);
      }
    },
    [open],
  );

  const inProgress = useMemo(
    () =>
      liveFirst(
        pagedItems(parts.data)
          .filter((t) => !t.signedOff)
          .sort((a, b) => b.holesDone / (b.holesTotal || 1) - a.holesDone / (a.holesTotal || 1)),
      ),
    [parts.data],
  );

  const partNames = useMemo(
    () => new Map(pagedItems(parts.data).map((t) => [t.id, `${t.partNumber} ${t.serial}`])),
    [parts.data],
  );

  const finders = (
    <TwoPane
      leftWidth={0.5}
      left={
        <Section title="Scan">
          <Scanner onCode={onScanned} />
          {scanProblem ? (
            <Notice tone="error" testID="scan-lookup-problem">
              {scanProblem}
            </Notice>
          ) : null}
        </Section>
      }
      right={
        <Section title="Or type the code">
          <ShortCodeEntry onOpen={open} />
        </Section>
      }
    />
  );

  return (
    <Screen title="Bench" subtitle="Open a part by its label" account scroll={false} full testID="bench-screen">
      <FlatList
        data={parts.isSuccess ? inProgress : []}
        keyExtractor={(t) => t.id}
        renderItem={({ item }) => <TravelerCard t={item} onPress={() => router.push(`/travelers/${item.id}`)} />}
        ListHeaderComponent={
          <View style={{ gap: space.xl, paddingBottom: space.md }}>
            <UnsentNotices partNames={partNames} testIDPrefix="bench" />
            {finders}
            <Section title="Parts in progress" />
          </View>
        }
        ListEmptyComponent={
          parts.isPending ? (
            <LoadingState what="Loading your parts" />
          ) : parts.isError ? (
            <ErrorState error={parts.error} onRetry={() => void parts.refetch()} />
          ) : (
            <EmptyState
              title="Nothing in progress."
              body="Parts appear here when a supplier ships you a build; signed-off parts stay under Travelers."
            />
          )
        }
        ListFooterComponent={
          parts.isSuccess ? (
            <LoadMore {...nextPage(parts)} shown={inProgress.length} what="parts" testID="bench-more" />
          ) : null
        }
        keyboardShouldPersistTaps="handled"
        contentContainerStyle={{ paddingBottom: space.xxl }}
      />
    </Screen>
  );
}
