import { useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useCallback, useDeferredValue, useEffect, useMemo, useState } from 'react';
import { View } from 'react-native';
import {
  countHoles,
  dispositionLabels,
  type Hole,
  type HoleStatus,
  type TickHolesInput,
  type TravelerDetail,
} from '@/db/contracts';
import { space } from '@/constants/theme';
import { FindingRow } from '@/components/findings/finding-row';
import { Button } from '@/components/ui/button';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Screen } from '@/components/ui/screen';
import { Section, Sheet } from '@/components/ui/sheet';
import { NoticeBanner } from '@/components/notices/notices-section';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { HoleMark, holeStatusHelp, holeStatusLabels, HoleStatusLegend } from '@/components/ui/status-mark';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { ApiError, errorMessage } from '@/lib/api-client';
import { useTravelerStepMutation, useTravelerTickMutation } from '@/hooks/queries/bench-actions';
import { useTravelerQuery, useTravelerSignOffMutation, useTravelerStampMutation } from '@/hooks/queries/travelers';
import { noticeQueries } from '@/hooks/queries/notices';
import { useFlash } from '@/hooks/use-flash';
import { useUnits } from '@/hooks/use-units';
import { HolesPanel } from './holes-panel';
import { PartDrawing } from './part-drawing';
import { pickRunEnd, planRun, runHoles, tickBatches, toggleHole, type RunPick } from './run-selection';
import { StepCreditChooser, StepsList, type StepCredit } from './steps-list';
import { WorkPhotos } from './work-photos';
import { WorkSection } from './work-section';
import { TravelerHeader } from './traveler-header';
import { UnsentNotices } from './unsent-notices';
import { WithdrawSignOff } from './withdraw-sign-off';
import { ZonesTable } from './zones-table';

