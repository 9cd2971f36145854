import { memo } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { holesDoneStatuses, type FastenerLine, type Hole } from '@/db/contracts';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { HoleMark, holeStatusLabels } from '@/components/ui/status-mark';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import type { RunPick, RunPlan } from './run-selection';

type ChipProps = {
  hole: Hole;
  station: string;
  inRun: boolean;
  isRunStart: boolean;
  focused: boolean;
  disabled: boolean;
  onPress: (h: Hole) => void;
};

/** One hole: its mark, id and station, big enough for a gloved thumb. */
const HoleChip = memo(function HoleChip({ hole, station, inRun, isRunStart, focused, disabled, onPress }: ChipProps) {
  // Done for good, as the rules module counts it: a reworked hole still waits for the inspector.
  const done = holesDoneStatuses.includes(hole.status);
  return (
    <Pressable
      testID={`hole-${hole.holeId}`}
      accessibilityRole="checkbox"
      aria-checked={done}
      aria-disabled={disabled}
      aria-selected={inRun}
      accessibilityLabel={`${hole.holeId}, station ${station}, ${holeStatusLabels[hole.status]}`}
      disabled={disabled}
      onPress={() => onPress(hole)}
      style={({ pressed }) => [
        styles.chip,
        done && { backgroundColor: colors.paper },
        inRun && styles.inRun,
        isRunStart && styles.runStart,
        focused && styles.focused,
        pressed && { opacity: 0.7 },
      ]}
    >
      <View style={styles.chipTop}>
        <HoleMark status={hole.status} size={20} />
        <Mono bold>{hole.holeId}</Mono>
      </View>
      <Mono variant="small" tone="soft">{station}</Mono>
    </Pressable>
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
  return (
    <View style={{ gap: space.md }} testID="holes">
      {canTick ? (
        mode === 'tap' ? (
          <View style={styles.bar}>
            <Txt variant="small" tone="soft" style={{ flex: 1, minWidth: 160 }}>Tap a hole to tick it in, or tap again to take the tick off.</Txt>
            <Button label="Tick a run" variant="secondary" onPress={onStartRun} testID="run-mode" />
          </View>
        ) : (
          <View style={[styles.bar, styles.runBar]} testID="run-bar">
            <Txt style={{ flex: 1, minWidth: 180 }} testID="run-summary">
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
    minWidth: 96,
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
