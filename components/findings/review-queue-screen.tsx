import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { Image, View } from 'react-native';
import {
  findingKindLabels,
  findingStatuses,
  findingStatusLabels,
  type FindingStatus,
  type FindingSummary,
} from '@/db/contracts';
import { colors, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field, FindField } from '@/components/ui/field';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { FindingStatusTag } from '@/components/ui/status-mark';
import { Table, type Column } from '@/components/ui/table';
import { Mono, Txt } from '@/components/ui/text';
import { useFindingsQuery } from '@/hooks/queries/findings';
import { pagedItems } from '@/hooks/queries/paged';
import { useWide } from '@/hooks/use-wide';
import { FindingRow, findingRowLabel, shortDate } from './finding-row';
import {
  filterFindings,
  nextSort,
  serverFilters,
  sortFindings,
  type ReviewFilters,
  type ReviewSort,
  type ReviewSortKey,
  type StatusFilter,
} from './review-filter';

const statusOptions: { value: StatusFilter; label: string }[] = [
  { value: 'open', label: 'Open' },
  { value: 'all', label: 'All' },
  ...findingStatuses.map((s) => ({ value: s, label: findingStatusLabels[s] })),
];

export type ReviewQueueProps = {
  title?: string;
  subtitle?: string;
  testID?: string;
  /** Said when there is no finding at all. */
  emptyBody?: string;
  /**
   * Findings in one state listed first, apart from the table: what waits on this reader (the design
   * authority's approvals). Asked of the server by that state, so the list is complete however long
   * the table is.
   */
  first?: { status: FindingStatus; title: string; empty: string };
};

/**
 * A queue of findings to sort and filter: the inspector's review of the builds they inspect, and the
 * design authority's view of the builds of their kits (with what awaits their approval first).
 */
