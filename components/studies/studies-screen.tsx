import { useRouter } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import type { StudySummary } from '@/db/contracts';
import { colors, hairline, space, touch } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useStudiesQuery } from '@/hooks/queries/studies';
import { useUnits } from '@/hooks/use-units';
import { whenText } from './study-screen';

function StudyRow({ s, onPress }: { s: StudySummary; onPress: () => void }) {
  const u = useUnits();
  return (
    <Pressable
      testID={`study-row-${s.id}`}
      accessibilityRole="button"
      accessibilityLabel={`${s.name}, ${s.kitName}, revision ${s.revision}, ${whenText(s.updatedAt)}, ${s.recommended
        ? `recommended ${u.length(s.recommended.gaugeIn)} with ${s.recommended.rivet}`
        : 'no gauge and rivet pair carries the loads'}`}
      onPress={onPress}
      style={({ pressed }) => [styles.row, pressed && { backgroundColor: colors.accentSoft }]}
    >
      <View style={{ flex: 1, gap: 2 }}>
        <Txt bold>{s.name}</Txt>
        <Txt variant="small" tone="soft">
          {s.kitName} · revision <Mono variant="small" bold>{s.revision}</Mono> · {whenText(s.updatedAt)}
        </Txt>
        <Txt variant="small" testID={`study-row-${s.id}-recommended`}>
          {s.recommended
            ? <>Recommended <Mono variant="small" bold>{u.length(s.recommended.gaugeIn)}</Mono> with <Mono variant="small" bold>{s.recommended.rivet}</Mono></>
            : <Txt variant="small" tone="error">No gauge and rivet pair carries the loads</Txt>}
        </Txt>
      </View>
      <Txt tone="accent" bold aria-hidden>›</Txt>
    </Pressable>
  );
}

/** The supplier's load studies, newest change first. */
export function StudiesScreen() {
  const router = useRouter();
  const q = useStudiesQuery();
  const rows = [...(q.data ?? [])].sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
  return (
    <Screen
      title="Load studies"
      subtitle="Design loads to rivet loads, gauge and pitch schedule"
      account
      testID="studies-screen"
      right={<Button label="New study" variant="secondary" compact onPress={() => router.push('/studies/new')} testID="new-study" />}
    >
      {q.isPending ? <LoadingState what="Loading the studies" />
        : q.isError ? <ErrorState error={q.error} onRetry={() => void q.refetch()} />
          : !rows.length ? (
            <EmptyState
              title="No load studies yet."
              body="A study takes a kit's weight, speeds and airfoil and works out the load on every rivet of a rib, the gauge and the pitch zones."
              action={<Button label="Start a study" onPress={() => router.push('/studies/new')} testID="new-study-empty" />}
            />
          ) : (
            <View testID="studies-list">
              {rows.map((s) => <StudyRow key={s.id} s={s} onPress={() => router.push(`/studies/${s.id}`)} />)}
            </View>
          )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: touch, paddingVertical: space.md, borderBottomWidth: hairline, borderColor: colors.rule },
});
