import { useRouter } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { AccessibilityInfo, findNodeHandle, Platform, ScrollView, View } from 'react-native';
import {
  dispositionLabels,
  findingActionLabels,
  findingClosureLabels,
  findingKindLabels,
  findingStatusLabels,
  isOpenFinding,
  type FindingAction,
  type FindingDetail,
  type FindingStatus,
} from '@/db/contracts';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { FindingStatusTag } from '@/components/ui/status-mark';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { useFindingQuery } from '@/hooks/queries/findings';
import { EventHistory } from './event-history';
import { FindingDecision } from './finding-actions';
import { FindingPhotos } from './finding-photos';
import { shortDate } from './finding-row';
import { HoleContext } from './hole-context';
import { usePhotoViewer } from './photo-viewer';
import { RepairCheckPanel, StoredRepair } from './repair-check-panel';

export function FindingScreen({ findingId }: { findingId: string }) {
  const q = useFindingQuery(findingId);
  if (q.isPending)
    return (
      <Screen title="Finding" backTo="/findings">
        <LoadingState what="Loading the finding" />
      </Screen>
    );
  if (q.isError)
    return (
      <Screen title="Finding" backTo="/findings">
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  return <FindingBody f={q.data} />;
}

/** Whose word an open finding waits for, when the reader has nothing to do on it. */
const waitingWords: Record<Exclude<FindingStatus, 'closed'>, string> = {
  raised: 'Waiting for the inspector’s disposition.',
  awaiting_approval: 'Waiting for the design authority (the kit supplier’s engineer) to approve the disposition.',
  work_ordered: 'Waiting for the builder to do the work and report it with photos.',
  work_done: 'Waiting for the inspector to check the work.',
};

/** The section title over the reader's own decision, in the words of their place on the build. */
const decisionTitle: Record<FindingDetail['place'], string> = {
  builder: 'The work ordered',
  inspector: 'Your decision',
  design_authority: 'Design authority’s approval',
  none: 'Your decision',
};

/** The repair check helps whoever decides or approves a disposition. */
const checkHelps: readonly FindingAction[] = ['disposition', 'amend', 'approve', 'refuse'];

type Outcome = { action: FindingAction; status: FindingStatus; at: number };

/** Focus the result of an action for screen readers and keyboards, once it is on screen. */
function focusOn(node: View | null) {
  if (!node) return;
  if (Platform.OS === 'web') {
    (node as unknown as HTMLElement).focus?.({ preventScroll: true });
    return;
  }
  const handle = findNodeHandle(node);
  if (handle) AccessibilityInfo.setAccessibilityFocus(handle);
}

function FindingBody({ f }: { f: FindingDetail }) {
  const router = useRouter();
  const photoViewer = usePhotoViewer();
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const scrollRef = useRef<ScrollView>(null);
  const outcomeRef = useRef<View>(null);
  const open = isOpenFinding(f.status);
  const showCheck = f.allowedActions.some((a) => checkHelps.includes(a));

  // After a decision the form it came from is gone: bring the reader to what happened, at the top.
  useEffect(() => {
    if (!outcome) return;
    try {
      scrollRef.current?.scrollTo({ y: 0, animated: true });
    } catch {
      // A test DOM without scrolling: the focus below still moves.
    }
    focusOn(outcomeRef.current);
  }, [outcome]);

  const header = (
    <View style={{ gap: space.sm }}>
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
        <FindingStatusTag status={f.status} disposition={f.disposition} closure={f.closure} />
        {/* A kind the app does not know (an older record) still shows, by its id. */}
        <Txt bold>{findingKindLabels[f.kind] ?? f.kind}</Txt>
      </View>
      <KeyValue label="Raised by">{`${f.raisedByName} · ${shortDate(f.createdAt)}`}</KeyValue>
      <KeyValue label="Part">
        <Txt>
          <Mono bold>{f.partNumber}</Mono> · serial <Mono>{f.serial}</Mono> · build <Mono>{f.kitSerial}</Mono>
        </Txt>
      </KeyValue>
      <KeyValue label="Holes">
        <Mono bold>{f.holeIds.join(' ')}</Mono>
      </KeyValue>
      <KeyValue label="What was seen">{f.note}</KeyValue>
      <Button
        label="Open the traveler"
        variant="secondary"
        onPress={() => router.push(`/travelers/${f.travelerId}`)}
        testID="open-traveler"
      />
    </View>
  );

  const left = (
    <>
      {header}
      <Section title={`Photos (${f.photos.length})`}>
        <FindingPhotos photos={f.photos} onOpen={photoViewer.open} />
      </Section>
      <Section title={f.holeIds.length === 1 ? 'The hole in context' : `The ${f.holeIds.length} holes in context`}>
        <HoleContext f={f} />
      </Section>
      {showCheck ? (
        <Section title="Repair check" testID="repair-check-section">
          <RepairCheckPanel f={f} />
        </Section>
      ) : null}
    </>
  );

  const decided =
    f.disposition || f.repair ? (
      <Section title="The disposition">
        <Notice
          tone={
            f.disposition === 'use_as_is'
              ? 'ok'
              : f.disposition === 'scrap' || f.disposition === 'return_to_supplier'
                ? 'error'
                : 'caution'
          }
          testID="disposition"
        >
          {f.disposition ? (
            <Txt bold variant="heading">
              {dispositionLabels[f.disposition]}
            </Txt>
          ) : null}
          {f.dispositionNote ? <Txt>“{f.dispositionNote}”</Txt> : null}
          {f.repair ? <StoredRepair repair={f.repair} /> : null}
        </Notice>
      </Section>
    ) : null;

  const right = (
    <>
      {decided}
      {!open ? (
        <Notice tone="ok" testID="finding-closed">
          <Txt bold>Closed{f.closure ? `: ${findingClosureLabels[f.closure]}` : ''}.</Txt>
          {f.replacement ? <Txt>The build has a replacement part for this one.</Txt> : null}
        </Notice>
      ) : null}
      {f.replacement ? (
        <Button
          label={`Replacement part: ${f.replacement.serial}`}
          variant="secondary"
          onPress={() => router.push(`/travelers/${f.replacement!.travelerId}`)}
          testID="finding-replacement"
        />
      ) : null}
      {open && !f.allowedActions.length ? (
        <Notice testID="finding-waiting">{waitingWords[f.status as Exclude<FindingStatus, 'closed'>]}</Notice>
      ) : null}
      {f.allowedActions.length ? (
        <Section title={decisionTitle[f.place]}>
          <FindingDecision
            f={f}
            onDone={(action, next) => setOutcome({ action, status: next.status, at: Date.now() })}
          />
        </Section>
      ) : null}
      <Section title="History">
        <EventHistory
          events={f.events}
          photos={f.photos}
          onPhoto={(p) => {
            const work = f.photos.filter((x) => x.eventId === p.eventId);
            photoViewer.open(work, Math.max(0, work.indexOf(p)));
          }}
        />
      </Section>
    </>
  );

  return (
    <Screen
      title={`Finding on ${f.holeIds.join(', ')}`}
      subtitle={`${f.partNumber} · ${f.serial} · build ${f.kitSerial}`}
      backTo="/findings"
      full
      scroll={false}
      testID="finding-screen"
    >
      {/* Its own scroll view, so the screen can bring the reader back to the result of an action. */}
      <ScrollView
        ref={scrollRef}
        style={{ flex: 1 }}
        contentContainerStyle={{ gap: space.xl, paddingBottom: space.xxl * 2 }}
        keyboardShouldPersistTaps="handled"
      >
        {outcome ? (
          <View
            ref={outcomeRef}
            tabIndex={-1}
            testID="action-result"
            accessibilityLiveRegion="polite"
            accessibilityRole="alert"
          >
            <Notice tone="ok">
              <Txt bold>{findingActionLabels[outcome.action]}: recorded.</Txt>
              <Txt>
                The finding is now {findingStatusLabels[outcome.status].toLowerCase()}
                {f.status === 'closed' && f.closure ? ` (${findingClosureLabels[f.closure].toLowerCase()})` : ''}.
              </Txt>
              <Button
                label="OK"
                variant="quiet"
                compact
                onPress={() => setOutcome(null)}
                testID="action-result-dismiss"
              />
            </Notice>
          </View>
        ) : null}
        <TwoPane left={left} right={right} />
      </ScrollView>
      {photoViewer.viewer}
    </Screen>
  );
}