export function ReviewQueueScreen({
  title = 'Review',
  subtitle = 'Findings on the builds you inspect',
  testID = 'review-screen',
  emptyBody = 'When a hole is flagged on one of your builds, it shows here and you get an e-mail.',
  first,
}: ReviewQueueProps) {
  const router = useRouter();
  const [filters, setFilters] = useState<ReviewFilters>({ status: 'open', build: 'all', text: '' });
  // Every build met in any page so far (kit serial → id): the build choice keeps its options while one is chosen.
  const [seenBuilds, setSeenBuilds] = useState<ReadonlyMap<string, string>>(() => new Map());
  // State and build are asked of the server, so each page is full of what is asked for; the words search the rows loaded.
  const q = useFindingsQuery(serverFilters(filters, seenBuilds), { keepPrevious: true });
  // Oldest first, from the server: the longest wait is answered first, however many wait.
  const firstQ = useFindingsQuery({ status: first?.status, order: 'oldest' }, { enabled: !!first });
  const [sort, setSort] = useState<ReviewSort>({ key: 'date', dir: 'desc' });
  const wide = useWide();
  // On a phone the filters fold behind one button, so the first finding shows on the first screen.
  const [filtersOpen, setFiltersOpen] = useState(false);
  const all = useMemo(() => pagedItems(q.data), [q.data]);
  const rows = useMemo(() => sortFindings(filterFindings(all, filters), sort), [all, filters, sort]);
  const waiting = useMemo(() => pagedItems(firstQ.data), [firstQ.data]);
  // Builds met in the pages just loaded are added while rendering (React's "adjusting state"), not in an
  // effect; set only when something is new, so the render that follows settles.
  const met = useMemo(() => {
    const next = new Map(seenBuilds);
    for (const f of [...all, ...waiting]) next.set(f.kitSerial, f.buildId);
    const same = next.size === seenBuilds.size && [...next].every(([k, v]) => seenBuilds.get(k) === v);
    return same ? seenBuilds : next;
  }, [all, waiting, seenBuilds]);
  if (met !== seenBuilds) setSeenBuilds(met);
  const builds = useMemo(
    () => [...seenBuilds.keys()].sort((a, b) => a.localeCompare(b, undefined, { numeric: true })),
    [seenBuilds],
  );

  const columns: Column<FindingSummary, ReviewSortKey>[] = [
    {
      key: 'photo',
      title: 'Photo',
      flex: 0.7,
      render: (f) =>
        f.thumbUrl ? (
          <Image
            source={{ uri: f.thumbUrl }}
            style={{ width: wide ? 48 : 96, height: wide ? 48 : 72, borderWidth: 1, borderColor: colors.rule }}
            accessibilityLabel={`Photo of ${[...f.holeIds].sort().join(' ')}`}
          />
        ) : (
          <Txt variant="small" tone="faint">
            none
          </Txt>
        ),
    },
    {
      key: 'date',
      title: 'Raised',
      sortKey: 'date',
      flex: 1.3,
      render: (f) => <Mono variant="small">{shortDate(f.createdAt)}</Mono>,
    },
    {
      key: 'part',
      title: 'Part',
      sortKey: 'part',
      flex: 1.4,
      render: (f) => (
        <Txt variant="small">
          <Mono variant="small" bold>
            {f.partNumber}
          </Mono>{' '}
          · <Mono variant="small">{f.serial}</Mono>
        </Txt>
      ),
    },
    { key: 'holes', title: 'Holes', flex: 1, render: (f) => <Mono bold>{[...f.holeIds].sort().join(' ')}</Mono> },
    { key: 'kind', title: 'Kind', flex: 1.3, render: (f) => <Txt variant="small">{findingKindLabels[f.kind]}</Txt> },
    {
      key: 'status',
      title: 'Status',
      sortKey: 'status',
      flex: 1.9,
      render: (f) => <FindingStatusTag status={f.status} disposition={f.disposition} closure={f.closure} />,
    },
    { key: 'build', title: 'Build', flex: 0.9, render: (f) => <Mono variant="small">{f.kitSerial}</Mono> },
    {
      key: 'by',
      title: 'By',
      flex: 1,
      render: (f) => (
        <Txt variant="small">
          {f.raisedByName}
          {f.photoCount ? ` · ${f.photoCount} photo${f.photoCount === 1 ? '' : 's'}` : ''}
        </Txt>
      ),
    },
  ];

  const firstBlock = first ? (
    <Section
      title={`${first.title} (${firstQ.data ? `${waiting.length}${firstQ.hasNextPage ? '+' : ''}` : '…'})`}
      testID="review-first"
    >
      {firstQ.isPending ? (
        <LoadingState what={`Loading: ${first.title.toLowerCase()}`} />
      ) : firstQ.isError ? (
        <ErrorState error={firstQ.error} onRetry={() => void firstQ.refetch()} />
      ) : waiting.length ? (
        <View>
          {waiting.map((f) => (
            <FindingRow key={f.id} f={f} onPress={() => router.push(`/findings/${f.id}`)} />
          ))}
          <LoadMore {...nextPage(firstQ)} shown={waiting.length} what="findings" testID="review-first-more" />
        </View>
      ) : (
        <Txt tone="soft" testID="review-first-empty">
          {first.empty}
        </Txt>
      )}
    </Section>
  ) : null;

  const statusLabel = statusOptions.find((o) => o.value === filters.status)?.label ?? filters.status;
  const filterSummary = `${statusLabel} · ${filters.build === 'all' ? 'all builds' : filters.build}`;
  const choices = (
    <>
      <Field label="Status">
        <Choice
          testIDPrefix="filter-status"
          value={filters.status}
          onChange={(status) => setFilters((f) => ({ ...f, status }))}
          options={statusOptions}
        />
      </Field>
      {builds.length > 1 ? (
        <Field label="Build">
          <Choice
            testIDPrefix="filter-build"
            value={filters.build}
            onChange={(build) => setFilters((f) => ({ ...f, build }))}
            options={[{ value: 'all', label: 'All builds' }, ...builds.map((b) => ({ value: b, label: b }))]}
          />
        </Field>
      ) : null}
    </>
  );

  const header = (
    <View style={{ gap: space.md, paddingBottom: space.md }}>
      {firstBlock}
      {first ? <Section title="Every finding" /> : null}
      {wide ? (
        choices
      ) : (
        <Button
          label={filtersOpen ? 'Hide filters' : `Filters: ${filterSummary}`}
          variant="secondary"
          compact
          onPress={() => setFiltersOpen((o) => !o)}
          aria-expanded={filtersOpen}
          testID="toggle-filters"
          style={{ alignSelf: 'flex-start' }}
        />
      )}
      {!wide && filtersOpen ? choices : null}
      <FindField
        value={filters.text}
        onChange={(text) => setFilters((f) => ({ ...f, text }))}
        placeholder="Part, serial, hole, kind or name"
        where="the queue"
        testID="filter-text"
      />
      <Txt variant="small" tone="soft" testID="review-count">
        {rows.length} shown{rows.length < all.length ? ` of ${all.length} loaded` : ''}
        {q.hasNextPage ? ' · more to load' : ''}
      </Txt>
    </View>
  );

  return (
    <Screen title={title} subtitle={subtitle} account scroll={false} full testID={testID}>
      {q.isPending ? (
        <LoadingState what="Loading the findings" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : (
        <View style={{ flex: 1 }}>
          <Table
            rows={rows}
            columns={columns}
            rowKey={(f) => f.id}
            sort={sort}
            onSort={(key) => setSort((s) => nextSort(s, key))}
            onRowPress={(f) => router.push(`/findings/${f.id}`)}
            rowTestID={(f) => `review-row-${f.id}`}
            rowLabel={(f) =>
              `${findingRowLabel(f)}; build ${f.kitSerial}${f.photoCount ? `; ${f.photoCount} photo${f.photoCount === 1 ? '' : 's'}` : ''}`
            }
            header={header}
            // The table's own foot: the list's count and the next page (loaded as it scrolls into view on the web).
            footer={<LoadMore {...nextPage(q)} shown={all.length} what="findings" testID="review-more" />}
            empty={
              <EmptyState
                title={
                  all.length
                    ? 'Nothing loaded matches these words.'
                    : filters.status === 'all' && filters.build === 'all'
                      ? 'No findings yet.'
                      : 'Nothing matches these filters.'
                }
                body={
                  all.length
                    ? 'Clear the search, or load more.'
                    : filters.status === 'all' && filters.build === 'all'
                      ? emptyBody
                      : 'Show all states and builds.'
                }
              />
            }
          />
        </View>
      )}
    </Screen>
  );
}
