import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';
import { dispositionLabels, findingKindLabels, type FindingDetail } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { FindingStatusTag } from '@/components/ui/status-mark';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { useFindingQuery, type ReworkCheckResult } from '@/hooks/queries/findings';
import { useRole } from '@/hooks/use-session';
import { EventHistory } from './event-history';
import { DispositionForm, ReworkDoneForm, StartReviewButton, VerifyForm } from './finding-actions';
import { shortDate } from './finding-row';
import { HoleContext } from './hole-context';
import { PhotoViewer } from './photo-viewer';
import { ReworkCheckPanel } from './rework-check-panel';

export function FindingScreen({ findingId }: { findingId: string }) {
  const q = useFindingQuery(findingId);
  if (q.isPending) return <Screen title="Finding" backTo="/findings"><LoadingState what="Loading the finding" /></Screen>;
  if (q.isError) return <Screen title="Finding" backTo="/findings"><ErrorState error={q.error} onRetry={() => void q.refetch()} /></Screen>;
  return <FindingBody f={q.data} />;
}

function FindingBody({ f }: { f: FindingDetail }) {
  const router = useRouter();
  const role = useRole();
  const [viewing, setViewing] = useState<number | null>(null);
  // The latest rework check, so the disposition form can warn when rework is chosen against a fail.
  const [rework, setRework] = useState<ReworkCheckResult | null>(null);
  const open = f.status === 'flagged' || f.status === 'in_review' || f.status === 'dispositioned' || f.status === 'rework_done';
  const needsRework = f.status === 'dispositioned' && (f.disposition === 'rework' || f.disposition === 'repair');

  let action: React.ReactNode = null;
  if (role === 'inspector' && (f.status === 'flagged' || f.status === 'in_review')) {
    action = (
      <Section title="Disposition">
        {f.status === 'flagged' ? <StartReviewButton f={f} /> : null}
        <DispositionForm f={f} reworkCheck={rework} />
      </Section>
    );
  } else if (role === 'builder' && needsRework) {
    action = <Section title="Rework"><ReworkDoneForm f={f} /></Section>;
  } else if (role === 'inspector' && f.status === 'rework_done') {
    action = <Section title="Verify the rework"><VerifyForm f={f} /></Section>;
  }

  const decision = f.disposition ? (
    <Notice tone={f.disposition === 'use_as_is' ? 'ok' : f.disposition === 'scrap' ? 'error' : 'caution'} testID="disposition">
      <Txt bold>{dispositionLabels[f.disposition]}</Txt>
      {f.dispositionNote ? <Txt>“{f.dispositionNote}”</Txt> : null}
      {role === 'builder' && needsRework ? <Txt variant="small">Do the work, then record it below. The hole is held until the inspector checks it.</Txt> : null}
      {f.disposition === 'scrap' ? <Txt variant="small">This part is not to be used. Talk to the supplier about a replacement.</Txt> : null}
    </Notice>
  ) : (f.status === 'flagged' || f.status === 'in_review') && role === 'builder' ? (
    <Notice testID="waiting">Waiting for the inspector. You will get an e-mail when it is dispositioned.</Notice>
  ) : null;

  const left = (
    <>
      <View style={{ gap: space.sm }}>
        <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
          <FindingStatusTag status={f.status} disposition={f.disposition} />
          <Txt bold>{findingKindLabels[f.kind]}</Txt>
        </View>
        <KeyValue label="Flagged by">{`${f.flaggedByName} · ${shortDate(f.createdAt)}`}</KeyValue>
        <KeyValue label="Part"><Txt><Mono bold>{f.partNumber}</Mono> · serial <Mono>{f.serial}</Mono> · build <Mono>{f.kitSerial}</Mono></Txt></KeyValue>
        <KeyValue label="Note">{f.note}</KeyValue>
        <Button label="Open the traveler" variant="secondary" onPress={() => router.push(`/travelers/${f.travelerId}`)} testID="open-traveler" />
      </View>
      <Section title={`Photos (${f.photos.length})`}>
        {f.photos.length ? (
          <View style={styles.photos}>
            {f.photos.map((p, i) => (
              <Pressable
                key={p.id}
                onPress={() => setViewing(i)}
                testID={`finding-photo-${i}`}
                accessibilityRole="imagebutton"
                accessibilityLabel={`Photo ${i + 1}, open large`}
              >
                <Image source={{ uri: p.thumbUrl }} style={styles.thumb} />
              </Pressable>
            ))}
          </View>
        ) : <EmptyState title="No photos." />}
        <Txt variant="small" tone="faint">Tap a photo to see it large and zoom in.</Txt>
      </Section>
      <Section title="The hole in context">
        <HoleContext f={f} />
      </Section>
      {role === 'inspector' && open ? (
        <Section title="Rework check" testID="rework-check-section">
          <ReworkCheckPanel f={f} result={rework} onResult={setRework} />
        </Section>
      ) : null}
    </>
  );

  const right = (
    <>
      {decision}
      {action}
      <Section title="History">
        <EventHistory events={f.events} />
      </Section>
    </>
  );

  return (
    <Screen
      title={`Finding on ${f.holeIds.join(', ')}`}
      subtitle={`${f.partNumber} · ${f.serial} · build ${f.kitSerial}`}
      backTo="/findings"
      full
      testID="finding-screen"
    >
      <TwoPane left={left} right={right} />
      <PhotoViewer photos={f.photos} index={viewing} onClose={() => setViewing(null)} onIndex={setViewing} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  thumb: { width: 120, height: 120, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperSunk },
});
