import { useMemo, useState } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';
import {
  complianceStatuses,
  complianceStatusLabels,
  type ComplianceCounts,
  type ComplianceStatus,
  type NoticeBuildAnswer,
  type NoticeFile,
} from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { shortDate } from '@/components/findings/finding-row';
import { Choice } from '@/components/ui/choice';
import { GridTable } from '@/components/ui/grid-table';
import { Mono, Txt } from '@/components/ui/text';
import { ComplianceStatusTag, countsWords } from './notice-marks';

type Show = ComplianceStatus | 'all';

/** Who answered and when: the answer's, or the reading's while nothing is recorded yet. */
export function whoWhen(a: NoticeBuildAnswer): string {
  if (a.answeredAt) return `${a.answeredByName ?? 'Someone'}, ${shortDate(a.answeredAt)}`;
  if (a.acknowledgedAt) return `Read by ${a.acknowledgedByName ?? 'someone'}, ${shortDate(a.acknowledgedAt)}`;
  return '–';
}

/** A build's answer photos as small thumbnails that open large. */
export function AnswerPhotos({
  photos,
  prefix,
  onOpen,
}: {
  photos: NoticeFile[];
  prefix: string;
  onOpen: (photos: NoticeFile[], i: number) => void;
}) {
  if (!photos.length) return <Txt tone="faint">–</Txt>;
  return (
    <View style={styles.photos}>
      {photos.map((p, i) => (
        <Pressable
          key={p.id}
          onPress={() => onOpen(photos, i)}
          testID={`${prefix}-${i}`}
          accessibilityRole="button"
          accessibilityLabel={`Photo ${i + 1} of the work, open large`}
        >
          <Image source={{ uri: p.thumbUrl ?? p.url }} style={styles.thumb} />
        </Pressable>
      ))}
    </View>
  );
}

const columns = [
  { key: 'serial', title: 'Kit serial', width: 130 },
  { key: 'status', title: 'Status', width: 200 },
  { key: 'who', title: 'Who, when', width: 220 },
  { key: 'words', title: 'Note or reason', width: 260 },
  { key: 'photos', title: 'Photos', width: 150 },
];

/**
 * The supplier's view of every reached build's answer: counts by status, a status filter (each chip with
 * its count), and one row per build in kit-serial order.
 */
export function ComplianceTable({
  builds,
  counts,
  onOpenPhoto,
}: {
  builds: NoticeBuildAnswer[];
  counts: ComplianceCounts;
  onOpenPhoto: (photos: NoticeFile[], i: number) => void;
}) {
  const [show, setShow] = useState<Show>('all');
  const rows = useMemo(
    () =>
      builds
        .filter((b) => show === 'all' || b.status === show)
        .sort((a, b) => a.kitSerial.localeCompare(b.kitSerial, undefined, { numeric: true })),
    [builds, show],
  );
  return (
    <View style={{ gap: space.md }} testID="compliance-table">
      <Txt bold testID="compliance-counts">
        {countsWords(counts)}
      </Txt>
      <Choice
        label="Show builds"
        testIDPrefix="compliance-show"
        value={show}
        onChange={setShow}
        options={[
          { value: 'all', label: `All (${builds.length})` },
          ...complianceStatuses.map((s) => ({ value: s, label: `${complianceStatusLabels[s]} (${counts[s]})` })),
        ]}
      />
      {rows.length ? (
        <GridTable
          label="Each build’s answer"
          columns={columns}
          rows={rows.map((a) => ({
            key: a.buildId,
            testID: `compliance-row-${a.kitSerial}`,
            cells: {
              serial: <Mono bold>{a.kitSerial}</Mono>,
              status: <ComplianceStatusTag status={a.status} />,
              who: <Txt variant="small">{whoWhen(a)}</Txt>,
              words: (
                <Txt variant="small" testID={`compliance-words-${a.kitSerial}`}>
                  {a.note ?? a.reason ?? '–'}
                </Txt>
              ),
              photos: (
                <AnswerPhotos photos={a.photos} prefix={`compliance-photo-${a.kitSerial}`} onOpen={onOpenPhoto} />
              ),
            },
          }))}
        />
      ) : (
        <Txt tone="soft" testID="compliance-none">
          {builds.length ? 'No build in this state.' : 'No shipped build is reached by this notice.'}
        </Txt>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  thumb: { width: 56, height: 56, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperSunk },
});
