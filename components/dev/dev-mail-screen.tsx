import { FlatList, StyleSheet, View } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useDevMailQuery, type DevMail } from '@/hooks/queries/dev';
import { shortDate } from '@/components/findings/finding-row';

function Message({ m }: { m: DevMail }) {
  return (
    <View style={styles.msg} testID={`mail-${m.id}`}>
      <Txt bold testID="mail-subject">{m.subject}</Txt>
      <Txt variant="small" tone="soft">To <Mono variant="small">{m.to.join(', ')}</Mono> · from <Mono variant="small">{m.from}</Mono> · {shortDate(m.receivedAt)}</Txt>
      <Mono variant="small" style={styles.body}>{m.text}</Mono>
    </View>
  );
}

/** Development only: what the local mail catcher received. Refreshes every few seconds. */
export function DevMailScreen() {
  const q = useDevMailQuery();
  const rows = [...(q.data ?? [])].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
  return (
    <Screen title="Mail received" subtitle="Development only: messages the local mail catcher took in" scroll={false} testID="dev-mail-screen">
      {q.isPending ? <LoadingState what="Loading mail" />
        : q.isError ? <ErrorState error={q.error} onRetry={() => void q.refetch()} />
          : (
            <FlatList
              data={rows}
              keyExtractor={(m) => m.id}
              renderItem={({ item }) => <Message m={item} />}
              ListEmptyComponent={<EmptyState title="No mail yet." body="Flag a hole or disposition a finding, and the message shows here." />}
            />
          )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  msg: { gap: space.xs, paddingVertical: space.md, borderBottomWidth: hairline, borderColor: colors.rule },
  body: { backgroundColor: colors.paperRaised, padding: space.sm, borderWidth: hairline, borderColor: colors.rule },
});
