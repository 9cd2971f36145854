import { memo } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { holesDoneStatuses, holeStatuses, type Hole } from '@/db/contracts';
import { colors, hairline, radius, space, touch } from '@/constants/theme';
import { HoleMark, holeStatusLabels } from '@/components/ui/status-mark';
import { Mono, Txt } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';

/** The narrowest chip: two to a row even on a phone at 200 % text. */
export const CHIP_MIN = 76;
export const CHIP_GAP = space.sm;

type ChipProps = {
  hole: Hole;
  station: string;
  /** Picking a run's ends: the chip picks, it does not tick. */
  picking: boolean;
  inRun: boolean;
  isRunStart: boolean;
  focused: boolean;
  disabled: boolean;
  /** The column's width, once the list knows it; all chips of the list are as wide. */
  width?: number;
  onPress: (h: Hole) => void;
  /** Where keyboard focus is: the list keeps that hole drawn while it is scrolled away. */
  onFocusHole?: (holeId: string | null) => void;
};

const bolded = (s: Hole['status']) => s !== 'pending' && s !== 'installed';

function ChipBody({ hole, station }: { hole: Pick<Hole, 'holeId' | 'status'>; station: string }) {
  return (
    <>
      <View style={styles.chipTop}>
        <HoleMark status={hole.status} size={20} decorative />
        <Mono bold>{hole.holeId}</Mono>
      </View>
      <Mono variant="small" tone="soft">
        {station}
      </Mono>
      {/* The state in words as well as in the mark's shape and colour: read in bad light, and without colour. */}
      <Txt variant="small" bold={bolded(hole.status)}>
        {holeStatusLabels[hole.status]}
      </Txt>
    </>
  );
}

/**
 * One hole: its mark, id, station and status in words, big enough for a gloved thumb. Ticking, it is
 * a checkbox (checked when done); picking a run's ends, a button that is pressed while the hole is in
 * the run: a press then picks, it does not tick, and a checkbox would say otherwise.
 * Everything it shows comes from its props (the hole and the run, by hole id), so a chip drawn again
 * for another row after scrolling shows that hole's state, never the last one's.
 */
export const HoleChip = memo(function HoleChip({
  hole,
  station,
  picking,
  inRun,
  isRunStart,
  focused,
  disabled,
  width,
  onPress,
  onFocusHole,
}: ChipProps) {
  // Done for good, as the rules module counts it: a reworked hole still waits for the inspector.
  const done = holesDoneStatuses.includes(hole.status);
  const name = `${hole.holeId}, station ${station}, ${holeStatusLabels[hole.status]}`;
  const style = ({ pressed }: { pressed: boolean }) => [
    styles.chip,
    width ? { width } : null,
    done && { backgroundColor: colors.paper },
    inRun && styles.inRun,
    isRunStart && styles.runStart,
    focused && styles.focused,
    pressed && { opacity: 0.7 },
  ];
  const focusProps = onFocusHole ? { onFocus: () => onFocusHole(hole.holeId), onBlur: () => onFocusHole(null) } : {};
  if (picking) {
    return (
      <Pressable
        testID={`hole-${hole.holeId}`}
        accessibilityRole="button"
        aria-pressed={inRun}
        accessibilityLabel={`${name}${isRunStart ? ', first of the run' : inRun ? ', in the run' : ''}`}
        onPress={() => onPress(hole)}
        style={style}
        {...focusProps}
      >
        <ChipBody hole={hole} station={station} />
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
      {...focusProps}
    >
      <ChipBody hole={hole} station={station} />
    </Toggle>
  );
});

/**
 * An unseen chip holding the longest id, station and status words of the part: its width is the
 * width of every column, measured in the fonts and text size on screen, so no chip's words break or
 * run over whichever hole it is showing.
 */
export function ChipProbe({
  holeId,
  station,
  onWidth,
  ref,
}: {
  holeId: string;
  station: string;
  onWidth: (w: number) => void;
  ref?: React.Ref<View>;
}) {
  return (
    <View
      ref={ref}
      style={[styles.chip, styles.probe]}
      aria-hidden
      importantForAccessibility="no-hide-descendants"
      pointerEvents="none"
      onLayout={(e) => onWidth(Math.ceil(e.nativeEvent.layout.width))}
      testID="hole-chip-probe"
    >
      <ChipBody hole={{ holeId, status: 'pending' }} station={station} />
      {holeStatuses.map((s) => (
        <Txt key={s} variant="small" bold={bolded(s)}>
          {holeStatusLabels[s]}
        </Txt>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  chip: {
    // A longer hole id widens the column (see ChipProbe) rather than breaking.
    minWidth: CHIP_MIN,
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
  probe: { position: 'absolute', left: 0, top: 0, opacity: 0, alignSelf: 'flex-start' },
  chipTop: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  inRun: { borderColor: colors.accent, borderWidth: 2, backgroundColor: colors.accentSoft },
  runStart: { borderStyle: 'dashed' },
  focused: { borderColor: colors.accent, borderWidth: 3 },
});
