import { useState } from 'react';
import { FlatList, StyleSheet, View } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useDevMailQuery, type DevMail } from '@/hooks/queries/dev';
import { shortDate } from '@/components/findings/finding-row';
import { MailHtml } from './mail-html';

function Message({ m, open, onToggle }: { m: DevMail; open: boolean; onToggle: () => void }) {
  const inline = m.attachments.filter((a) => a.cid);
  return (
    <View style={styles.msg} testID={`mail-${m.id}`}>
      <Txt bold testID="mail-subject">
        {m.subject}
      </Txt>
      <Txt variant="small" tone="soft">
        To <Mono variant="small">{m.to.join(', ')}</Mono> · from <Mono variant="small">{m.from}</Mono> ·{' '}
        {shortDate(m.receivedAt)}
      </Txt>
      {m.attachments.length ? (
        <Txt variant="small" tone="soft" testID="mail-parts">
          {m.attachments.length} attached
          {inline.length ? `, ${inline.length} shown inline (${inline.map((a) => `cid:${a.cid}`).join(', ')})` : ''}
        </Txt>
      ) : null}
      {m.html ? (
        <Button
          label={open ? 'Show the text' : 'Show as the mail looks'}
          variant="secondary"
          compact
          onPress={onToggle}
          testID={`mail-toggle-${m.id}`}
          style={{ alignSelf: 'flex-start' }}
        />
      ) : null}
      {open && m.html ? (
        <MailHtml html={m.previewHtml} title={m.subject} />
      ) : (
        <Mono variant="small" wrap style={styles.body}>
          {m.text}
        </Mono>
      )}
    </View>
  );
}

/** Development only: what the local mail catcher received. Refreshes every few seconds. */
export function DevMailScreen() {
  const q = useDevMailQuery();
  // The newest mail opens as it looks; any other at a tap.
  const [toggled, setToggled] = useState<Record<string, boolean>>({});
  const rows = [...(q.data ?? [])].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
  const isOpen = (m: DevMail, i: number) => toggled[m.id] ?? i === 0;
  return (
    <Screen
      title="Mail received"
      subtitle="Development only: messages the local mail catcher took in"
      scroll={false}
      testID="dev-mail-screen"
    >
      {q.isPending ? (
        <LoadingState what="Loading mail" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : (
        <FlatList
          data={rows}
          keyExtractor={(m) => m.id}
          renderItem={({ item, index }) => (
            <Message
              m={item}
              open={isOpen(item, index)}
              onToggle={() => setToggled((t) => ({ ...t, [item.id]: !isOpen(item, index) }))}
            />
          )}
          ListEmptyComponent={
            <EmptyState title="No mail yet." body="Flag a hole or disposition a finding, and the message shows here." />
          }
        />
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  msg: { gap: space.xs, paddingVertical: space.md, borderBottomWidth: hairline, borderColor: colors.rule },
  body: { backgroundColor: colors.paperRaised, padding: space.sm, borderWidth: hairline, borderColor: colors.rule },
});
