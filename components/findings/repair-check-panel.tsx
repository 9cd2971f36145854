import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { repairSchemeLabels, type FindingDetail, type RepairRecord } from '@/db/contracts';
import { colors, hairline, radius, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import {
  useRepairCheckQuery,
  type RepairAlternative,
  type RepairCheckResult,
  type RepairHoleResult,
} from '@/hooks/queries/findings';
import { useUnits, type Units } from '@/hooks/use-units';
import { VerdictMark } from './verdict-mark';

const fractions: Record<number, string> = { 3: '3/32', 4: '1/8', 5: '5/32', 6: '3/16', 8: '1/4' };

/** The rivet's nominal size: the trade's fraction in inches, millimetres on the metric switch. */
export function sizeLabel(dash: number, u: Units): string {
  return u.system === 'imperial' ? `${fractions[dash] ?? `${dash}/32`} in` : u.length(dash / 32);
}

/** A margin of safety as read on a stress sheet: signed, two places; "—" where no load was applied. */
export function formatMargin(ms: number | null): string {
  if (ms === null || !Number.isFinite(ms)) return '—';
  return `${ms < 0 ? '−' : '+'}${Math.abs(ms).toFixed(2)}`;
}

export const alternativeWords: Record<NonNullable<RepairAlternative>, { title: string; body: string }> = {
  'repair with doubler': {
    title: 'Repair with a doubler',
    body: 'The next-size rivet does not fit here, but there is sound sheet round it: a doubler repair (repair scheme "Doubler").',
  },
  scrap: {
    title: 'Scrap',
    body: 'The larger hole would all but break into the edge or its neighbour: nothing sound is left for a repair to hold on to.',
  },
};

/** The rivets the form and the panel offer: the next sizes of the family, or the server's choice when it knows no list. */
export function oversizeChoices(f: FindingDetail, u: Units) {
  return (f.context.oversizeOptions ?? []).map((o) => ({
    value: o.code,
    label: o.code,
    hint: `${o.step === 1 ? 'next size up' : 'two sizes up'} · ${sizeLabel(o.dash, u)}`,
  }));
}

function Bullets({
  items,
  testID,
  tone = 'ink',
}: {
  items: string[];
  testID: string;
  tone?: 'ink' | 'soft' | 'caution' | 'faint' | 'error';
}) {
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      {items.map((t, i) => (
        <View key={i} style={{ flexDirection: 'row', gap: space.sm }}>
          <Txt variant="small" tone={tone}>
            –
          </Txt>
          <Txt variant="small" tone={tone} style={{ flex: 1 }}>
            {t}
          </Txt>
        </View>
      ))}
    </View>
  );
}

/** The verdict box: PASS or FAIL, with its mark, and what was checked. */
function Verdict({ pass, title, testID }: { pass: boolean; title: React.ReactNode; testID: string }) {
  return (
    <View
      style={[
        styles.verdict,
        { borderColor: pass ? colors.ok : colors.error, backgroundColor: pass ? colors.paperRaised : colors.errorSoft },
      ]}
      testID={testID}
      accessibilityRole="summary"
      accessibilityLiveRegion="polite"
    >
      <VerdictMark pass={pass} size={32} />
      <View style={{ flex: 1, minWidth: 160 }}>
        <Txt variant="heading" bold tone={pass ? 'ink' : 'error'}>
          {pass ? 'PASS' : 'FAIL'}
        </Txt>
        {title}
      </View>
    </View>
  );
}

/** One layout requirement against what the hole has: "needs ≥ x · has y", and whether it meets it. */
function Requirement({
  label,
  required,
  actual,
  none,
  note,
  testID,
  u,
}: {
  label: string;
  required: number;
  actual: number | null;
  none?: string;
  note?: string;
  testID: string;
  u: Units;
}) {
  // The engine allows half a thousandth for measuring; the words follow its verdict, not a sharper one.
  const short = actual !== null && actual < required - 0.0005;
  return (
    <View style={styles.req} testID={testID}>
      <Txt variant="small" tone="soft" style={styles.reqLabel}>
        {label}
      </Txt>
      {actual === null ? (
        <Txt variant="small" tone="faint">
          {none}
        </Txt>
      ) : (
        <View style={styles.reqValues}>
          <VerdictMark pass={!short} size={18} />
          <View style={{ flex: 1, minWidth: 0 }}>
            <Txt variant="small">
              needs ≥{' '}
              <Mono variant="small" bold>
                {u.length(required)}
              </Mono>
              {'  ·  '}has{' '}
              <Mono variant="small" bold tone={short ? 'error' : 'ink'}>
                {u.length(actual)}
              </Mono>
              {note ? (
                <Txt variant="small" tone="soft">
                  {' '}
                  ({note})
                </Txt>
              ) : null}
            </Txt>
            <Txt variant="small" bold tone={short ? 'error' : 'soft'}>
              {short ? `short by ${u.length(required - actual)}` : 'enough'}
            </Txt>
          </View>
        </View>
      )}
    </View>
  );
}

