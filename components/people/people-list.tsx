import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { OrganizationSummary, PersonSummary } from '@/db/contracts';
import { colors, hairline, space, touch } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { FindField } from '@/components/ui/field';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { pagedItems } from '@/hooks/queries/paged';
import { usePeopleQuery } from '@/hooks/queries/people';
import { PersonActions } from './person-actions';
import { filterPeople, peopleCount, roleWords, rolesFor, type PeopleShow } from './people-view';
import { wrapAnywhere } from './long-words';

const showOptions: { value: PeopleShow; label: string }[] = [
  { value: 'all', label: 'Everyone' },
  { value: 'active', label: 'Active' },
  { value: 'inactive', label: 'Deactivated' },
];

/** Everyone the reader manages, found by any word; one person opens at a time to show what may be changed. */
export function PeopleList({
  organizations,
  meId,
}: {
  organizations: readonly OrganizationSummary[] | undefined;
  meId: string | undefined;
}) {
  const q = usePeopleQuery();
  const [text, setText] = useState('');
  const [show, setShow] = useState<PeopleShow>('all');
  const [openId, setOpenId] = useState<string | null>(null);
  const [said, setSaid] = useState<string | null>(null);
  // The pages loaded so far, by name; the find box and the choice narrow what is loaded.
  const all = useMemo(() => pagedItems(q.data), [q.data]);
  const rows = useMemo(() => filterPeople(all, text, show), [all, text, show]);
  const kindOf = (orgId: string | null) => organizations?.find((o) => o.id === orgId)?.kind;

  return (
    <Section
      title="People"
      testID="people-list"
      aside={
        q.isSuccess ? (
          <Txt variant="small" tone="soft" testID="people-count">
            {peopleCount(all, rows.length)}
          </Txt>
        ) : undefined
      }
    >
      <FindField
        value={text}
        onChange={setText}
        placeholder="Name, e-mail, organisation or role"
        where="people"
        testID="people-find"
      />
      <Choice options={showOptions} value={show} onChange={setShow} testIDPrefix="people-show" />
      {said ? (
        <Notice tone="ok" testID="person-done">
          {said}
        </Notice>
      ) : null}
      {q.isPending ? (
        <LoadingState what="Loading people" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : !all.length ? (
        <EmptyState
          title="Nobody yet."
          body="Invite the first person: they get a mail with a link to set their password."
        />
      ) : !rows.length ? (
        <EmptyState
          title="Nobody matches."
          body={show !== 'all' ? 'Try “Everyone”, or fewer words.' : 'Try fewer words, or part of the e-mail address.'}
        />
      ) : (
        <View>
          {rows.map((p) => (
            <PersonRow
              key={p.id}
              p={p}
              me={p.id === meId}
              open={openId === p.id}
              onToggle={() => {
                setOpenId(openId === p.id ? null : p.id);
                setSaid(null);
              }}
            >
              <PersonActions p={p} roleOptions={rolesFor(kindOf(p.organizationId))} onDone={setSaid} />
            </PersonRow>
          ))}
        </View>
      )}
      {q.isSuccess && all.length ? (
        <LoadMore {...nextPage(q)} shown={all.length} what="people" testID="people-more" />
      ) : null}
    </Section>
  );
}

function PersonRow({
  p,
  me,
  open,
  onToggle,
  children,
}: {
  p: PersonSummary;
  me: boolean;
  open: boolean;
  onToggle: () => void;
  children: React.ReactNode;
}) {
  return (
    <View style={[styles.row, open && styles.open]}>
      <Pressable
        testID={`person-${p.email}`}
        accessibilityRole="button"
        aria-expanded={open}
        accessibilityLabel={`${p.name}, ${roleWords(p)}${p.active ? '' : ', deactivated'}`}
        onPress={onToggle}
        style={({ pressed }) => [styles.head, pressed && { backgroundColor: colors.accentSoft }]}
      >
        <View style={{ flex: 1, gap: 2 }}>
          <View style={styles.line}>
            <Txt bold tone={p.active ? 'ink' : 'soft'} style={!p.active && styles.struck}>
              {p.name}
            </Txt>
            {me ? (
              <Txt variant="small" tone="accent" bold>
                you
              </Txt>
            ) : null}
            {!p.active ? (
              <Txt variant="small" bold tone="error" testID={`person-inactive-${p.email}`}>
                □ Deactivated
              </Txt>
            ) : null}
          </View>
          <Mono variant="small" tone="soft" style={wrapAnywhere}>
            {p.email}
          </Mono>
          <Txt variant="small">
            {roleWords(p)}
            {p.organizationName ? ` · ${p.organizationName}` : ''}
          </Txt>
        </View>
        <Txt tone="accent" bold>
          {open ? '–' : '+'}
        </Txt>
      </Pressable>
      {open ? (
        <View style={styles.body}>
          {me ? (
            <Txt variant="small" tone="soft">
              This is you. Your password and sign-ins are on your account page.
            </Txt>
          ) : (
            children
          )}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { borderBottomWidth: hairline, borderColor: colors.rule },
  open: { backgroundColor: colors.paperRaised, borderLeftWidth: 3, borderLeftColor: colors.accent },
  head: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: touch,
    paddingVertical: space.md,
    paddingHorizontal: space.sm,
  },
  line: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm, flexWrap: 'wrap' },
  struck: { textDecorationLine: 'line-through' },
  body: { paddingHorizontal: space.sm, paddingBottom: space.lg },
});
