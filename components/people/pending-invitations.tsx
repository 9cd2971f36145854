import { StyleSheet, View } from 'react-native';
import { memberPlaceLabels, roleLabels, type PendingInvitation } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { shortDate } from '@/components/findings/finding-row';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { pagedItems } from '@/hooks/queries/paged';
import { usePeopleInvitationsQuery } from '@/hooks/queries/people';
import { wrapAnywhere } from './long-words';

/** Invited, not joined yet: who, as what, by whom, and until when the link works. */
export function PendingInvitations() {
  const q = usePeopleInvitationsQuery();
  const rows = pagedItems(q.data);
  return (
    <Section
      title="Waiting to join"
      testID="pending-invitations"
      aside={
        rows.length ? (
          <Mono variant="small" tone="soft">
            {rows.length}
            {q.hasNextPage ? '+' : ''}
          </Mono>
        ) : undefined
      }
    >
      {q.isPending ? (
        <LoadingState what="Loading invitations" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : !rows.length ? (
        <EmptyState
          title="Nobody is waiting to join."
          body="Everyone invited has set their password, or their link ran out."
        />
      ) : (
        <View>
          {rows.map((i) => (
            <InvitationRow key={i.id} i={i} />
          ))}
          <LoadMore {...nextPage(q)} shown={rows.length} what="invitations" testID="invitations-more" />
        </View>
      )}
    </Section>
  );
}

function InvitationRow({ i }: { i: PendingInvitation }) {
  const what =
    i.buildKitSerial && i.place
      ? `${memberPlaceLabels[i.place]} on build ${i.buildKitSerial}`
      : `${roleLabels[i.role]}${i.organizationName ? ` · ${i.organizationName}` : ''}`;
  return (
    <View style={styles.row} testID={`invitation-${i.email}`}>
      <Txt bold>
        {i.name}{' '}
        <Txt variant="small" tone="caution">
          · not joined yet
        </Txt>
      </Txt>
      <Mono variant="small" tone="soft" style={wrapAnywhere}>
        {i.email}
      </Mono>
      <Txt variant="small">{what}</Txt>
      <Txt variant="small" tone="faint">
        Invited by {i.invitedByName} · link works until {shortDate(i.expiresAt)}
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: 2, paddingVertical: space.md, borderBottomWidth: hairline, borderColor: colors.rule },
});
