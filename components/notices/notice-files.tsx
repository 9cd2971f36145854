import { Image, Linking, Platform, Pressable, StyleSheet, View } from 'react-native';
import { MAX_NOTICE_FILES, MAX_NOTICE_PDF_BYTES, type NoticeFile } from '@/db/contracts';
import { space, touch } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { DraftTiles, tileStyles } from '@/components/ui/draft-tiles';
import { Mono, Txt } from '@/components/ui/text';
import type { DraftFile } from '@/hooks/queries/notices';
import { pickWebFile } from '@/lib/pick-file';

const PDF_TYPE = 'application/pdf';
export const isPdf = (f: Pick<DraftFile, 'type'>) => f.type === PDF_TYPE;

/** A PDF starts with "%PDF-" (ISO 32000-1 §7.5.2, the file header), whatever its name says. */
export function isPdfBytes(b: Uint8Array): boolean {
  return String.fromCharCode(...b.subarray(0, 5)) === '%PDF-';
}

const megabytes = (n: number) => `${Math.round(n / (1024 * 1024))} MB`;

/**
 * A PDF chosen from the computer (web only: the phone app attaches photos). A hidden file input in the
 * page, so the browser's own chooser opens; the file is refused here when it is not a PDF or too large.
 */
export async function pickPdf(): Promise<{ file: DraftFile | null; error: string | null }> {
  const { file: f, error } = await pickWebFile({
    accept: `${PDF_TYPE},.pdf`,
    maxBytes: MAX_NOTICE_PDF_BYTES,
    unavailable: 'A PDF is attached from the web app: open Pitchcard in a browser.',
  });
  if (!f) return { file: null, error };
  const head = new Uint8Array(await f.slice(0, 5).arrayBuffer());
  if (!isPdfBytes(head)) return { file: null, error: `"${f.name}" is not a PDF.` };
  return { file: { uri: URL.createObjectURL(f), name: f.name, type: PDF_TYPE }, error: null };
}

/** The files being attached to a new notice: photo thumbnails and PDF names, each with Remove; the add buttons. */
export function NoticeFilesPicker({
  files,
  onAddPhoto,
  onAddPdf,
  onRemove,
  error,
}: {
  files: DraftFile[];
  onAddPhoto: () => void;
  onAddPdf: () => void;
  onRemove: (i: number) => void;
  error: string | null;
}) {
  const full = files.length >= MAX_NOTICE_FILES;
  return (
    <View style={{ gap: space.sm }} testID="notice-files">
      <DraftTiles
        items={files}
        thumb={(f) =>
          isPdf(f) ? (
            <View style={[tileStyles.thumb, styles.pdf]}>
              <Mono bold>PDF</Mono>
              <Txt variant="small" numberOfLines={3} align="center">
                {f.name}
              </Txt>
            </View>
          ) : (
            <Image source={{ uri: f.uri }} style={tileStyles.thumb} accessibilityLabel={`Photo ${f.name}`} />
          )
        }
        removeLabel={(f) => `Remove ${f.name}`}
        onRemove={onRemove}
        tileTestID={(i) => `notice-file-${i}`}
        removeTestID={(i) => `notice-remove-file-${i}`}
        empty="No file attached. A photo of the change, or the revised drawing as a PDF, helps builders most."
      />
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label="Add a photo"
          variant="secondary"
          onPress={onAddPhoto}
          disabled={full}
          testID="notice-attach-photo"
        />
        {Platform.OS === 'web' ? (
          <Button
            label="Attach a PDF"
            variant="secondary"
            onPress={onAddPdf}
            disabled={full}
            testID="notice-attach-pdf"
          />
        ) : null}
      </View>
      <Txt variant="small" tone="faint">
        {files.length}/{MAX_NOTICE_FILES} files: JPEG, PNG or HEIC photos, or PDFs up to{' '}
        {megabytes(MAX_NOTICE_PDF_BYTES)}.
      </Txt>
      {error ? (
        <Txt variant="small" tone="error" accessibilityRole="alert" testID="notice-files-error">
          {error}
        </Txt>
      ) : null}
    </View>
  );
}

/** A notice's stored files: photo thumbnails that open large, PDFs as links to open. */
export function NoticeFilesView({
  files,
  onOpenPhoto,
  prefix = 'notice-file',
}: {
  files: NoticeFile[];
  onOpenPhoto: (photos: NoticeFile[], i: number) => void;
  prefix?: string;
}) {
  const photos = files.filter((f) => f.kind === 'photo');
  const pdfs = files.filter((f) => f.kind === 'pdf');
  return (
    <View style={{ gap: space.sm }}>
      {photos.length ? (
        <View style={tileStyles.grid}>
          {photos.map((p, i) => (
            <Pressable
              key={p.id}
              onPress={() => onOpenPhoto(photos, i)}
              testID={`${prefix}-photo-${i}`}
              accessibilityRole="button"
              accessibilityLabel={`Photo ${i + 1}, ${p.name}, open large`}
            >
              <Image source={{ uri: p.thumbUrl ?? p.url }} style={tileStyles.thumb} />
            </Pressable>
          ))}
        </View>
      ) : null}
      {pdfs.map((p, i) => (
        <Txt
          key={p.id}
          accessibilityRole="link"
          onPress={() => void Linking.openURL(p.url)}
          tone="accent"
          bold
          style={styles.link}
          testID={`${prefix}-pdf-${i}`}
        >
          {`${p.name} (PDF, opens in a new tab)`}
        </Txt>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  pdf: { alignItems: 'center', justifyContent: 'center', padding: space.xs, gap: space.xs },
  link: { minHeight: touch, textDecorationLine: 'underline', paddingVertical: space.sm },
});
