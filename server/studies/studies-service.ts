import { eq, sql } from 'drizzle-orm';
import type { ApplyStudyInput, RibStudyInputValues, StudyDetail, StudySummary } from '../../db/contracts';
import { revisionInput } from '../../db/contracts';
import type { Db } from '../../db';
import { loadStudies, loadStudyRevisions } from '../../db/schema';
import { organizationOf } from '../auth/organization';
import { couponsForEngine } from '../coupons/coupons-repository';
import { designsService } from '../designs/designs-service';
import { EngineeringInputError, fieldAt, type RibStudyResult } from '../engineering';
import { conflict, notFound } from '../http-error';
import { kitsService } from '../kits/kits-service';
import { findStudy, findStudyRevision, listStudyRevisions, listStudyRows } from './studies-repository';
import { runStudy } from './study-pool';

/** Ends the study threads: the server calls it on shutdown, after it stops taking requests. */
export { closeStudyPool } from './study-pool';

type Result = RibStudyResult & Record<string, unknown>;

export const studiesService = (db: Db) => {
  const kits = kitsService(db);
  const designs = designsService(db);

  /**
   * Runs the engine on a study thread with the supplier's own coupon tests of that material as the
   * pull-through basis. The engine names fields from its own input; the request has them under
   * "inputs", so its refusals are told with the whole path (inputs.lines.1.name).
   */
  async function compute(user: Express.User, inputs: RibStudyInputValues): Promise<Result> {
    const tests = await couponsForEngine(db, organizationOf(user), inputs.material);
    try {
      return (await runStudy({ ...inputs, coupons: tests })) as Result;
    } catch (err) {
      if (err instanceof EngineeringInputError) throw new EngineeringInputError(fieldAt('inputs', err.field), err.reason);
      throw err;
    }
  }

  async function own(user: Express.User, id: string) {
    const study = await findStudy(db, id);
    if (!study || study.organizationId !== user.organizationId) throw notFound('load study');
    return study;
  }

  async function detail(user: Express.User, id: string, revision?: number): Promise<StudyDetail> {
    const study = await own(user, id);
    const rev = await findStudyRevision(db, id, revision ?? study.latestRevision);
    if (!rev) throw notFound(`revision ${revision} of this study`);
    const kit = await kits.get(user, study.kitModelId);
    const result = rev.result as Result;
    return {
      id, kitModelId: study.kitModelId, kitName: kit.name, name: study.name, revision: rev.revision,
      updatedAt: study.updatedAt.toISOString(), recommended: result.recommended ?? null,
      inputs: rev.inputs as RibStudyInputValues, result,
      revisions: (await listStudyRevisions(db, id)).map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })),
    };
  }

  return {
    detail,

    async list(user: Express.User): Promise<StudySummary[]> {
      if (!user.organizationId) return [];
      return (await listStudyRows(db, user.organizationId)).map(({ result, updatedAt, ...s }) => ({
        ...s, updatedAt: updatedAt.toISOString(), recommended: (result as Result).recommended ?? null,
      }));
    },

    async create(user: Express.User, body: { kitModelId: string; name: string; inputs: RibStudyInputValues }) {
      await kits.get(user, body.kitModelId);
      const result = await compute(user, body.inputs);
      const id = await db.transaction(async (tx) => {
        const [study] = await tx.insert(loadStudies).values({ organizationId: user.organizationId!, kitModelId: body.kitModelId, name: body.name, createdBy: user.id }).returning();
        await tx.insert(loadStudyRevisions).values({ studyId: study.id, revision: 1, inputs: body.inputs, result, createdBy: user.id });
        return study.id;
      });
      return detail(user, id);
    },

    /** A change of inputs is a new numbered revision; the earlier ones stay as they were computed. */
    async update(user: Express.User, id: string, body: { kitModelId: string; name: string; inputs: RibStudyInputValues }) {
      await own(user, id);
      await kits.get(user, body.kitModelId);
      const result = await compute(user, body.inputs);
      await db.transaction(async (tx) => {
        const [study] = await tx.update(loadStudies)
          .set({ latestRevision: sql`${loadStudies.latestRevision} + 1`, name: body.name, kitModelId: body.kitModelId, updatedAt: new Date() })
          .where(eq(loadStudies.id, id)).returning();
        await tx.insert(loadStudyRevisions).values({ studyId: id, revision: study.latestRevision, inputs: body.inputs, result, createdBy: user.id });
      });
      return detail(user, id);
    },

    /**
     * Writes the chosen gauge, rivet and zones into the part design's draft revision (a new one when it
     * has none), with the study revision as its engineering basis.
     */
    async apply(user: Express.User, id: string, body: ApplyStudyInput) {
      const study = await detail(user, id);
      const result = study.result as Result;
      const candidate = result.candidates.find((c) => Math.abs(c.gaugeIn - body.gaugeIn) < 1e-6 && c.rivet === body.rivet);
      if (!candidate) throw notFound(`candidate ${body.gaugeIn} in with ${body.rivet} in this study`);
      if (!candidate.feasible) throw conflict(`${body.gaugeIn} in with ${body.rivet} does not carry the load: ${candidate.reasons.join('; ')}`);
      const design = await designs.detail(user, body.partDesignId);
      if (design.kitModelId !== study.kitModelId) throw conflict('the part design belongs to another kit than the study');
      const base = design.revisions[0];
      const first = candidate.lines[0];
      const lines = candidate.lines.map((schedule, i) => {
        const loads = result.lines[i];
        const zero = schedule.zones[0].fromAlongIn;
        return {
          code: loads.holePrefix, name: loads.name, surface: loads.surface,
          startIn: Math.round(loads.fromStationIn * 1000) / 1000,
          lengthIn: Math.round(schedule.lengthIn * 1000) / 1000,
          zones: schedule.zones.map((z, k, all) => ({
            fromIn: k === 0 ? 0 : Math.round((z.fromAlongIn - zero) * 1000) / 1000,
            toIn: k === all.length - 1 ? Math.round(schedule.lengthIn * 1000) / 1000 : Math.round((z.toAlongIn - zero) * 1000) / 1000,
            pitchIn: z.pitchIn,
          })),
        };
      });
      const revisionBody = revisionInput.parse({
        material: study.inputs.material, gaugeIn: candidate.gaugeIn, rivetSpec: candidate.rivet,
        drillSize: first.drill.name, drillDiameterIn: first.drill.diameterIn,
        edgeDistanceIn: Math.ceil(first.layout.edgeDistanceIn * 1000) / 1000, chordIn: study.inputs.rib.chordIn,
        lines, steps: base?.steps ?? [],
        changeNote: `Gauge, rivet and pitch schedule from load study "${study.name}" revision ${study.revision}`,
      });
      const basis = {
        studyId: study.id, studyName: study.name, studyRevision: study.revision, computedAt: study.updatedAt,
        inputs: study.inputs, design: result.design, conditions: result.conditions.map(({ cp: _cp, ...c }) => c),
        candidate, rules: result.rules, warnings: [...result.warnings, ...candidate.warnings], caution: result.caution,
      };
      const draft = design.revisions.find((r) => r.status === 'draft');
      const engineering = { basis, studyId: study.id };
      return draft
        ? designs.updateRevision(user, draft.id, revisionBody, engineering)
        : designs.newRevision(user, design.id, revisionBody, engineering);
    },
  };
};
