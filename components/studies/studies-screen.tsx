import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import type { StudyKind, StudySummary } from '@/db/contracts';
import { colors, hairline, radius, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { ListRow } from '@/components/ui/list-row';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { pagedItems } from '@/hooks/queries/paged';
import { useStudiesQuery } from '@/hooks/queries/studies';
import { useUnits } from '@/hooks/use-units';
import { whenText } from './study-links';

export const studyKindLabels: Record<StudyKind, string> = { rib: 'Rib', wing: 'Wing' };

/** What a summary's recommendation is of: one rib's candidate, or the one gauge and rivet for every rib of a wing. */
function recommendedWords(s: StudySummary): string {
  return s.kind === 'wing' ? 'Every rib' : 'Recommended';
}

/** A stored summary without a kind is a rib study (the only kind there was). */
const kindOf = (s: StudySummary): StudyKind => (s.kind === 'wing' ? 'wing' : 'rib');

function StudyRow({ s, onPress }: { s: StudySummary; onPress: () => void }) {
  const u = useUnits();
  const kind = kindOf(s);
  return (
    <ListRow
      testID={`study-row-${s.id}`}
      label={`${studyKindLabels[kind]} study: ${s.name}, ${s.kitName}, revision ${s.revision}, ${whenText(s.updatedAt)}, ${
        s.recommended
          ? `${recommendedWords(s).toLowerCase()} ${u.length(s.recommended.gaugeIn)} with ${s.recommended.rivet}`
          : 'no gauge and rivet pair carries the loads'
      }`}
      onPress={onPress}
      chevron
    >
      <View style={styles.kind} testID={`study-row-${s.id}-kind`}>
        <Txt variant="small" bold>
          {studyKindLabels[kind]}
        </Txt>
      </View>
      <View style={{ flex: 1, gap: 2 }}>
        <Txt bold>{s.name}</Txt>
        <Txt variant="small" tone="soft">
          {s.kitName} · revision{' '}
          <Mono variant="small" bold>
            {s.revision}
          </Mono>{' '}
          · {whenText(s.updatedAt)}
        </Txt>
        <Txt variant="small" testID={`study-row-${s.id}-recommended`}>
          {s.recommended ? (
            <>
              {recommendedWords(s)}{' '}
              <Mono variant="small" bold>
                {u.length(s.recommended.gaugeIn)}
              </Mono>{' '}
              with{' '}
              <Mono variant="small" bold>
                {s.recommended.rivet}
              </Mono>
            </>
          ) : (
            <Txt variant="small" tone="error">
              No gauge and rivet pair carries the loads
            </Txt>
          )}
        </Txt>
      </View>
    </ListRow>
  );
}

/** The supplier's load studies, newest change first. */
export function StudiesScreen() {
  const router = useRouter();
  const q = useStudiesQuery();
  // The server's order (last changed first, then id): sorting the loaded pages again would move rows as pages arrive.
  const rows = pagedItems(q.data);
  return (
    <Screen
      title="Load studies"
      subtitle="Design loads to rivet loads, gauge and pitch schedule"
      account
      testID="studies-screen"
      right={
        <View style={styles.newButtons}>
          <Button
            label="New rib study"
            variant="secondary"
            compact
            onPress={() => router.push('/studies/new')}
            testID="new-study"
          />
          <Button
            label="New wing study"
            variant="secondary"
            compact
            onPress={() => router.push('/studies/new-wing')}
            testID="new-wing-study"
          />
        </View>
      }
    >
      {q.isPending ? (
        <LoadingState what="Loading the studies" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : !rows.length ? (
        <EmptyState
          title="No load studies yet."
          body="A study takes a kit's weight, speeds and airfoil and works out the load on every rivet of a rib, the gauge and the pitch zones; a wing study does it for every rib from root to tip and for the skin panels between them."
          action={
            <View style={styles.newButtons}>
              <Button label="Start a rib study" onPress={() => router.push('/studies/new')} testID="new-study-empty" />
              <Button
                label="Start a wing study"
                variant="secondary"
                onPress={() => router.push('/studies/new-wing')}
                testID="new-wing-study-empty"
              />
            </View>
          }
        />
      ) : (
        <View testID="studies-list">
          {rows.map((s) => (
            <StudyRow key={s.id} s={s} onPress={() => router.push(`/studies/${s.id}`)} />
          ))}
          <LoadMore {...nextPage(q)} shown={rows.length} what="studies" testID="studies-more" />
        </View>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  kind: {
    minWidth: 52,
    alignItems: 'center',
    paddingVertical: 2,
    paddingHorizontal: space.sm,
    borderWidth: hairline,
    borderColor: colors.ruleStrong,
    borderRadius: radius.sm,
  },
  newButtons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, justifyContent: 'flex-end' },
});
