import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { complianceStatusLabels, noticeLevelLabels, type NoticeSummary } from '@/db/contracts';
import { colors, space } from '@/constants/theme';
import { shortDate } from '@/components/findings/finding-row';
import { Button } from '@/components/ui/button';
import { ListRow } from '@/components/ui/list-row';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { pagedItems } from '@/hooks/queries/paged';
import { useNoticesQuery, type NoticeFilters } from '@/hooks/queries/notices';
import { useSession } from '@/hooks/use-session';
import { ComplianceStatusTag, countsWords, NoticeLevelTag, noticeHref, noticeNumber } from './notice-marks';

/** A row's name: all it shows in words, since a button's name is all that is read of it. */
function rowLabel(n: NoticeSummary, counts: boolean): string {
  return [
    `${noticeLevelLabels[n.level]} notice ${noticeNumber(n.number)}: ${n.title}`,
    n.build ? complianceStatusLabels[n.build.status] : null,
    counts ? countsWords(n.counts) : null,
    `issued ${shortDate(n.issuedAt)}`,
  ]
    .filter(Boolean)
    .join('; ');
}

/** One notice in a list: its level and number, title, and the build's answer or (the supplier's) the counts. */
export function NoticeRow({ n, counts, onPress }: { n: NoticeSummary; counts: boolean; onPress: () => void }) {
  return (
    <ListRow testID={`notice-${n.id}`} label={rowLabel(n, counts)} onPress={onPress} chevron>
      <View style={{ flex: 1, gap: 2 }}>
        <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
          <NoticeLevelTag level={n.level} />
          <Mono bold>{noticeNumber(n.number)}</Mono>
          {n.build ? <ComplianceStatusTag status={n.build.status} /> : null}
        </View>
        <Txt bold>{n.title}</Txt>
        <Txt variant="small" tone="soft">
          {counts ? `${countsWords(n.counts)} · ` : ''}
          {shortDate(n.issuedAt)}
        </Txt>
      </View>
    </ListRow>
  );
}

/** The notices of one kit (the supplier's) or one build, a page at a time, each opening its page. */
function NoticeList({
  filters,
  counts,
  empty,
  testID,
}: {
  filters: NoticeFilters;
  counts: boolean;
  empty: string;
  testID: string;
}) {
  const router = useRouter();
  const { user } = useSession();
  const q = useNoticesQuery(filters);
  if (q.isPending) return <LoadingState what="Loading the notices" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => void q.refetch()} />;
  const rows = pagedItems(q.data);
  if (!rows.length)
    return (
      <Txt tone="soft" testID={`${testID}-empty`}>
        {empty}
      </Txt>
    );
  return (
    <View testID={testID}>
      {rows.map((n) => (
        <NoticeRow key={n.id} n={n} counts={counts} onPress={() => router.push(noticeHref(n.id, user?.role))} />
      ))}
      <LoadMore {...nextPage(q)} shown={rows.length} what="notices" testID={`${testID}-more`} />
    </View>
  );
}

/** The kit screen's notices: the supplier's messages to the builds of this kit, and "Issue a notice". */
export function KitNoticesSection({ kitId, canIssue }: { kitId: string; canIssue: boolean }) {
  const router = useRouter();
  return (
    <Section
      title="Notices to shipped kits"
      testID="kit-notices"
      aside={
        canIssue ? (
          <Button
            label="Issue a notice"
            variant="secondary"
            compact
            onPress={() => router.push(`/catalogue/kits/${kitId}/new-notice`)}
            testID="issue-notice"
          />
        ) : null
      }
    >
      <NoticeList
        filters={{ kitModelId: kitId }}
        counts
        empty="No notice issued for this kit yet."
        testID="kit-notices-list"
      />
    </Section>
  );
}

/** The build screen's notices: each with this build's answer. */
export function BuildNoticesSection({ buildId }: { buildId: string }) {
  return (
    <Section title="Notices from the supplier" testID="build-notices">
      <NoticeList
        filters={{ buildId }}
        counts={false}
        empty="No notice reaches this build."
        testID="build-notices-list"
      />
    </Section>
  );
}

/**
 * On a part's traveler: the notices reaching this part that its build has not yet answered (not read, or
 * read and not yet done), each a link to the notice. Nothing at all when there are none.
 */
export function NoticeBanner({ travelerId }: { travelerId: string }) {
  const router = useRouter();
  const { user } = useSession();
  const q = useNoticesQuery({ travelerId }, { enabled: !!travelerId });
  // The part's own work comes first: a list that failed, or came back in a shape not expected, shows no
  // banner rather than taking the traveler down with it.
  const open = pagedItems(q.data).filter(
    (n) => !!n?.build && (n.build.status === 'open' || n.build.status === 'acknowledged'),
  );
  if (!open.length) return null;
  const mandatory = open.some((n) => n.level === 'mandatory');
  return (
    <Notice tone={mandatory ? 'error' : 'caution'} testID="notice-banner">
      <Txt bold>
        {open.length === 1
          ? 'A notice from the supplier reaches this part'
          : `${open.length} notices from the supplier reach this part`}
      </Txt>
      {open.map((n) => (
        <View
          key={n.id}
          style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}
          testID={`notice-banner-${n.id}`}
        >
          <NoticeLevelTag level={n.level} />
          <Button
            label={`${noticeNumber(n.number)} ${n.title}`}
            variant="quiet"
            compact
            onPress={() => router.push(noticeHref(n.id, user?.role))}
            testID={`notice-banner-open-${n.id}`}
            style={{ flexShrink: 1 }}
          />
          {n.build ? (
            <Txt variant="small" style={{ color: colors.inkSoft }}>
              {complianceStatusLabels[n.build.status]}
            </Txt>
          ) : null}
        </View>
      ))}
      {q.hasNextPage ? (
        <Txt variant="small" tone="soft">
          More notices on the build’s page.
        </Txt>
      ) : null}
    </Notice>
  );
}
