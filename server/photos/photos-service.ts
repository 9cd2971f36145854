import type { AppContext } from '../context';
import { findSessionUser } from '../auth/auth-repository';
import { findPhotoRow, listFindingRows } from '../findings/findings-repository';
import { forbidden, notFound } from '../http-error';
import { listTravelers } from '../travelers/travelers-repository';
import { findWorkPhotoRow } from '../travelers/work-repository';
import { findNoticeFileRow, noticeVisibleTo } from '../notices/notices-repository';

type Deps = Pick<AppContext, 'db' | 'storage' | 'signer'>;
/** A signed photo link as the request carries it: whose it is, until when, and its signature. */
type PhotoLink = { u: string; exp: string; sig: string };

export const photosService = ({ db, storage, signer }: Deps) => ({
  /**
   * The bytes of a photo behind a signed link. The link's person must still be active and still see
   * the finding (or, for a photo of the work, the part) the photo belongs to: a link outlives neither their
   * account nor their place on the build.
   */
  async read(id: string, variant: 'full' | 'thumb', link: PhotoLink | null): Promise<Buffer> {
    if (!link || !signer.verify(id, variant, link.u, link.exp, link.sig))
      throw forbidden('this photo link has expired or is not valid');
    const viewer = await findSessionUser(db, link.u);
    if (!viewer?.active) throw forbidden('this photo link is no longer valid');
    const photo = await findPhotoRow(db, id);
    if (photo) {
      const [visible] = await listFindingRows(db, viewer, { id: photo.findingId });
      if (!visible) throw forbidden('this photo link is no longer valid');
      return storage.get(variant === 'full' ? photo.fileKey : photo.thumbKey);
    }
    // A photo of the work: the reader must still see its part.
    const work = await findWorkPhotoRow(db, id);
    if (!work) {
      // A notice's file (a photo or a PDF) or a photo of a build's answer: the reader must still see the notice and that build.
      const file = await findNoticeFileRow(db, id);
      const key = file && (variant === 'full' ? file.fileKey : file.thumbKey);
      if (!file || !key) throw notFound('photo');
      if (!(await noticeVisibleTo(db, viewer, file.noticeId, file.buildId)))
        throw forbidden('this photo link is no longer valid');
      return storage.get(key);
    }
    const [part] = await listTravelers(db, viewer, { id: work.travelerId });
    if (!part) throw forbidden('this photo link is no longer valid');
    return storage.get(variant === 'full' ? work.fileKey : work.thumbKey);
  },
});
