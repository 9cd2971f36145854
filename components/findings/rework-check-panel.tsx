import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { Circle, Path, Rect } from 'react-native-svg';
import type { FindingDetail } from '@/db/contracts';
import { colors, hairline, radius, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { errorMessage } from '@/hooks/api-client';
import { useFindingReworkCheckMutation, type ReworkCheckResult } from '@/hooks/queries/findings';
import { useUnits, type Units } from '@/hooks/use-units';

const fractions: Record<number, string> = { 3: '3/32', 4: '1/8', 5: '5/32', 6: '3/16', 8: '1/4' };

function sizeLabel(dash: number, u: Units): string {
  // The rivet's nominal size: the trade's fraction in inches, millimetres on the metric switch.
  return u.system === 'imperial' ? `${fractions[dash] ?? `${dash}/32`} in` : u.length(dash / 32);
}

/** A margin of safety as read on a stress sheet: signed, two places; "—" where no load was applied. */
export function formatMargin(ms: number | null): string {
  if (ms === null || !Number.isFinite(ms)) return '—';
  return `${ms < 0 ? '−' : '+'}${Math.abs(ms).toFixed(2)}`;
}

export const alternativeWords: Record<NonNullable<ReworkCheckResult['alternative']>, { title: string; body: string }> = {
  'repair with doubler': {
    title: 'Repair with a doubler',
    body: 'The oversize hole does not fit here, but there is sound sheet round it: an approved doubler repair (disposition "Repair").',
  },
  scrap: {
    title: 'Scrap',
    body: 'The oversize hole would all but break into the edge or its neighbour: nothing sound is left for a repair to hold on to.',
  },
};

/** Pass: a ringed tick in green. Fail: a square with a cross in red. Shape and colour both tell it. */
export function VerdictMark({ pass, size = 20 }: { pass: boolean; size?: number }) {
  const s = size;
  const k = s * 0.28;
  const c = s / 2;
  return (
    <View style={{ width: s, height: s }} accessibilityLabel={pass ? 'meets (tick in a circle)' : 'fails (cross in a square)'}>
      <Svg width={s} height={s} viewBox={`0 0 ${s} ${s}`}>
        {pass ? (
          <>
            <Circle cx={c} cy={c} r={c - 1} fill={colors.ok} />
            <Path
              d={`M ${c - k} ${c} L ${c - k * 0.25} ${c + k * 0.75} L ${c + k} ${c - k * 0.65}`}
              fill="none" stroke={colors.paperRaised} strokeWidth={Math.max(1.6, s * 0.12)} strokeLinecap="round" strokeLinejoin="round"
            />
          </>
        ) : (
          <>
            <Rect x={1} y={1} width={s - 2} height={s - 2} fill={colors.error} />
            <Path
              d={`M ${c - k} ${c - k} L ${c + k} ${c + k} M ${c + k} ${c - k} L ${c - k} ${c + k}`}
              fill="none" stroke={colors.paperRaised} strokeWidth={Math.max(1.6, s * 0.12)} strokeLinecap="round"
            />
          </>
        )}
      </Svg>
    </View>
  );
}

/** One layout requirement against what the hole has: "needs ≥ x · has y", and whether it meets it. */
function Requirement({ label, required, actual, none, testID, u }: {
  label: string; required: number; actual: number | null; none?: string; testID: string; u: Units;
}) {
  const short = actual !== null && actual < required - 1e-9;
  return (
    <View style={styles.req} testID={testID}>
      <Txt variant="small" tone="soft" style={styles.reqLabel}>{label}</Txt>
      {actual === null ? (
        <Txt variant="small" tone="faint">{none}</Txt>
      ) : (
        <View style={styles.reqValues}>
          <VerdictMark pass={!short} size={18} />
          <Txt variant="small">
            needs ≥ <Mono variant="small" bold>{u.length(required)}</Mono>
            {'  ·  '}has <Mono variant="small" bold tone={short ? 'error' : 'ink'}>{u.length(actual)}</Mono>
          </Txt>
          <Txt variant="small" bold tone={short ? 'error' : 'soft'}>
            {short ? `short by ${u.length(required - actual)}` : 'enough'}
          </Txt>
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
      accessibilityLabel={value === null ? 'not checked, no applied load' : `${negative ? 'negative margin ' : 'margin '}${formatMargin(value)}`}
    >
      <Mono bold={negative} tone={negative ? 'error' : value === null ? 'faint' : 'ink'} align="right">{formatMargin(value)}</Mono>
    </View>
  );
}

function Margins({ m }: { m: ReworkCheckResult['margins'] }) {
  const rows: { key: 'shear' | 'tension' | 'combined'; label: string }[] = [
    { key: 'shear', label: 'Shear' },
    { key: 'tension', label: 'Tension' },
    { key: 'combined', label: 'Combined' },
  ];
  const values = Object.values(m);
  const anyNegative = values.some((v) => v !== null && v < 0);
  const anyMissing = values.some((v) => v === null);
  return (
    <View style={{ gap: space.xs }} testID="rework-margins">
      <Label>Margins of safety with the new rivet</Label>
      <View style={styles.msTable}>
        <View style={styles.msRow}>
          <View style={{ flex: 1 }} />
          <Txt variant="small" tone="soft" style={styles.msHead}>limit</Txt>
          <Txt variant="small" tone="soft" style={styles.msHead}>ultimate</Txt>
        </View>
        {rows.map((r) => (
          <View key={r.key} style={styles.msRow}>
            <Txt variant="small" style={{ flex: 1 }}>{r.label}</Txt>
            <MarginCell value={m[`${r.key}Limit`]} testID={`rework-ms-${r.key}-limit`} />
            <MarginCell value={m[`${r.key}Ultimate`]} testID={`rework-ms-${r.key}-ultimate`} />
          </View>
        ))}
      </View>
      {anyNegative ? <Txt variant="small" tone="error">Boxed in red: a negative margin, the joint is weaker than the load it must carry.</Txt> : null}
      {anyMissing ? <Txt variant="small" tone="faint">— : no applied load at this hole, so that margin is not checked.</Txt> : null}
    </View>
  );
}

function Bullets({ items, testID, tone = 'ink' }: { items: string[]; testID: string; tone?: 'ink' | 'soft' | 'caution' | 'faint' | 'error' }) {
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      {items.map((t, i) => (
        <View key={i} style={{ flexDirection: 'row', gap: space.sm }}>
          <Txt variant="small" tone={tone}>–</Txt>
          <Txt variant="small" tone={tone} style={{ flex: 1 }}>{t}</Txt>
        </View>
      ))}
    </View>
  );
}

/** Everything the engine said about the proposed oversize rivet, in the order an inspector reads it. */
export function ReworkResultView({ result }: { result: ReworkCheckResult }) {
  const u = useUnits();
  const [showRules, setShowRules] = useState(false);
  const [prev, next] = result.pitchToNeighboursIn;
  const pass = result.pass;
  return (
    <View style={{ gap: space.md }}>
      <View
        style={[styles.verdict, { borderColor: pass ? colors.ok : colors.error, backgroundColor: pass ? colors.paperRaised : colors.errorSoft }]}
        testID="rework-result"
        accessibilityRole="summary"
        accessibilityLiveRegion="polite"
      >
        <VerdictMark pass={pass} size={36} />
        <View style={{ flex: 1, minWidth: 160 }}>
          <Txt variant="title" bold tone={pass ? 'ink' : 'error'}>{pass ? 'PASS' : 'FAIL'}</Txt>
          <Txt variant="small">
            <Mono variant="small" bold>{result.inputs.proposedSpec}</Mono> in place of <Mono variant="small">{result.inputs.rivetSpec}</Mono>
          </Txt>
        </View>
      </View>

      <View style={{ gap: space.xs }}>
        <Label>{pass ? 'Why it passes' : 'Why it fails'}</Label>
        {result.reasons.length ? (
          <Bullets items={result.reasons} testID="rework-reasons" tone="error" />
        ) : (
          <View testID="rework-reasons">
            <Txt variant="small">Edge distance, pitch to both neighbours and the margins that could be checked all meet the rules.</Txt>
          </View>
        )}
      </View>

      {result.alternative ? (
        <Notice tone="caution" testID="rework-alternative">
          <Txt bold>Instead: {alternativeWords[result.alternative].title}</Txt>
          <Txt variant="small">{alternativeWords[result.alternative].body}</Txt>
        </Notice>
      ) : null}

      <View style={styles.table}>
        <View style={styles.req} testID="rework-new-drill">
          <Txt variant="small" tone="soft" style={styles.reqLabel}>New drill</Txt>
          <Mono bold>{result.newDrill.name} · {u.length(result.newDrill.diameterIn)}</Mono>
        </View>
        <Requirement label="Edge distance" required={result.requiredEdgeIn} actual={result.inputs.edgeDistanceIn} testID="rework-edge" u={u} />
        <Requirement label="Pitch to the hole before" required={result.requiredPitchIn} actual={prev} none="no hole before (line start)" testID="rework-pitch-before" u={u} />
        <Requirement label="Pitch to the hole after" required={result.requiredPitchIn} actual={next} none="no hole after (line end)" testID="rework-pitch-after" u={u} />
      </View>

      <Margins m={result.margins} />

      {result.warnings.length ? (
        <View style={{ gap: space.xs }}>
          <Label>Be wary of</Label>
          <Bullets items={result.warnings} testID="rework-warnings" tone="caution" />
        </View>
      ) : null}

      {result.rules.length ? (
        <View style={{ gap: space.xs, alignItems: 'flex-start' }}>
          <Button
            label={showRules ? 'Hide the rules applied' : `Show the rules applied (${result.rules.length})`}
            variant="quiet"
            compact
            onPress={() => setShowRules((v) => !v)}
            testID="rework-rules-toggle"
            aria-expanded={showRules}
            style={{ marginLeft: -space.md }}
          />
          {showRules ? <Bullets items={result.rules} testID="rework-rules" tone="soft" /> : null}
        </View>
      ) : null}

      <Caution testID="rework-caution" text={result.caution || undefined} />
    </View>
  );
}

/**
 * The inspector's "what would drilling it out do?": choose the oversize rivet (the next size up unless
 * they choose otherwise), check, and read pass or fail with the reasons and numbers. `onResult` hands
 * each answer up so the disposition form can warn when rework is chosen against a failed check; with
 * `result` the screen keeps the latest answer (it survives the layout switching between one and two panes).
 */
export function ReworkCheckPanel({ f, result: kept, onResult }: {
  f: FindingDetail; result?: ReworkCheckResult | null; onResult?: (r: ReworkCheckResult) => void;
}) {
  const u = useUnits();
  const check = useFindingReworkCheckMutation(f.id);
  const current = f.context.rivetSpec;
  const options = f.context.oversizeOptions;
  const [own, setOwn] = useState<ReworkCheckResult | null>(null);
  const result = kept !== undefined ? kept : own;
  const [chosen, setChosen] = useState<string | null>(() => {
    const last = result?.inputs.proposedSpec;
    return options?.find((o) => o.code === last)?.code ?? options?.[0]?.code ?? null;
  });

  const run = () => {
    // The next size up is the server's default: send a spec only when the inspector chose another.
    const spec = chosen && options && chosen !== options[0]?.code ? chosen : undefined;
    check.mutate(spec, {
      onSuccess: (r) => {
        setOwn(r);
        onResult?.(r);
      },
    });
  };

  const stale = result && chosen && result.inputs.proposedSpec.toUpperCase() !== chosen.toUpperCase();

  return (
    <View style={{ gap: space.md }} testID="rework-check-panel">
      <Txt variant="small" tone="soft">
        Drill hole <Mono variant="small" bold>{f.holeIds[0]}</Mono> out for a larger rivet than the traveler’s{' '}
        <Mono variant="small" bold>{current}</Mono>? The check takes the edge distance and the pitch to the neighbours from the
        traveler, and the loads from the part’s engineering basis where it has one.
      </Txt>
      {f.holeIds.length > 1 ? (
        <Txt variant="small" tone="faint">This finding covers {f.holeIds.length} holes: the check is for the first, {f.holeIds[0]}.</Txt>
      ) : null}

      <View style={{ gap: space.xs }}>
        <Label>Oversize rivet</Label>
        {options && options.length ? (
          <Choice
            options={options.map((o) => ({
              value: o.code,
              label: o.code,
              hint: `${o.step === 1 ? 'next size up' : 'two sizes up'} · ${sizeLabel(o.dash, u)}`,
            }))}
            value={chosen}
            onChange={setChosen}
            testIDPrefix="rework-proposed"
          />
        ) : options ? (
          <Notice tone="caution" testID="rework-no-larger">
            <Txt>{current} is the largest size of its family: there is no oversize rivet of the same kind.</Txt>
          </Notice>
        ) : (
          <Txt variant="small" tone="faint">The next size up of {current}, as the server knows it.</Txt>
        )}
      </View>

      <Button
        label="Check"
        busyLabel="Checking"
        busy={check.isPending}
        onPress={run}
        testID="rework-check"
        accessibilityLabel="Check the rework"
      />

      {check.isError ? (
        <Notice tone="error" testID="rework-error">
          <Txt tone="error" bold>The check could not be made</Txt>
          <Txt>{errorMessage(check.error)}</Txt>
        </Notice>
      ) : null}

      {result ? (
        <>
          {stale ? (
            <Notice testID="rework-stale">
              <Txt variant="small">The result below is for {result.inputs.proposedSpec}. Press Check for {chosen}.</Txt>
            </Notice>
          ) : null}
          <ReworkResultView result={result} />
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  verdict: {
    flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap',
    borderWidth: 2, borderRadius: radius.md, padding: space.md,
  },
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  req: {
    gap: space.xs, paddingVertical: space.sm, borderBottomWidth: hairline, borderColor: colors.rule,
  },
  reqLabel: { minWidth: 160 },
  reqValues: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  msTable: { borderTopWidth: hairline, borderColor: colors.ink },
  msRow: {
    flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingVertical: space.xs,
    borderBottomWidth: hairline, borderColor: colors.rule,
  },
  msHead: { width: 96, textAlign: 'right' },
  msCell: { width: 96, paddingHorizontal: space.sm, paddingVertical: 2, borderWidth: 2, borderColor: 'transparent', borderRadius: radius.sm },
  msNegative: { borderColor: colors.error, backgroundColor: colors.errorSoft },
});