export function TravelerScreen({ travelerId }: { travelerId: string }) {
  const q = useTravelerQuery(travelerId);
  // The notices banner's list asked for alongside the traveler, not once the traveler is drawn: the
  // banner then shows with the rest rather than pushing it down a moment later.
  const queryClient = useQueryClient();
  useEffect(() => {
    if (travelerId) void queryClient.prefetchInfiniteQuery(noticeQueries.list({ travelerId }));
  }, [queryClient, travelerId]);
  if (q.isPending) {
    return (
      <Screen title="Traveler" backTo="/travelers">
        <LoadingState what="Loading the traveler" />
      </Screen>
    );
  }
  if (q.isError) {
    return (
      <Screen title="Traveler" backTo="/travelers">
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  }
  return <TravelerBody t={q.data} />;
}

function TravelerBody({ t }: { t: TravelerDetail }) {
  const [sentFindingId, clearSent] = useFlash(`finding-sent:${t.id}`);
  const router = useRouter();
  const units = useUnits();
  const tick = useTravelerTickMutation(t.id);
  const step = useTravelerStepMutation(t.id);
  const stamp = useTravelerStampMutation(t.id);
  const [credit, setCredit] = useState<StepCredit>({ by: 'builder', byName: '' });
  const [creditError, setCreditError] = useState<string | undefined>();
  const signOff = useTravelerSignOffMutation(t.id);

  // What this reader may do on the part comes from the server's answer (the rules module), never from the role alone.
  const canTick = t.allowedActions.includes('tick');
  const canStep = t.allowedActions.includes('step');
  const canStamp = t.allowedActions.includes('stamp');
  const canRaise = t.allowedActions.includes('raise');
  const canSignOff = t.allowedActions.includes('sign-off');
  const canWithdraw = t.allowedActions.includes('withdraw-sign-off');
  const [mode, setMode] = useState<'tap' | 'run'>('tap');
  const [pick, setPick] = useState<RunPick>(null);
  const [focusId, setFocusId] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: 'error' | 'info'; text: string } | null>(null);

  const run = useMemo(() => (mode === 'run' ? runHoles(t.holes, pick) : []), [mode, pick, t.holes]);
  const plan = useMemo(() => (pick?.lastId ? planRun(run) : null), [pick, run]);
  const runIds = useMemo(() => new Set(run.map((h) => h.holeId)), [run]);
  const progress = useMemo(() => countHoles(t.holes), [t.holes]);
  const counts = useMemo(() => {
    const c: Partial<Record<HoleStatus, number>> = {};
    for (const h of t.holes) c[h.status] = (c[h.status] ?? 0) + 1;
    return c;
  }, [t.holes]);
  const focus = focusId ? (t.holes.find((h) => h.holeId === focusId) ?? null) : null;

  const send = useCallback(
    (action: TickHolesInput) => {
      setMessage(null);
      // A refusal shows in the notice above, whether the tick was just made or waited for signal.
      tick.mutate(action);
    },
    [tick],
  );

  const onHolePress = useCallback(
    (h: Hole) => {
      if (mode === 'run') {
        setPick((p) => pickRunEnd(p, h));
        return;
      }
      const r = toggleHole(h);
      if (r.action) send(r.action);
      else setMessage({ tone: 'info', text: r.reason ?? '' });
    },
    [mode, send],
  );

  const onDrawingPress = useCallback(
    (h: Hole) => {
      if (mode === 'run') setPick((p) => pickRunEnd(p, h));
      else setFocusId((f) => (f === h.holeId ? null : h.holeId));
    },
    [mode],
  );

  const flagHref = (holes?: string[]) =>
    `/travelers/${t.id}/flag${holes?.length ? `?holes=${encodeURIComponent(holes.join(','))}` : ''}` as const;

  const left = (
    <>
      {t.replaced ? (
        <Notice tone="error" testID="replaced-by">
          <Txt bold>
            This part was replaced ({dispositionLabels[t.replaced.reason].toLowerCase()}): work its replacement.
          </Txt>
          <Txt>It stays in the record as it was; nothing more is done on it.</Txt>
          <Button
            label={t.replacedBy ? `Open the replacement, serial ${t.replacedBy.serial}` : 'Open the replacement'}
            onPress={() => router.push(`/travelers/${t.replacedBy?.id ?? t.replaced!.byId}`)}
            testID="replaced-by-open"
          />
        </Notice>
      ) : null}
      {t.replaces ? (
        <Notice testID="replaces">
          <Txt>
            This part replaces serial <Mono bold>{t.replaces.serial}</Mono>, taken out of the build after a finding.
          </Txt>
          <Button
            label="Open the part it replaces"
            variant="quiet"
            compact
            onPress={() => router.push(`/travelers/${t.replaces!.id}`)}
            testID="replaces-open"
          />
        </Notice>
      ) : null}
      <TravelerHeader t={t} />
      <NoticeBanner travelerId={t.id} />
      {t.signedOff ? (
        // Focused when it appears: the sign-off button it replaces had focus.
        <Notice tone="ok" testID="signed-off" focusOnShow={signOff.isSuccess}>
          <Txt>
            Signed off{t.signedOffByName ? ` by ${t.signedOffByName}` : ''}
            {t.signedOffAt ? ` on ${new Date(t.signedOffAt).toLocaleString()}` : ''}.
          </Txt>
          {canWithdraw ? <WithdrawSignOff travelerId={t.id} /> : null}
        </Notice>
      ) : null}
      <Section
        title="Drawing"
        aside={
          <Txt variant="small" tone="faint">
            Leading edge at left · stations in {units.label('length')}
          </Txt>
        }
      >
        <PartDrawing detail={t} runIds={runIds} focusId={focusId} onHolePress={onDrawingPress} />
        <HoleStatusLegend counts={counts} />
        {focus ? (
          <Sheet testID="hole-focus">
            <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}>
              <HoleMark status={focus.status} size={24} decorative />
              <Mono bold variant="heading">
                {focus.holeId}
              </Mono>
              <Txt>
                {holeStatusLabels[focus.status]}: {holeStatusHelp[focus.status]}
              </Txt>
            </View>
            <Txt variant="small" tone="soft">
              Line {focus.line} · station <Mono variant="small">{units.length(focus.stationIn)}</Mono> from the line’s
              start
            </Txt>
            <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
              {canTick && (focus.status === 'pending' || focus.status === 'installed') ? (
                <Button
                  label={focus.status === 'pending' ? 'Tick in' : 'Take tick off'}
                  onPress={() => {
                    const r = toggleHole(focus);
                    if (r.action) send(r.action);
                  }}
                  testID="focus-tick"
                />
              ) : null}
              {canRaise ? (
                <Button
                  label="Flag this hole"
                  variant="secondary"
                  onPress={() => router.push(flagHref([focus.holeId]))}
                  testID="flag-this-hole"
                />
              ) : null}
              <Button label="Close" variant="quiet" onPress={() => setFocusId(null)} testID="focus-close" />
            </View>
          </Sheet>
        ) : null}
      </Section>
      <Section title="Pitch schedule">
        <ZonesTable lines={t.lines} holes={t.holes} />
      </Section>
    </>
  );

  // What comes after the holes (steps, photos, hours, findings, sign-off) is drawn just after the first
  // paint rather than in it: a part opened from its label shows its drawing, progress and holes without
  // waiting for the rest of the page to be laid out. React draws it straight after, between frames.
  const belowHoles = useDeferredValue(true, false);
  const afterHoles = (
    <>
      <Section title="Shop steps">
        {canStep ? <StepCreditChooser value={credit} onChange={setCredit} nameError={creditError} /> : null}
        <StepsList
          steps={t.steps}
          canToggle={canStep}
          canStamp={canStamp}
          onToggle={(s) => {
            setCreditError(undefined);
            step.mutate(
              {
                stepId: s.id,
                done: !s.doneAt,
                by: credit.by,
                ...(credit.by !== 'builder' ? { byName: credit.byName } : {}),
              },
              // A refusal shows with the bench's others above; the server says when help is not named
              // (the rule's one home), and the name box shows that too.
              { onError: (e) => setCreditError(e instanceof ApiError ? e.fields?.byName : undefined) },
            );
          }}
          onStamp={(s) =>
            stamp.mutate(s.id, {
              onError: (e) => setMessage({ tone: 'error', text: `Stamp not saved: ${errorMessage(e)}` }),
            })
          }
        />
      </Section>
      {canStep ? <WorkPhotos travelerId={t.id} steps={t.steps} /> : null}
      <WorkSection travelerId={t.id} work={t.work} canWork={canStep} credit={credit} onCreditError={setCreditError} />
      <Section title="Findings on this part">
        {t.findings.length ? (
          <View testID="traveler-findings">
            {t.findings.map((f) => (
              <FindingRow key={f.id} f={f} showPart={false} onPress={() => router.push(`/findings/${f.id}`)} />
            ))}
          </View>
        ) : (
          <EmptyState
            title="No findings."
            body={canRaise ? 'If a hole looks wrong, flag it with a photo.' : undefined}
          />
        )}
      </Section>
      <Button
        label={`Build log of kit ${t.kitSerial}`}
        variant="quiet"
        onPress={() => router.push(`/builds/${t.buildId}/log`)}
        testID="traveler-build-log"
      />
      {t.labelAllowed ? (
        <Button
          label="Print this part’s label again"
          variant="quiet"
          onPress={() => router.push(`/travelers/${t.id}/label`)}
          testID="traveler-label"
        />
      ) : null}
      {canSignOff || (t.place === 'inspector' && !t.signedOff) ? (
        <Section title="Sign-off">
          <SignOff
            can={canSignOff}
            reasons={t.readiness.reasons}
            busy={signOff.isPending}
            error={signOff.error}
            onSignOff={() => signOff.mutate()}
          />
        </Section>
      ) : null}
    </>
  );

  const right = (
    <>
      {sentFindingId ? (
        // Focused on arrival from the flag screen: the answer to what was just done, with where to go next.
        <Notice tone="ok" testID="finding-sent" focusOnShow>
          <Txt>Finding sent. Whoever acts on it next has been told by e-mail.</Txt>
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            <Button
              label="See the finding"
              variant="quiet"
              compact
              onPress={() => {
                clearSent();
                router.push(`/findings/${sentFindingId}`);
              }}
              testID="open-sent-finding"
            />
            <Button label="OK" variant="quiet" compact onPress={clearSent} testID="dismiss-sent" />
          </View>
        </Notice>
      ) : null}
      <UnsentNotices travelerId={t.id} testIDPrefix="part" />
      <ProgressBar done={progress.done} awaiting={progress.awaiting} total={t.holes.length} />
      {canRaise ? (
        <Button
          label="Flag a hole"
          variant="danger"
          onPress={() => router.push(flagHref(focusId ? [focusId] : undefined))}
          testID="flag-hole"
        />
      ) : null}
      <Section title="Holes">
        <HolesPanel
          lines={t.lines}
          holes={t.holes}
          canTick={canTick}
          mode={mode}
          pick={pick}
          run={run}
          plan={plan}
          focusId={focusId}
          onHolePress={onHolePress}
          onStartRun={() => {
            setMode('run');
            setPick(null);
            setMessage(null);
          }}
          onCancelRun={() => {
            setMode('tap');
            setPick(null);
          }}
          onTickRun={() => {
            if (plan?.action) for (const batch of tickBatches(plan.action)) send(batch);
            setMode('tap');
            setPick(null);
          }}
          message={message}
        />
      </Section>
      {belowHoles ? afterHoles : null}
    </>
  );

  return (
    <Screen
      title={`${t.partNumber} · ${t.partName}`}
      subtitle={`Revision ${t.letter} · serial ${t.serial} · build ${t.kitSerial}`}
      backTo="/travelers"
      full
      testID="traveler-screen"
    >
      <TwoPane left={left} right={right} />
    </Screen>
  );
}

/**
 * The inspector's sign-off: the button when the server says the part may be signed off now; otherwise
 * why not, in the rules module's words (holes, steps, findings still open).
 */
function SignOff({
  can,
  reasons,
  busy,
  error,
  onSignOff,
}: {
  can: boolean;
  reasons: string[];
  busy: boolean;
  error: unknown;
  onSignOff: () => void;
}) {
  return (
    <View style={{ gap: space.sm }}>
      {can ? (
        <Txt>Every hole and step is done and every finding is closed.</Txt>
      ) : (
        <View style={{ gap: space.xs }} testID="readiness-reasons">
          <Txt bold>Not ready to sign off:</Txt>
          {reasons.map((r, i) => (
            <Txt key={i}>– {r}</Txt>
          ))}
        </View>
      )}
      {error ? (
        <Notice tone="error" testID="sign-off-error">
          {errorMessage(error)}
        </Notice>
      ) : null}
      {can ? (
        <Button label="Sign off this part" busyLabel="Signing off" busy={busy} onPress={onSignOff} testID="sign-off" />
      ) : null}
    </View>
  );
}
