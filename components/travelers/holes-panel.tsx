import { memo, useEffect, useRef } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { holesDoneStatuses, type FastenerLine, type Hole } from '@/db/contracts';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { HoleMark, holeStatusLabels } from '@/components/ui/status-mark';
import { moveFocusTo } from '@/components/ui/focus';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';
import { useUnits } from '@/hooks/use-units';
import type { RunPick, RunPlan } from './run-selection';

type ChipProps = {
  hole: Hole;
  station: string;
  /** Picking a run's ends: the chip picks, it does not tick. */
  picking: boolean;
  inRun: boolean;
  isRunStart: boolean;
  focused: boolean;
  disabled: boolean;
  onPress: (h: Hole) => void;
};

/**
 * One hole: its mark, id, station and status in words, big enough for a gloved thumb. Ticking, it is
 * a checkbox (checked when done); picking a run's ends, a button that is pressed while the hole is in
 * the run: a press then picks, it does not tick, and a checkbox would say otherwise.
 */
const HoleChip = memo(function HoleChip({ hole, station, picking, inRun, isRunStart, focused, disabled, onPress }: ChipProps) {
  // Done for good, as the rules module counts it: a reworked hole still waits for the inspector.
  const done = holesDoneStatuses.includes(hole.status);
  const name = `${hole.holeId}, station ${station}, ${holeStatusLabels[hole.status]}`;
  const style = ({ pressed }: { pressed: boolean }) => [
    styles.chip,
    done && { backgroundColor: colors.paper },
    inRun && styles.inRun,
    isRunStart && styles.runStart,
    focused && styles.focused,
    pressed && { opacity: 0.7 },
  ];
  const body = (
    <>
      <View style={styles.chipTop}>
        <HoleMark status={hole.status} size={20} decorative />
        <Mono bold>{hole.holeId}</Mono>
      </View>
      <Mono variant="small" tone="soft">{station}</Mono>
      {/* The state in words as well as in the mark's shape and colour: read in bad light, and without colour. */}
      <Txt variant="small" bold={hole.status !== 'pending' && hole.status !== 'installed'}>{holeStatusLabels[hole.status]}</Txt>
    </>
  );
  if (picking) {
    return (
      <Pressable
        testID={`hole-${hole.holeId}`}
        accessibilityRole="button"
        aria-pressed={inRun}
        accessibilityLabel={`${name}${isRunStart ? ', first of the run' : inRun ? ', in the run' : ''}`}
        onPress={() => onPress(hole)}
        style={style}
      >
        {body}
      </Pressable>
    );
  }
  return (
    <Toggle
      kind="checkbox"
      checked={done}
      testID={`hole-${hole.holeId}`}
      accessibilityLabel={name}
      disabled={disabled}
      onPress={() => onPress(hole)}
      style={style}
    >
      {body}
    </Toggle>
  );
});

type Props = {
  lines: FastenerLine[];
  holes: Hole[];
  canTick: boolean;
  mode: 'tap' | 'run';
  pick: RunPick;
  run: Hole[];
  plan: RunPlan | null;
  focusId: string | null;
  onHolePress: (h: Hole) => void;
  onStartRun: () => void;
  onCancelRun: () => void;
  onTickRun: () => void;
  message: { tone: 'error' | 'info'; text: string } | null;
};

export function HolesPanel({ lines, holes, canTick, mode, pick, run, plan, focusId, onHolePress, onStartRun, onCancelRun, onTickRun, message }: Props) {
  const u = useUnits();
  const runSet = new Set(run.map((h) => h.holeId));
  // Focus follows the work: into the run bar when a run starts (its button is gone), back to
  // "Tick a run" when it ends; without this focus fell to the page and a keyboard user started over.
  const runBarRef = useRef<View>(null);
  const runModeRef = useRef<View>(null);
  const lastMode = useRef(mode);
  useEffect(() => {
    if (lastMode.current === mode) return;
    lastMode.current = mode;
    moveFocusTo(mode === 'run' ? runBarRef.current : runModeRef.current);
  }, [mode]);
  return (
    <View style={{ gap: space.md }} testID="holes">
      {canTick ? (
        mode === 'tap' ? (
          <View style={styles.bar}>
            <Txt variant="small" tone="soft" style={{ flex: 1, minWidth: 160 }}>Tap a hole to tick it in, or tap again to take the tick off.</Txt>
            <Button ref={runModeRef} label="Tick a run" variant="secondary" onPress={onStartRun} testID="run-mode" />
          </View>
        ) : (
          <View
            ref={runBarRef}
            style={[styles.bar, styles.runBar]}
            testID="run-bar"
            role="group"
            aria-label="Tick a run"
          >
            <Txt style={{ flex: 1, minWidth: 180 }} testID="run-summary" accessibilityLiveRegion="polite">
              {!pick ? 'Tap the first hole of the run.'
                : !pick.lastId ? `From ${pick.firstId}: now tap the last hole of the run on line ${pick.line}.`
                  : plan?.summary}
            </Txt>
            <View style={styles.runButtons}>
              <Button label="Cancel" variant="quiet" onPress={onCancelRun} testID="run-cancel" />
              <Button
                label={plan?.action?.status === 'pending' ? `Untick ${plan.action.holeIds.length}` : `Tick ${plan?.action?.holeIds.length ?? 0} holes`}
                disabled={!pick?.lastId || !plan?.action}
                onPress={onTickRun}
                testID="tick-run"
              />
            </View>
          </View>
        )
      ) : null}
      {message ? <Notice tone={message.tone} testID={message.tone === 'error' ? 'tick-error' : 'tick-info'}>{message.text}</Notice> : null}
      {lines.map((line) => {
        const onLine = holes.filter((h) => h.line === line.code).sort((a, b) => a.seq - b.seq);
        const done = onLine.filter((h) => holesDoneStatuses.includes(h.status)).length;
        return (
          <View key={line.code} style={{ gap: space.sm }} testID={`holes-${line.code}`}>
            <Txt bold>
              <Mono bold>{line.code}</Mono> {line.name} <Mono variant="small" tone="soft">{done}/{onLine.length}</Mono>
            </Txt>
            <View style={styles.grid}>
              {onLine.map((h) => (
                <HoleChip
                  key={h.holeId}
                  hole={h}
                  station={u.station(h.stationIn)}
                  picking={mode === 'run'}
                  inRun={mode === 'run' && runSet.has(h.holeId)}
                  isRunStart={mode === 'run' && pick?.firstId === h.holeId}
                  focused={focusId === h.holeId}
                  disabled={!canTick}
                  onPress={onHolePress}
                />
              ))}
            </View>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' },
  runBar: { backgroundColor: colors.accentSoft, padding: space.md, borderWidth: hairline, borderColor: colors.accent },
  runButtons: { flexDirection: 'row', gap: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    // Two to a row even on a phone at 200 % text; a longer hole id widens its chip rather than breaking.
    minWidth: 76,
    minHeight: touch + 8,
    paddingHorizontal: space.sm,
    paddingVertical: space.xs,
    borderWidth: hairline,
    borderColor: colors.ruleStrong,
    borderRadius: radius.sm,
    backgroundColor: colors.paperRaised,
    justifyContent: 'center',
    gap: 2,
  },
  chipTop: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  inRun: { borderColor: colors.accent, borderWidth: 2, backgroundColor: colors.accentSoft },
  runStart: { borderStyle: 'dashed' },
  focused: { borderColor: colors.accent, borderWidth: 3 },
});