function MarginCell({ value, testID }: { value: number | null; testID: string }) {
  const negative = value !== null && value < 0;
  return (
    <View
      style={[styles.msCell, negative && styles.msNegative]}
      testID={testID}
      // Named as a group: a margin read as "negative margin −0.12", not as a bare number.
      role="group"
      accessibilityLabel={
        value === null
          ? 'not checked, no applied load'
          : `${negative ? 'negative margin ' : 'margin '}${formatMargin(value)}`
      }
    >
      <Mono bold={negative} tone={negative ? 'error' : value === null ? 'faint' : 'ink'} align="right">
        {formatMargin(value)}
      </Mono>
    </View>
  );
}

function Margins({ m, testID }: { m: RepairHoleResult['margins']; testID: string }) {
  const rows = [
    { key: 'shear', label: 'Shear' },
    { key: 'tension', label: 'Tension' },
    { key: 'combined', label: 'Combined' },
  ] as const;
  const values = Object.values(m);
  const anyNegative = values.some((v) => v !== null && v < 0);
  const anyMissing = values.some((v) => v === null);
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      <Label>Margins of safety with the new rivet</Label>
      <View style={styles.msTable}>
        <View style={styles.msRow}>
          <View style={{ flex: 1 }} />
          <Txt variant="small" tone="soft" style={styles.msHead}>
            limit
          </Txt>
          <Txt variant="small" tone="soft" style={styles.msHead}>
            ultimate
          </Txt>
        </View>
        {rows.map((r) => (
          <View key={r.key} style={styles.msRow}>
            <Txt variant="small" style={{ flex: 1 }}>
              {r.label}
            </Txt>
            <MarginCell value={m[`${r.key}Limit`]} testID={`${testID}-${r.key}-limit`} />
            <MarginCell value={m[`${r.key}Ultimate`]} testID={`${testID}-${r.key}-ultimate`} />
          </View>
        ))}
      </View>
      {anyNegative ? (
        <Txt variant="small" tone="error">
          Boxed in red: a negative margin, the joint is weaker than the load it must carry.
        </Txt>
      ) : null}
      {anyMissing ? (
        <Txt variant="small" tone="faint">
          — : no applied load at this hole, so that margin is not checked.
        </Txt>
      ) : null}
    </View>
  );
}

/** One hole of the finding at the new size: its verdict, its reasons, edge distance and pitch, margins. */
function HoleResult({
  h,
  result,
  nominalEdgeIn,
  open,
  onToggle,
  u,
}: {
  h: RepairHoleResult;
  result: RepairCheckResult;
  nominalEdgeIn: number;
  open: boolean;
  onToggle: () => void;
  u: Units;
}) {
  const [prev, next] = h.pitchToNeighboursIn;
  const id = `repair-hole-${h.holeId}`;
  return (
    <View style={[styles.hole, !h.pass && styles.holeFail]} testID={id}>
      <View style={styles.holeHead}>
        <VerdictMark pass={h.pass} size={22} />
        <Mono bold variant="heading">
          {h.holeId}
        </Mono>
        <Txt bold tone={h.pass ? 'ink' : 'error'}>
          {h.pass ? 'passes' : 'fails'}
        </Txt>
      </View>
      {h.reasons.length ? <Bullets items={h.reasons} testID={`${id}-reasons`} tone="error" /> : null}
      <View style={styles.table}>
        <Requirement
          label="Edge distance"
          required={result.requiredEdgeIn}
          actual={h.edgeDistanceUsedIn}
          note={
            h.edgeDistanceMeasured ? `as measured; ${u.length(nominalEdgeIn)} as laid out` : 'as laid out, not measured'
          }
          testID={`${id}-edge`}
          u={u}
        />
        <Requirement
          label="Pitch to the hole before"
          required={result.requiredPitchIn}
          actual={prev}
          none="no hole before (line start)"
          testID={`${id}-pitch-before`}
          u={u}
        />
        <Requirement
          label="Pitch to the hole after"
          required={result.requiredPitchIn}
          actual={next}
          none="no hole after (line end)"
          testID={`${id}-pitch-after`}
          u={u}
        />
      </View>
      <Button
        label={open ? 'Hide the margins' : 'Show the margins'}
        variant="quiet"
        compact
        onPress={onToggle}
        testID={`${id}-margins-toggle`}
        aria-expanded={open}
        style={{ alignSelf: 'flex-start', marginLeft: -space.md }}
      />
      {open ? <Margins m={h.margins} testID={`${id}-ms`} /> : null}
    </View>
  );
}

