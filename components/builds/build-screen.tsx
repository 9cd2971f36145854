import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { liveFirst, TravelerCard } from '@/components/travelers/traveler-card';
import { Button } from '@/components/ui/button';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono } from '@/components/ui/text';
import { useBuildQuery } from '@/hooks/queries/builds';
import { TwoPane } from '@/components/ui/two-pane';
import { useSession } from '@/hooks/use-session';
import { shortDate } from '@/components/findings/finding-row';
import { BuildNoticesSection } from '@/components/notices/notices-section';
import { BuildPeopleSection } from './build-people';
import { BuildRecordSection } from './build-record';
import { FabricationSection } from './fabrication-section';

export function BuildScreen({ buildId }: { buildId: string }) {
  const router = useRouter();
  const { user } = useSession();
  const role = user?.role ?? null;
  const q = useBuildQuery(buildId);
  if (q.isPending)
    return (
      <Screen title="Build" backTo="/builds">
        <LoadingState what="Loading the build" />
      </Screen>
    );
  if (q.isError)
    return (
      <Screen title="Build" backTo="/builds">
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  const b = q.data;
  // The parts read first on a phone; from 900 px the people sit beside them.
  const parts = (
    <>
      <View style={{ gap: space.sm }}>
        <KeyValue label="Shipped">{shortDate(b.createdAt)}</KeyValue>
        <KeyValue label="Open findings">
          <Mono bold>{String(b.openFindings)}</Mono>
        </KeyValue>
      </View>
      <ProgressBar
        done={b.holesDone}
        awaiting={b.travelers.reduce((n, t) => n + t.holesAwaitingInspector, 0)}
        total={b.holesTotal}
      />
      <Button
        label="Build log"
        variant="secondary"
        onPress={() => router.push(`/builds/${b.id}/log`)}
        testID="build-log"
      />
      {role === 'supplier' ? (
        <Button
          label="Print QR labels"
          variant="secondary"
          onPress={() => router.push(`/builds/${b.id}/labels`)}
          testID="labels"
        />
      ) : null}
      <BuildNoticesSection buildId={b.id} />
      <BuildRecordSection b={b} />
      <FabricationSection buildId={b.id} />
      <Section title={`Parts (${b.travelers.length})`}>
        {b.travelers.length ? (
          <View testID="build-travelers">
            {liveFirst(b.travelers).map((t) => (
              <TravelerCard key={t.id} t={t} onPress={() => router.push(`/travelers/${t.id}`)} />
            ))}
          </View>
        ) : (
          <EmptyState
            title="No parts in this build."
            body="No part of this kit had a published revision when it was shipped."
          />
        )}
      </Section>
    </>
  );
  return (
    <Screen
      title={`Build ${b.kitSerial}`}
      subtitle={`${b.kitName} · ${b.supplierName}`}
      backTo="/builds"
      full
      testID="build-screen"
    >
      <View style={{ width: '100%', maxWidth: 1200, alignSelf: 'center' }}>
        <TwoPane
          leftWidth={0.58}
          left={parts}
          right={<BuildPeopleSection buildId={b.id} kitSerial={b.kitSerial} people={b.people} meId={user?.id} />}
        />
      </View>
    </Screen>
  );
}
