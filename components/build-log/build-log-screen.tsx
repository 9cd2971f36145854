import { useRouter } from 'expo-router';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { FlatList, ScrollView, View } from 'react-native';
import { buildLogCaution, buildLogGroupLabels, buildLogGroups, type BuildLogGroup } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Field, FindField } from '@/components/ui/field';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import {
  deviceTimeZone,
  useBuildLogExportMutation,
  useBuildLogQuery,
  type BuildLogFormat,
} from '@/hooks/queries/build-log';
import { pagedItems } from '@/hooks/queries/paged';
import { useWide } from '@/hooks/use-wide';
import { ChainCheck } from './chain-check';
import { LogDayHeading, LogEntryRow } from './log-entry-row';
import { countLine, filterEntries, isFiltered, logRows, noLogFilters, type LogFilters, type LogRow } from './log-view';
import { PartPicker } from './part-picker';

const kindOptions: { value: BuildLogGroup | 'all'; label: string }[] = [
  { value: 'all', label: 'Everything' },
  ...buildLogGroups.map((g) => ({ value: g, label: buildLogGroupLabels[g] })),
];

/** The files the log exports to, one button each. */
const exportFormats: readonly BuildLogFormat[] = ['csv', 'pdf'];

/** The chronological record of one build: a timeline by day, filters, and the CSV and PDF exports. */
export function BuildLogScreen({ buildId }: { buildId: string }) {
  const router = useRouter();
  const wide = useWide();
  const [filters, setFilters] = useState<LogFilters>(noLogFilters);
  // Words go to the server once typing pauses (the log comes in pages); the pages on screen narrow at once.
  const [words, setWords] = useState('');
  useEffect(() => {
    const t = setTimeout(() => setWords(filters.text.trim()), 350);
    return () => clearTimeout(t);
  }, [filters.text]);
  const q = useBuildLogQuery(buildId, { group: filters.group, travelerId: filters.travelerId, text: words });
  const exporter = useBuildLogExportMutation(buildId);
  const [exporting, setExporting] = useState<BuildLogFormat | null>(null);

  const loaded = useMemo(() => pagedItems(q.data), [q.data]);
  const entries = useMemo(() => filterEntries(loaded, filters), [loaded, filters]);
  const rows = useMemo(() => logRows(entries), [entries]);
  const openFinding = useCallback((id: string) => router.push(`/findings/${id}`), [router]);
  const backTo = `/builds/${buildId}` as const;

  if (q.isPending)
    return (
      <Screen title="Build log" backTo={backTo}>
        <LoadingState what="Loading the build log" />
      </Screen>
    );
  if (q.isError && !q.data)
    return (
      <Screen title="Build log" backTo={backTo}>
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  // The first page names the build and its parts.
  const { build, parts = [] } = q.data.pages[0];
  if (!build)
    return (
      <Screen title="Build log" backTo={backTo}>
        <ErrorState error={new Error('The log came without its build: try again.')} onRetry={() => void q.refetch()} />
      </Screen>
    );
  const filtered = isFiltered(filters);

  const runExport = (format: BuildLogFormat) => {
    setExporting(format);
    exporter.mutate({ format, filters: { ...filters, tz: deviceTimeZone() } }, { onSettled: () => setExporting(null) });
  };

  const header = (
    <View style={{ gap: space.lg, paddingBottom: space.md }}>
      <Txt variant="small" tone="soft" testID="log-people">
        Builder {build.builders.map((b) => b.name).join(', ') || '–'} · Inspector{' '}
        {build.inspectors.map((b) => b.name).join(', ') || '–'}
      </Txt>
      <View style={{ gap: space.sm }}>
        <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
          {exportFormats.map((format) => (
            <Button
              key={format}
              label={`Export ${format.toUpperCase()}`}
              variant="secondary"
              testID={`export-${format}`}
              onPress={() => runExport(format)}
              busy={exporting === format}
              busyLabel={`Preparing ${format.toUpperCase()}`}
              disabled={exporting !== null}
            />
          ))}
        </View>
        <Txt variant="small" tone="soft">
          {filtered
            ? 'An export holds what the filters below show, oldest first, and says which filters on its first page.'
            : 'An export holds the whole log, oldest entry first, with the caution below on its first page.'}
        </Txt>
        {exporter.isError ? (
          <Notice tone="error" testID="export-error">
            {errorMessage(exporter.error)}
          </Notice>
        ) : null}
        {exporter.isSuccess && !exporting ? (
          <Notice tone="ok" testID="export-done">{`Saved ${exporter.data.name}.`}</Notice>
        ) : null}
      </View>
      <ChainCheck buildId={buildId} />
      <Field label="Show">
        <Choice
          testIDPrefix="log-kind"
          value={filters.group}
          onChange={(group) => setFilters((f) => ({ ...f, group }))}
          options={kindOptions}
        />
      </Field>
      {parts.length > 1 ? (
        <Field label="Part">
          <PartPicker
            parts={parts}
            value={filters.travelerId}
            onChange={(travelerId) => setFilters((f) => ({ ...f, travelerId }))}
          />
        </Field>
      ) : null}
      <FindField
        value={filters.text}
        onChange={(text) => setFilters((f) => ({ ...f, text }))}
        placeholder="Hole, part, name or words"
        where="the build log"
        testID="log-search"
      />
      <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' }}>
        <Txt variant="small" tone="soft" testID="log-count">
          {countLine(entries)}
          {q.hasNextPage ? ' loaded so far' : ''}
          {q.isFetching && !q.isFetchingNextPage ? ' · updating…' : ''}
        </Txt>
        {filtered ? (
          <Button
            label="Clear filters"
            variant="quiet"
            compact
            onPress={() => setFilters(noLogFilters)}
            testID="log-clear"
          />
        ) : null}
      </View>
      {q.isError ? <Notice tone="error">{`Could not refresh the log: ${errorMessage(q.error)}`}</Notice> : null}
    </View>
  );

  const timeline = (
    <FlatList<LogRow>
      data={rows}
      keyExtractor={(r) => r.key}
      renderItem={({ item }) =>
        item.type === 'day' ? (
          <LogDayHeading day={item.day} count={item.count} />
        ) : (
          <LogEntryRow e={item.entry} onOpenFinding={openFinding} />
        )
      }
      ListHeaderComponent={wide ? null : header}
      ListFooterComponent={
        <View style={{ paddingTop: space.md, gap: space.xl }}>
          <LoadMore
            {...nextPage(q)}
            shown={entries.length}
            what={entries.length === 1 ? 'entry' : 'entries'}
            testID="log-load-more"
          />
          <Caution text={buildLogCaution} testID="log-caution" />
        </View>
      }
      onEndReached={() => {
        if (q.hasNextPage && !q.isFetchingNextPage) void q.fetchNextPage();
      }}
      onEndReachedThreshold={0.5}
      ListEmptyComponent={
        filtered ? (
          <EmptyState
            title="Nothing matches these filters."
            body="Show everything, pick all parts, or clear the search."
            action={
              <Button
                label="Clear filters"
                variant="secondary"
                onPress={() => setFilters(noLogFilters)}
                testID="log-empty-clear"
              />
            }
          />
        ) : (
          <EmptyState
            title="Nothing recorded yet."
            body="Holes ticked, steps done, findings and sign-offs show here as they happen, with who did them and when."
          />
        )
      }
      initialNumToRender={24}
      windowSize={11}
      refreshing={q.isRefetching}
      onRefresh={() => void q.refetch()}
      keyboardShouldPersistTaps="handled"
      contentContainerStyle={{ paddingBottom: space.xxl * 2 }}
      style={{ flex: 1 }}
    />
  );

  return (
    <Screen
      title="Build log"
      subtitle={`${build.kitSerial} · ${build.kitName} · ${build.supplierName}`}
      backTo={backTo}
      scroll={false}
      full={wide}
      testID="build-log-screen"
    >
      {wide ? (
        // Two panes: the filters and exports stay put at the left while the timeline scrolls.
        <View style={{ flex: 1, flexDirection: 'row', gap: space.xl }}>
          <ScrollView style={{ width: 340, flexGrow: 0 }} keyboardShouldPersistTaps="handled">
            {header}
          </ScrollView>
          <View style={{ flex: 1, minWidth: 0, maxWidth: 760 }}>{timeline}</View>
        </View>
      ) : (
        timeline
      )}
    </Screen>
  );
}
