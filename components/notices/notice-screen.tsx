import { useRouter } from 'expo-router';
import { View } from 'react-native';
import type { FindingPhoto, NoticeBuildAnswer, NoticeDetail, NoticeFile } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { shortDate } from '@/components/findings/finding-row';
import { usePhotoViewer } from '@/components/findings/photo-viewer';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { useNoticeQuery } from '@/hooks/queries/notices';
import { useSession } from '@/hooks/use-session';
import { ComplianceActions } from './compliance-form';
import { AnswerPhotos, ComplianceTable, whoWhen } from './compliance-table';
import { NoticeFilesView } from './notice-files';
import {
  ComplianceStatusTag,
  effectivityWords,
  isStructural,
  noticeCaution,
  NoticeLevelTag,
  noticeNumber,
} from './notice-marks';

/** The photo viewer's shape for a notice's or an answer's photo (no size known: it fits the screen). */
const asViewerPhoto = (f: NoticeFile): FindingPhoto => ({
  id: f.id,
  url: f.url,
  thumbUrl: f.thumbUrl ?? f.url,
  width: 0,
  height: 0,
  stage: 'found',
  eventId: null,
});

export function NoticeScreen({ noticeId }: { noticeId: string }) {
  const q = useNoticeQuery(noticeId);
  const { user } = useSession();
  const backTo = user?.role === 'supplier' ? '/catalogue' : '/builds';
  // A failed refetch after an answer keeps the notice on screen: its data is still the latest known.
  if (q.data) return <NoticeBody n={q.data} />;
  if (q.isError)
    return (
      <Screen title="Notice" backTo={backTo}>
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      </Screen>
    );
  return (
    <Screen title="Notice" backTo={backTo}>
      <LoadingState what="Loading the notice" />
    </Screen>
  );
}

function NoticeBody({ n }: { n: NoticeDetail }) {
  const { user } = useSession();
  const supplier = user?.role === 'supplier';
  const backTo = supplier ? `/catalogue/kits/${n.kitModelId}` : '/builds';
  const photoViewer = usePhotoViewer();
  const open = (files: NoticeFile[], index: number) => photoViewer.open(files.map(asViewerPhoto), index);

  const notice = (
    <>
      <View style={{ gap: space.sm }} testID="notice-head">
        <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
          <NoticeLevelTag level={n.level} />
          <Mono bold testID="notice-number">
            {noticeNumber(n.number)}
          </Mono>
        </View>
        <Txt variant="small" tone="soft">
          Issued by {n.issuedByName}, {shortDate(n.issuedAt)}
        </Txt>
      </View>
      {isStructural(n) ? <Caution text={noticeCaution} testID="notice-caution" /> : null}
      <Section title="What it asks">
        <Txt testID="notice-body">{n.body}</Txt>
        {n.files.length ? <NoticeFilesView files={n.files} onOpenPhoto={open} /> : null}
      </Section>
      <Section title="What it applies to" testID="notice-effectivity">
        {effectivityWords(n.effectivity, n.kitName).map((line) => (
          <Txt key={line}>{line}</Txt>
        ))}
      </Section>
    </>
  );

  const answers = supplier ? (
    <Section title="Each build’s answer" testID="notice-builds">
      <ComplianceTable builds={n.builds} counts={n.counts} onOpenPhoto={open} />
    </Section>
  ) : (
    <Section title={n.builds.length === 1 ? 'Your build' : 'Your builds'} testID="notice-builds">
      {n.builds.length ? (
        n.builds.map((a) => <BuildAnswer key={a.buildId} noticeId={n.id} a={a} onOpenPhoto={open} />)
      ) : (
        <Txt tone="soft">None of your builds is reached by this notice.</Txt>
      )}
    </Section>
  );

  return (
    <Screen
      title={n.title}
      subtitle={`${noticeNumber(n.number)} · ${n.kitName}`}
      backTo={backTo}
      full
      testID="notice-screen"
    >
      <View style={{ width: '100%', maxWidth: 1200, alignSelf: 'center', gap: space.xl }}>
        {supplier ? (
          // The table needs the width: the notice above it.
          <>
            {notice}
            {answers}
          </>
        ) : (
          <TwoPane left={notice} right={answers} />
        )}
      </View>
      {photoViewer.viewer}
    </Screen>
  );
}

/** One of the reader's builds: its answer so far, the parts it reaches, and what they may do now. */
function BuildAnswer({
  noticeId,
  a,
  onOpenPhoto,
}: {
  noticeId: string;
  a: NoticeBuildAnswer;
  onOpenPhoto: (photos: NoticeFile[], i: number) => void;
}) {
  const router = useRouter();
  return (
    <View
      style={{ gap: space.sm, paddingBottom: space.md, borderBottomWidth: hairline, borderColor: colors.rule }}
      testID={`notice-answer-${a.kitSerial}`}
    >
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
        <Txt bold>
          Build <Mono bold>{a.kitSerial}</Mono>
        </Txt>
        <ComplianceStatusTag status={a.status} />
      </View>
      {a.acknowledgedAt || a.answeredAt ? <KeyValue label="Who, when">{whoWhen(a)}</KeyValue> : null}
      {a.acknowledgedAt && a.answeredAt ? (
        <KeyValue label="Read">{`${a.acknowledgedByName ?? 'Someone'}, ${shortDate(a.acknowledgedAt)}`}</KeyValue>
      ) : null}
      {a.note ? <KeyValue label="What was done">{a.note}</KeyValue> : null}
      {a.reason ? <KeyValue label="Why not">{a.reason}</KeyValue> : null}
      {a.photos.length ? (
        <KeyValue label="Photos">
          <AnswerPhotos photos={a.photos} prefix={`notice-answer-photo-${a.kitSerial}`} onOpen={onOpenPhoto} />
        </KeyValue>
      ) : null}
      {a.parts.length ? (
        <View style={{ gap: space.xs }}>
          <Txt variant="small" tone="soft">
            Parts of this build it reaches:
          </Txt>
          <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
            {a.parts.map((p) => (
              <Button
                key={p.travelerId}
                label={`${p.partNumber} rev ${p.letter} · ${p.serial}`}
                variant="quiet"
                compact
                onPress={() => router.push(`/travelers/${p.travelerId}`)}
                testID={`notice-part-${p.travelerId}`}
              />
            ))}
          </View>
        </View>
      ) : (
        <Txt variant="small" tone="soft">
          It is about the kit as a whole, no one part.
        </Txt>
      )}
      <ComplianceActions noticeId={noticeId} answer={a} />
    </View>
  );
}
