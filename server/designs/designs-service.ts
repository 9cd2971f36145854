import {
  allowedRevisionActions,
  revisionActionRefusal,
  type FindingCluster,
  type PartDesignDetail,
  type Page,
  type PageQuery,
  type PartDesignInput,
  type PartDesignSummary,
  type Revision,
  type RevisionInput,
  type RevisionStep,
} from '../../db/contracts';
import { withTransaction, type Db } from '../../db';
import { badRequest, conflict, notFound } from '../http-error';
import { checkLayout } from './layout-check';
import { kitsService } from '../kits/kits-service';
import {
  deleteDraftRevision,
  findDesign,
  findRevision,
  insertDesignWithFirstRevision,
  insertRevision,
  listDesignFindingHoles,
  listRevisions,
  lockRevisionLetters,
  lockRevisionStatus,
  pageDesigns,
  partNumberTaken,
  publishRevision,
  updateDraftRevision,
} from './designs-repository';
import { nextRevisionLetter } from './revision-letters';

type RevisionBody = Required<Omit<RevisionInput, 'steps' | 'changeNote'>> & {
  steps: RevisionStep[];
  changeNote: string;
};
/** The load study a revision's numbers came from, frozen with it at publish. */
type EngineeringBasis = { basis: Record<string, unknown>; studyId: string };

export const designsService = (db: Db) => {
  const kits = kitsService(db);

  async function ownDesign(user: Express.User, id: string) {
    const design = await findDesign(db, id);
    if (!design || (user.role !== 'admin' && design.organizationId !== user.organizationId))
      throw notFound('part design');
    return design;
  }

  async function detail(user: Express.User, id: string): Promise<PartDesignDetail> {
    const { organizationId: _, ...design } = await ownDesign(user, id);
    const revisions = await listRevisions(db, id);
    const published = revisions.find((r) => r.status === 'published');
    return { ...design, publishedLetter: published?.letter ?? null, revisions: revisions.map(serialiseRevision) };
  }

  async function ownRevision(user: Express.User, id: string) {
    const revision = await findRevision(db, id);
    if (!revision) throw notFound('revision');
    await ownDesign(user, revision.partDesignId);
    return revision;
  }

  const frozen = (letter: string, status: 'published' | 'superseded') =>
    conflict(revisionActionRefusal({ letter, status })!);

  return {
    async list(user: Express.User, q: PageQuery & { kitModelId?: string }): Promise<Page<PartDesignSummary>> {
      if (!user.organizationId) return { items: [], next: null };
      return pageDesigns(db, user.organizationId, q);
    },

    detail,

    /**
     * Where findings cluster on this part across every build shipped with it: holes flagged most often
     * first, so the supplier sees what a revised part should change.
     */
    async findingClusters(user: Express.User, id: string): Promise<FindingCluster[]> {
      await ownDesign(user, id);
      const rows = await listDesignFindingHoles(db, id);
      const byHole = new Map<string, FindingCluster & { buildIds: Set<string> }>();
      for (const r of rows) {
        for (const holeId of r.holeIds) {
          const key = `${r.letter} ${holeId}`;
          const c = byHole.get(key) ?? {
            letter: r.letter,
            holeId,
            count: 0,
            builds: 0,
            open: 0,
            kinds: {},
            lastAt: r.createdAt.toISOString(),
            buildIds: new Set<string>(),
          };
          c.count += 1;
          c.buildIds.add(r.buildId);
          if (r.status !== 'closed') c.open += 1;
          c.kinds[r.kind] = (c.kinds[r.kind] ?? 0) + 1;
          if (r.createdAt.toISOString() > c.lastAt) c.lastAt = r.createdAt.toISOString();
          byHole.set(key, c);
        }
      }
      return [...byHole.values()]
        .map(({ buildIds, ...c }) => ({ ...c, builds: buildIds.size }))
        .sort((a, b) => b.count - a.count || b.builds - a.builds || a.holeId.localeCompare(b.holeId));
    },

    async create(user: Express.User, input: { design: Required<PartDesignInput>; revision: RevisionBody }) {
      await kits.get(user, input.design.kitModelId);
      checkLayout(input.revision, 'revision.');
      const id = await withTransaction(db, async (tx) => {
        if (await partNumberTaken(tx.db, input.design.kitModelId, input.design.partNumber))
          throw conflict(`part number ${input.design.partNumber} already exists in this kit`, {
            'design.partNumber': 'already used in this kit',
          });
        return insertDesignWithFirstRevision(tx.db, input.design, {
          ...input.revision,
          letter: 'A',
          createdBy: user.id,
        });
      });
      return detail(user, id);
    },

    async newRevision(user: Express.User, designId: string, body: RevisionBody, engineering?: EngineeringBasis) {
      await ownDesign(user, designId);
      checkLayout(body);
      if (body.changeNote.length < 3)
        throw badRequest('a new revision needs a change note', { changeNote: 'say what changed and why' });
      const id = await withTransaction(db, async (tx) => {
        const existing = await lockRevisionLetters(tx.db, designId);
        const draft = existing.find((r) => r.status === 'draft');
        if (draft) throw conflict(`revision ${draft.letter} is still a draft: edit or publish it first`);
        return insertRevision(tx.db, {
          ...body,
          ...engineering,
          partDesignId: designId,
          letter: nextRevisionLetter(existing.map((r) => r.letter)),
          createdBy: user.id,
        });
      });
      return serialiseRevision((await findRevision(db, id))!);
    },

    async updateRevision(user: Express.User, revisionId: string, body: RevisionBody, engineering?: EngineeringBasis) {
      const revision = await ownRevision(user, revisionId);
      if (revision.status !== 'draft') throw frozen(revision.letter, revision.status);
      checkLayout(body);
      // The status guard in the WHERE makes a publish that slips in between win: the edit then changes nothing.
      if (!(await updateDraftRevision(db, revisionId, { ...body, ...engineering })))
        throw frozen(revision.letter, 'published');
      return serialiseRevision((await findRevision(db, revisionId))!);
    },

    /**
     * Discards a draft: the revision goes, the part and its published revisions stay (a part whose only
     * revision was the draft is left with none, ready for a new one). A published revision is refused.
     */
    async discard(user: Express.User, revisionId: string) {
      const revision = await ownRevision(user, revisionId);
      if (revision.status !== 'draft') throw frozen(revision.letter, revision.status);
      // The status guard in the WHERE: a publish that slips in first wins, and nothing is deleted.
      if (!(await deleteDraftRevision(db, revisionId))) throw frozen(revision.letter, 'published');
      return detail(user, revision.partDesignId);
    },

    async publish(user: Express.User, revisionId: string) {
      const revision = await ownRevision(user, revisionId);
      if (revision.status !== 'draft') throw frozen(revision.letter, revision.status);
      await withTransaction(db, async (tx) => {
        // Checked again on the locked row: a discard or another publish that came first wins.
        const status = await lockRevisionStatus(tx.db, revisionId);
        if (!status) throw notFound('revision');
        if (status !== 'draft') throw frozen(revision.letter, status);
        await publishRevision(tx.db, revisionId, revision.partDesignId, user.id);
      });
      return serialiseRevision((await findRevision(db, revisionId))!);
    },
  };
};

type RevisionRow = NonNullable<Awaited<ReturnType<typeof findRevision>>>;
function serialiseRevision(r: RevisionRow): Revision {
  return {
    ...r,
    createdAt: r.createdAt.toISOString(),
    publishedAt: r.publishedAt?.toISOString() ?? null,
    allowedActions: allowedRevisionActions(r),
  };
}