function Countersink({ c, u }: { c: RepairCheckResult['countersink']; u: Units }) {
  if (!c) {
    return (
      <View style={styles.req} testID="repair-countersink">
        <Txt variant="small" tone="soft" style={styles.reqLabel}>
          Countersink
        </Txt>
        <Txt variant="small">Protruding head: no countersink to check.</Txt>
      </View>
    );
  }
  return (
    <View style={styles.req} testID="repair-countersink">
      <Txt variant="small" tone="soft" style={styles.reqLabel}>
        Countersink
      </Txt>
      <View style={styles.reqValues}>
        <VerdictMark pass={c.pass} size={18} />
        <View style={{ flex: 1, minWidth: 0 }}>
          {c.headHeightIn === null ? (
            <Txt variant="small" tone="error">
              The head height of this rivet is not known here: dimple, or check the supplier’s head dimensions.
            </Txt>
          ) : (
            <Txt variant="small">
              head{' '}
              <Mono variant="small" bold>
                {u.length(c.headHeightIn)}
              </Mono>{' '}
              deep{'  ·  '}
              sheet allows at most{' '}
              <Mono variant="small" bold>
                {c.limitIn === null ? '–' : u.length(c.limitIn)}
              </Mono>
            </Txt>
          )}
          <Txt variant="small" bold tone={c.pass ? 'soft' : 'error'}>
            {c.pass ? 'machine countersink' : 'dimple instead'}
          </Txt>
        </View>
      </View>
    </View>
  );
}

/** Everything the engine said about the proposed rivet over every hole, in the order an inspector reads it. */
export function RepairResultView({ result, nominalEdgeIn }: { result: RepairCheckResult; nominalEdgeIn: number }) {
  const u = useUnits();
  const [showRules, setShowRules] = useState(false);
  // One hole: its margins open at once; a run of holes: each on demand, so the list stays short.
  const [openHoles, setOpenHoles] = useState<Set<string>>(
    () => new Set(result.holes.length === 1 ? [result.holes[0].holeId] : []),
  );
  const failing = result.holes.filter((h) => !h.pass).length;
  return (
    <View style={{ gap: space.md }}>
      <Verdict
        pass={result.pass}
        testID="repair-result"
        title={
          <>
            <Txt variant="small">
              <Mono variant="small" bold>
                {result.inputs.proposedSpec}
              </Mono>{' '}
              in place of <Mono variant="small">{result.inputs.rivetSpec}</Mono>
            </Txt>
            <Txt variant="small" tone="soft">
              {result.holes.length === 1
                ? 'one hole checked'
                : `${result.holes.length} holes checked${failing ? `, ${failing} failing` : ', every one passes'}`}
            </Txt>
          </>
        }
      />

      <View style={{ gap: space.xs }}>
        <Label>{result.pass ? 'Why it passes' : 'Why it fails'}</Label>
        {result.reasons.length ? (
          <Bullets items={result.reasons} testID="repair-reasons" tone="error" />
        ) : (
          <View testID="repair-reasons">
            <Txt variant="small">
              At every hole, edge distance, pitch to both neighbours and the margins that could be checked meet the
              rules.
            </Txt>
          </View>
        )}
      </View>

      {result.alternative ? (
        <Notice tone="caution" testID="repair-alternative">
          <Txt bold>Instead: {alternativeWords[result.alternative].title}</Txt>
          <Txt variant="small">{alternativeWords[result.alternative].body}</Txt>
        </Notice>
      ) : null}

      <View style={styles.table}>
        <View style={styles.req} testID="repair-new-drill">
          <Txt variant="small" tone="soft" style={styles.reqLabel}>
            New drill
          </Txt>
          <Mono bold>
            {result.newDrill.name} · {u.length(result.newDrill.diameterIn)}
          </Mono>
        </View>
        <View style={styles.req} testID="repair-required">
          <Txt variant="small" tone="soft" style={styles.reqLabel}>
            Needed at the new size
          </Txt>
          <Txt variant="small">
            edge distance ≥{' '}
            <Mono variant="small" bold>
              {u.length(result.requiredEdgeIn)}
            </Mono>
            {'  ·  '}
            pitch ≥{' '}
            <Mono variant="small" bold>
              {u.length(result.requiredPitchIn)}
            </Mono>
          </Txt>
        </View>
        <Countersink c={result.countersink} u={u} />
      </View>

      <View style={{ gap: space.sm }} testID="repair-holes">
        <Label>Hole by hole</Label>
        {result.holes.map((h) => (
          <HoleResult
            key={h.holeId}
            h={h}
            result={result}
            nominalEdgeIn={nominalEdgeIn}
            open={openHoles.has(h.holeId)}
            onToggle={() =>
              setOpenHoles((s) => {
                const n = new Set(s);
                if (n.has(h.holeId)) n.delete(h.holeId);
                else n.add(h.holeId);
                return n;
              })
            }
            u={u}
          />
        ))}
      </View>

      {result.warnings.length ? (
        <View style={{ gap: space.xs }}>
          <Label>Be wary of</Label>
          <Bullets items={result.warnings} testID="repair-warnings" tone="caution" />
        </View>
      ) : null}

      {result.rules.length ? (
        <View style={{ gap: space.xs, alignItems: 'flex-start' }}>
          <Button
            label={showRules ? 'Hide the rules applied' : `Show the rules applied (${result.rules.length})`}
            variant="quiet"
            compact
            onPress={() => setShowRules((v) => !v)}
            testID="repair-rules-toggle"
            aria-expanded={showRules}
            style={{ marginLeft: -space.md }}
          />
          {showRules ? <Bullets items={result.rules} testID="repair-rules" tone="soft" /> : null}
        </View>
      ) : null}

      <Caution testID="repair-caution" text={result.caution || undefined} />
    </View>
  );
}

