import { memo } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';
import { buildLogKindLabels, clockIsOff, type BuildLogEntry } from '@/db/contracts';
import { colors, hairline, space, touch } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Label, Mono, Txt } from '@/components/ui/text';
import { url } from '@/lib/api-client';
import { timingNote } from '@/lib/log-timing';
import { dayLabel, timeOf } from './log-view';

/** A day's heading in the timeline, like a dated line across a log book page. */
export function LogDayHeading({ day, count }: { day: string; count: number }) {
  return (
    <View style={styles.day} testID={`log-day-${day}`} accessibilityRole="header">
      <Txt bold style={{ flex: 1 }}>
        {dayLabel(day)}
      </Txt>
      <Txt variant="small" tone="soft">
        {count} {count === 1 ? 'entry' : 'entries'}
      </Txt>
    </View>
  );
}

/** One thing that happened: when (and when it arrived, if much later), what kind, on which part, who, their words and the finding's photos. */
export const LogEntryRow = memo(function LogEntryRow({
  e,
  onOpenFinding,
}: {
  e: BuildLogEntry;
  onOpenFinding: (findingId: string) => void;
}) {
  const finding = e.group === 'findings';
  const timing = timingNote(e);
  return (
    <View style={styles.row} testID={`log-entry-${e.id}`}>
      <View
        style={[
          styles.tick,
          finding && { backgroundColor: colors.ink },
          e.group === 'sign_off' && { backgroundColor: colors.accent, borderColor: colors.accent },
        ]}
      />
      <View style={{ flex: 1, gap: 2 }}>
        <View style={styles.top}>
          <Mono variant="small" bold>
            {timeOf(e.at)}
          </Mono>
          <Label tone={e.group === 'sign_off' ? 'accent' : finding ? 'ink' : 'soft'}>
            {buildLogKindLabels[e.kind]}
          </Label>
          <Mono variant="small" tone="soft">
            {e.partNumber}
          </Mono>
        </View>
        <Txt>{e.text}</Txt>
        {e.note ? <Txt tone="soft">“{e.note}”</Txt> : null}
        {timing ? (
          <Txt variant="small" tone={clockIsOff(e.clockOffsetMs) ? 'caution' : 'soft'} testID={`log-timing-${e.id}`}>
            {timing}
          </Txt>
        ) : null}
        <Txt variant="small" tone="soft">
          {e.actorName} · {e.actorRole} ·{' '}
          <Mono variant="small" tone="soft">
            {e.travelerSerial}
          </Mono>
        </Txt>
        {e.photos?.length ? (
          <View style={styles.photos}>
            {e.photos.map((p, i) =>
              e.findingId ? (
                <Pressable
                  key={p.id}
                  testID={`log-photo-${e.findingId}-${i}`}
                  accessibilityRole="button"
                  accessibilityLabel={`Photo ${i + 1} of the finding on ${(e.holeIds ?? []).join(', ')}: open the finding`}
                  onPress={() => onOpenFinding(e.findingId!)}
                  style={({ pressed }) => [pressed && { opacity: 0.7 }]}
                >
                  <Image source={{ uri: url(p.thumbUrl) }} style={styles.thumb} accessibilityIgnoresInvertColors />
                </Pressable>
              ) : (
                // A photo of the work: no finding to open; shown as the log's record of it.
                <Image
                  key={p.id}
                  testID={`log-photo-${e.id}-${i}`}
                  source={{ uri: url(p.thumbUrl) }}
                  style={styles.thumb}
                  accessibilityLabel={`Photo ${i + 1} of the work`}
                  accessibilityIgnoresInvertColors
                />
              ),
            )}
          </View>
        ) : null}
        {e.findingId && !e.photos?.length ? (
          <Button
            label="Open the finding"
            variant="quiet"
            compact
            onPress={() => onOpenFinding(e.findingId!)}
            testID={`log-open-finding-${e.id}`}
            style={{ alignSelf: 'flex-start', marginLeft: -space.md }}
          />
        ) : null}
      </View>
    </View>
  );
});

const styles = StyleSheet.create({
  day: {
    flexDirection: 'row',
    alignItems: 'baseline',
    gap: space.sm,
    paddingTop: space.lg,
    paddingBottom: space.xs,
    borderBottomWidth: hairline,
    borderColor: colors.ink,
    backgroundColor: colors.paper,
  },
  row: {
    flexDirection: 'row',
    gap: space.md,
    paddingVertical: space.sm,
    paddingLeft: space.md,
    marginLeft: 6,
    borderLeftWidth: hairline,
    borderColor: colors.ruleStrong,
    minHeight: touch,
  },
  tick: {
    position: 'absolute',
    left: -6,
    top: space.md + 2,
    width: 11,
    height: 11,
    backgroundColor: colors.paper,
    borderWidth: 2,
    borderColor: colors.ink,
  },
  top: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm, flexWrap: 'wrap' },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, paddingTop: space.xs },
  thumb: { width: 72, height: 72, borderWidth: hairline, borderColor: colors.rule, backgroundColor: colors.paperSunk },
});
