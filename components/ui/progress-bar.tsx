import { Platform, StyleSheet, View, type ViewStyle } from 'react-native';
import { colors, hairline, space, statusColors } from '@/constants/theme';
import { Mono, Txt } from './text';

/**
 * Done over total, drawn as a scale bar with tick marks every tenth. `awaiting` (holes waiting for the
 * inspector) is a second, hatched segment after the done one, counted apart in words: a hole waiting
 * for a check is not done, but it is not untouched either.
 *
 * Only the bar itself is the progressbar (named, with its value): a progressbar's children are
 * presentational, so with the role on the whole block "8 / 55 holes done" was hidden from screen
 * readers. The words stay outside it, read as text.
 */
export function ProgressBar({
  done,
  total,
  awaiting,
  label = 'holes done',
  awaitingLabel = 'awaiting the inspector',
  testID = 'progress',
}: {
  done: number;
  total: number;
  awaiting?: number;
  label?: string;
  awaitingLabel?: string;
  testID?: string;
}) {
  const frac = total > 0 ? Math.min(1, done / total) : 0;
  const waitFrac = total > 0 && awaiting ? Math.min(1 - frac, awaiting / total) : 0;
  const pct = Math.round(frac * 100);
  return (
    <View testID={testID} style={{ gap: space.xs }}>
      <View style={styles.row}>
        <Mono bold testID={`${testID}-count`}>
          {done} / {total}
        </Mono>
        <Txt variant="small" tone="soft">
          {label}
        </Txt>
        <Mono variant="small" tone="soft" style={{ marginLeft: 'auto' }}>
          {pct}%
        </Mono>
      </View>
      <View
        style={styles.track}
        role="progressbar"
        aria-label={label.charAt(0).toUpperCase() + label.slice(1)}
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={`${done} of ${total} ${label}${awaiting ? `, ${awaiting} ${awaitingLabel}` : ''}`}
        testID={`${testID}-bar`}
      >
        <View style={[styles.fill, { width: `${frac * 100}%` }]} />
        {waitFrac > 0 ? (
          <View style={[styles.wait, { left: `${frac * 100}%`, width: `${waitFrac * 100}%` }]}>
            {/* Hatching, so the second segment reads without colour. */}
            <Hatching />
          </View>
        ) : null}
        {Array.from({ length: 9 }, (_, i) => (
          <View key={i} style={[styles.tick, { left: `${(i + 1) * 10}%` }]} />
        ))}
      </View>
      {awaiting !== undefined ? (
        <View style={styles.row} testID={`${testID}-awaiting`}>
          <View style={styles.key} aria-hidden>
            <View style={[styles.hatch, { left: 3 }]} />
          </View>
          <Mono bold>{awaiting}</Mono>
          <Txt variant="small" tone="soft">
            {awaiting === 1 ? 'hole' : 'holes'} {awaitingLabel}
          </Txt>
        </View>
      ) : null}
    </View>
  );
}

/**
 * Slanted strokes 8 px apart across the segment. On the web one repeating gradient draws them all (the
 * 2 px strokes of the phone's version, 30° from upright): eighty views were a tenth of a traveler's page.
 */
function Hatching() {
  if (Platform.OS === 'web')
    return <View style={[StyleSheet.absoluteFill, webHatching as ViewStyle]} testID="hatching" />;
  return (
    <>
      {Array.from({ length: 80 }, (_, i) => (
        <View key={i} style={[styles.hatch, { left: i * 8 }]} />
      ))}
    </>
  );
}

/** 8 px across is 8·cos 30° ≈ 6.93 px between strokes along the gradient, which runs square to them. */
const webHatching = {
  backgroundImage: `repeating-linear-gradient(120deg, ${statusColors.reworked} 0 2px, transparent 2px 6.93px)`,
};

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  track: {
    height: 14,
    borderWidth: hairline,
    borderColor: colors.ink,
    backgroundColor: colors.paperRaised,
    overflow: 'hidden',
  },
  fill: { position: 'absolute', left: 0, top: 0, bottom: 0, backgroundColor: statusColors.installed },
  wait: {
    position: 'absolute',
    top: 0,
    bottom: 0,
    backgroundColor: colors.paperSunk,
    overflow: 'hidden',
    borderLeftWidth: hairline,
    borderColor: colors.ink,
  },
  hatch: {
    position: 'absolute',
    top: -4,
    bottom: -4,
    width: 2,
    backgroundColor: statusColors.reworked,
    transform: [{ rotate: '30deg' }],
  },
  key: {
    width: 14,
    height: 10,
    borderWidth: hairline,
    borderColor: colors.ink,
    backgroundColor: colors.paperSunk,
    overflow: 'hidden',
    alignSelf: 'center',
  },
  tick: { position: 'absolute', top: 0, width: hairline, height: 5, backgroundColor: colors.ink },
});