/**
 * The repair check kept with the disposition: what the inspector chose, what the engine said then, and
 * why they chose it when it failed. Read by the design authority before approving.
 */
export function StoredRepair({ repair }: { repair: RepairRecord }) {
  const u = useUnits();
  const c = repair.check;
  return (
    <View style={{ gap: space.sm }} testID="repair-stored">
      <Txt>
        <Txt bold>Repair: {repairSchemeLabels[repair.scheme]}</Txt>
        {repair.rivetSpec ? (
          <>
            {' '}
            with <Mono bold>{repair.rivetSpec}</Mono>
          </>
        ) : null}
      </Txt>
      {c ? (
        <>
          <Verdict
            pass={c.pass}
            testID="repair-stored-result"
            title={<Txt variant="small">The repair check as it stood when the disposition was recorded.</Txt>}
          />
          {c.reasons.length ? <Bullets items={c.reasons} testID="repair-stored-reasons" tone="error" /> : null}
          {c.newDrill ? (
            <Txt variant="small">
              New drill{' '}
              <Mono variant="small" bold>
                {c.newDrill.name} · {u.length(c.newDrill.diameterIn)}
              </Mono>
            </Txt>
          ) : null}
          {c.alternative ? (
            <Txt variant="small" tone="caution">
              The check pointed to:{' '}
              {alternativeWords[c.alternative as NonNullable<RepairAlternative>]?.title ?? c.alternative}.
            </Txt>
          ) : null}
        </>
      ) : (
        <Txt variant="small" tone="soft">
          No engineering check goes with this scheme: the note says how it is made.
        </Txt>
      )}
      {repair.overrideReason ? (
        <View style={styles.override} testID="override-reason-shown" accessibilityRole="summary">
          <Txt bold tone="error">
            Chosen although the check fails. The inspector’s reason:
          </Txt>
          <Txt variant="heading">“{repair.overrideReason}”</Txt>
        </View>
      ) : null}
      {c ? <Caution testID="repair-stored-caution" /> : null}
    </View>
  );
}

/**
 * "What would a next-size rivet do here?": choose the rivet (the next size up unless another is chosen),
 * check every hole of the finding, and read pass or fail hole by hole with the reasons and numbers. The
 * answer is cached per rivet, so the disposition form shows the same one.
 */
export function RepairCheckPanel({ f }: { f: FindingDetail }) {
  const u = useUnits();
  const options = f.context.oversizeOptions;
  const choices = oversizeChoices(f, u);
  const [chosen, setChosen] = useState<string | null>(options?.[0]?.code ?? null);
  const check = useRepairCheckQuery(f.id, chosen);
  const result = check.data;
  const stored = f.repair?.check ?? null;

  return (
    <View style={{ gap: space.md }} testID="repair-check-panel">
      <Txt variant="small" tone="soft">
        Drill {f.holeIds.length === 1 ? 'hole' : `all ${f.holeIds.length} holes`}{' '}
        <Mono variant="small" bold>
          {f.holeIds.join(' ')}
        </Mono>{' '}
        out for a larger rivet than the traveler’s{' '}
        <Mono variant="small" bold>
          {f.context.rivetSpec}
        </Mono>
        ? Each hole is checked with the edge distance as measured where the finding has it (as laid out otherwise), the
        pitch to its neighbours, and the loads of the part’s engineering basis.
      </Txt>

      <View style={{ gap: space.xs }}>
        <Label>Next-size rivet</Label>
        {choices.length ? (
          <Choice options={choices} value={chosen} onChange={setChosen} testIDPrefix="repair-proposed" />
        ) : options ? (
          <Notice tone="caution" testID="repair-no-larger">
            <Txt>
              {f.context.rivetSpec} is the largest size of its family: there is no next-size rivet of the same kind.
            </Txt>
          </Notice>
        ) : (
          <Txt variant="small" tone="faint">
            The next size up of {f.context.rivetSpec}, as the server knows it.
          </Txt>
        )}
      </View>

      <Button
        label="Check every hole"
        busyLabel="Checking"
        busy={check.isFetching}
        onPress={() => void check.refetch()}
        testID="repair-check"
        accessibilityLabel="Check the repair"
      />

      {check.isError && !check.isFetching ? (
        <Notice tone="error" testID="repair-error">
          <Txt tone="error" bold>
            The check could not be made
          </Txt>
          <Txt>{errorMessage(check.error)}</Txt>
        </Notice>
      ) : null}

      {stored ? (
        <View style={styles.stored} testID="repair-check-stored">
          <VerdictMark pass={stored.pass} size={20} />
          <Txt variant="small" style={{ flex: 1 }}>
            Kept with the disposition:{' '}
            <Txt variant="small" bold tone={stored.pass ? 'ink' : 'error'}>
              {stored.pass ? 'PASS' : 'FAIL'}
            </Txt>
            {f.repair?.rivetSpec ? (
              <>
                {' '}
                for{' '}
                <Mono variant="small" bold>
                  {f.repair.rivetSpec}
                </Mono>
              </>
            ) : null}
            {stored.reasons.length
              ? ` (${stored.reasons.length} reason${stored.reasons.length === 1 ? '' : 's'}, under “The disposition”)`
              : ''}
            . A check run here is asked afresh and is not kept.
          </Txt>
        </View>
      ) : null}

      {result ? <RepairResultView result={result} nominalEdgeIn={f.context.edgeDistanceIn} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  verdict: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    flexWrap: 'wrap',
    borderWidth: 2,
    borderRadius: radius.md,
    padding: space.md,
  },
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  req: { gap: space.xs, paddingVertical: space.sm, borderBottomWidth: hairline, borderColor: colors.rule },
  reqLabel: { minWidth: 160 },
  reqValues: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  hole: {
    gap: space.sm,
    padding: space.md,
    borderWidth: hairline,
    borderColor: colors.rule,
    borderRadius: radius.sm,
    backgroundColor: colors.paperRaised,
  },
  holeFail: { borderColor: colors.error, borderLeftWidth: 4 },
  holeHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  msTable: { borderTopWidth: hairline, borderColor: colors.ink },
  msRow: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingVertical: space.xs,
    borderBottomWidth: hairline,
    borderColor: colors.rule,
  },
  msHead: { width: 96, textAlign: 'right' },
  msCell: {
    width: 96,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    borderWidth: 2,
    borderColor: 'transparent',
    borderRadius: radius.sm,
  },
  msNegative: { borderColor: colors.error, backgroundColor: colors.errorSoft },
  stored: {
    flexDirection: 'row',
    gap: space.sm,
    alignItems: 'center',
    padding: space.sm,
    borderWidth: hairline,
    borderColor: colors.rule,
    backgroundColor: colors.paperSunk,
  },
  override: {
    gap: space.xs,
    borderWidth: 2,
    borderColor: colors.error,
    backgroundColor: colors.errorSoft,
    padding: space.md,
    borderRadius: radius.md,
  },
});
