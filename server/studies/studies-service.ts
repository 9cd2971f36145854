import type {
  ApplyStudyInput,
  FastenerLine,
  Page,
  PageQuery,
  PartDesignDetail,
  RibStudyInputValues,
  StudyBody,
  StudyDetail,
  StudyKind,
  StudySummary,
  WingStudyInputValues,
} from '../../db/contracts';
import { revisionInput } from '../../db/contracts';
import { withTransaction, type Db } from '../../db';
import { organizationOf } from '../auth/organization';
import { couponsForEngine } from '../coupons/coupons-repository';
import { designsService } from '../designs/designs-service';
import {
  EngineeringInputError,
  fieldAt,
  findRivetByCallout,
  layoutRules,
  type RibStudyInput,
  type RibStudyResult,
  type SkinPanelResult,
  type StudyCandidate,
  type WingRib,
  type WingStudyResult,
} from '../engineering';
import { badRequest, conflict, notFound } from '../http-error';
import { kitsService } from '../kits/kits-service';
import {
  addStudyRevision,
  findStudy,
  findStudyEngineInput,
  insertStudy,
  findStudyRevision,
  listStudyRevisions,
  pageStudyRows,
} from './studies-repository';
import { keepLineCodes } from './line-codes';
import { runStudy } from './study-pool';

/** Ends the study threads: the server calls it on shutdown, after it stops taking requests. */
export { closeStudyPool } from './study-pool';

type RibResult = RibStudyResult & Record<string, unknown>;
type WingResult = WingStudyResult & Record<string, unknown>;
type Choice = { gaugeIn: number; rivet: string };
/** A pitch schedule as stored: its zones along the line (from its first hole's side), and its length. */
type Schedule = {
  lengthIn: number;
  drill: { name: string; diameterIn: number };
  layout: { edgeDistanceIn: number };
  zones: { fromAlongIn: number; toAlongIn: number; pitchIn: number }[];
};

/** A skin panel's four lines in the order skin-panel.ts schedules them, with the hole prefixes it gives them. */
const SKIN_LINES = [
  { code: 'FS', name: () => 'Front spar' },
  { code: 'RS', name: () => 'Rear spar' },
  { code: 'IR', name: (p: SkinPanelResult) => `Rib ${p.innerRib} (inboard)` },
  { code: 'OR', name: (p: SkinPanelResult) => `Rib ${p.outerRib} (outboard)` },
] as const;

const thou = (x: number) => Math.round(x * 1000) / 1000;
const sameChoice = (c: Choice, pick: Choice) => Math.abs(c.gaugeIn - pick.gaugeIn) < 1e-6 && c.rivet === pick.rivet;
const choiceText = (c: Choice | null) => (c ? `${c.gaugeIn} in with ${c.rivet}` : 'none');

/** A schedule's zones as a revision holds them: inches from the line's start, the last ending at its length. */
function revisionZones(schedule: Schedule) {
  const zero = schedule.zones[0].fromAlongIn;
  return schedule.zones.map((z, k, all) => ({
    fromIn: k === 0 ? 0 : thou(z.fromAlongIn - zero),
    toIn: k === all.length - 1 ? thou(schedule.lengthIn) : thou(z.toAlongIn - zero),
    pitchIn: z.pitchIn,
  }));
}

/** A rib's lines: each where the study's line starts on the rib, with the candidate's zones along it. */
function ribRevisionLines(schedules: Schedule[], loads: RibStudyResult['lines']) {
  return schedules.map((schedule, i) => ({
    code: loads[i].holePrefix,
    name: loads[i].name,
    surface: loads[i].surface,
    startIn: thou(loads[i].fromStationIn),
    lengthIn: thou(schedule.lengthIn),
    zones: revisionZones(schedule),
  }));
}

/**
 * The sheet, rivet, drill and edge distance a candidate's schedules share. A stored edge distance is
 * rounded (a wing's skins to 0.001 in: 2.5 × 3/32 = 0.234375 is kept as 0.234), so it is held to the
 * rivet's own layout rule, which the part design checks again, and rounded up.
 */
function sheetOf(material: string, candidate: Choice, schedules: Schedule[]) {
  const first = schedules[0];
  let ruleIn = 0;
  try {
    ruleIn = layoutRules(findRivetByCallout(candidate.rivet)).minEdgeIn;
  } catch (err) {
    if (!(err instanceof EngineeringInputError)) throw err; // a rivet of the supplier's own data: its stored figure stands
  }
  return {
    material,
    gaugeIn: candidate.gaugeIn,
    rivetSpec: candidate.rivet,
    drillSize: first.drill.name,
    drillDiameterIn: first.drill.diameterIn,
    edgeDistanceIn: Math.ceil(Math.max(ruleIn, ...schedules.map((s) => s.layout.edgeDistanceIn)) * 1000) / 1000,
  };
}

export const studiesService = (db: Db) => {
  const kits = kitsService(db);
  const designs = designsService(db);

  /**
   * Runs the engine on a study thread with the supplier's own coupon tests of that material as the
   * pull-through basis (for a wing: of its ribs' flanges and its skins alike). The engine names fields
   * from its own input; the request has them under "inputs", so its refusals are told with the whole
   * path (inputs.lines.1.name, inputs.ribs.9.stationIn).
   */
  async function compute(user: Express.User, body: StudyBody): Promise<RibResult | WingResult> {
    const coupons = await couponsForEngine(db, organizationOf(user), body.inputs.material);
    try {
      return body.kind === 'wing'
        ? ((await runStudy({ kind: 'wing', input: { ...body.inputs, coupons } })) as WingResult)
        : ((await runStudy({ kind: 'rib', input: { ...body.inputs, coupons } })) as RibResult);
    } catch (err) {
      if (err instanceof EngineeringInputError)
        throw new EngineeringInputError(fieldAt('inputs', err.field), err.reason);
      throw err;
    }
  }

  async function own(user: Express.User, id: string) {
    const study = await findStudy(db, id);
    if (!study || study.organizationId !== user.organizationId) throw notFound('load study');
    return study;
  }

  /** The headline choice: a rib study's recommended candidate, a wing study's one gauge and rivet for every rib. */
  const recommendedOf = (kind: StudyKind, result: Record<string, any>): Choice | null =>
    (kind === 'wing' ? result.trade?.recommendedUniform : result.recommended) ?? null;

  async function detail(user: Express.User, id: string, revision?: number): Promise<StudyDetail> {
    const study = await own(user, id);
    const rev = await findStudyRevision(db, id, revision ?? study.latestRevision);
    if (!rev) throw notFound(`revision ${revision} of this study`);
    const kit = await kits.get(user, study.kitModelId);
    const result = rev.result as Record<string, any>;
    return {
      id,
      kind: study.kind,
      kitModelId: study.kitModelId,
      kitName: kit.name,
      name: study.name,
      revision: rev.revision,
      updatedAt: study.updatedAt.toISOString(),
      recommended: recommendedOf(study.kind, result),
      inputs: rev.inputs as RibStudyInputValues | WingStudyInputValues,
      result,
      revisions: (await listStudyRevisions(db, id)).map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })),
    };
  }

  /** The part design the study is applied to: of the study's kit, and of a kind that has these lines. */
  async function targetDesign(
    user: Express.User,
    study: StudyDetail,
    partDesignId: string,
    kinds: readonly string[],
    what: string,
  ) {
    const design = await designs.detail(user, partDesignId);
    if (design.kitModelId !== study.kitModelId) throw conflict('the part design belongs to another kit than the study');
    if (!kinds.includes(design.kind))
      throw conflict(`${what} goes to a part design of kind ${kinds.join(' or ')}, not ${design.kind}`, {
        partDesignId: `choose a ${kinds.join(' or ')} part design`,
      });
    return design;
  }

  /** Into the design's draft revision (a new one when it has none), with the study revision as its engineering basis. */
  function writeRevision(
    user: Express.User,
    design: PartDesignDetail,
    body: Record<string, unknown>,
    basis: Record<string, unknown>,
    studyId: string,
  ) {
    const latest = design.revisions[0];
    const lines = body.lines as FastenerLine[];
    const revisionBody = revisionInput.parse({
      ...body,
      lines: latest ? keepLineCodes(latest.lines, lines) : lines,
      steps: latest?.steps ?? [],
    });
    const draft = design.revisions.find((r) => r.status === 'draft');
    const engineering = { basis, studyId };
    return draft
      ? designs.updateRevision(user, draft.id, revisionBody, engineering)
      : designs.newRevision(user, design.id, revisionBody, engineering);
  }

  const refuseUnfeasible = (c: { feasible: boolean; reasons: string[] } & Choice, where = '') => {
    if (!c.feasible)
      throw conflict(`${c.gaugeIn} in with ${c.rivet}${where} does not carry the load: ${c.reasons.join('; ')}`);
  };

  /** A rib study's apply, as it was before wing studies: to any part design of the kit; a target is not read. */
  async function applyRib(user: Express.User, study: StudyDetail, body: ApplyStudyInput) {
    const result = study.result as RibResult;
    const candidate = result.candidates.find((c) => sameChoice(c, body));
    if (!candidate) throw notFound(`candidate ${body.gaugeIn} in with ${body.rivet} in this study`);
    refuseUnfeasible(candidate);
    const inputs = study.inputs as RibStudyInputValues;
    const design = await designs.detail(user, body.partDesignId);
    if (design.kitModelId !== study.kitModelId) throw conflict('the part design belongs to another kit than the study');
    const basis = {
      studyId: study.id,
      studyName: study.name,
      studyRevision: study.revision,
      computedAt: study.updatedAt,
      inputs,
      design: result.design,
      conditions: result.conditions.map(({ cp: _cp, ...c }) => c),
      candidate,
      rules: result.rules,
      warnings: [...result.warnings, ...candidate.warnings],
      caution: result.caution,
    };
    return writeRevision(
      user,
      design,
      {
        ...sheetOf(inputs.material, candidate, candidate.lines),
        chordIn: inputs.rib.chordIn,
        lines: ribRevisionLines(candidate.lines, result.lines),
        changeNote: `Gauge, rivet and pitch schedule from load study "${study.name}" revision ${study.revision}`,
      },
      basis,
      study.id,
    );
  }

  /** What a wing's applied revision cites: the study revision, the wing's loads and rules, and the rib or panel. */
  const wingBasis = (
    study: StudyDetail,
    result: WingResult,
    target: Record<string, unknown>,
    candidate: unknown,
    warnings: string[],
  ) => ({
    kind: 'wing',
    studyId: study.id,
    studyName: study.name,
    studyRevision: study.revision,
    computedAt: study.updatedAt,
    target,
    inputs: study.inputs,
    design: result.design,
    planform: result.planform,
    tail: result.tail,
    conditions: result.conditions,
    candidate,
    rules: result.rules,
    warnings,
    caution: result.caution,
  });

  async function applyWingRib(user: Express.User, study: StudyDetail, body: ApplyStudyInput, name: string) {
    const result = study.result as WingResult;
    const rib: WingRib | undefined = result.ribs.find((r) => r.name === name);
    if (!rib) throw notFound(`rib ${name} in this study`);
    const candidate = rib.study.candidates.find((c) => sameChoice(c, body));
    if (!candidate) throw notFound(`candidate ${body.gaugeIn} in with ${body.rivet} for rib ${name} in this study`);
    refuseUnfeasible(candidate, ` on rib ${name}`);
    // The wing keeps the zones of each rib's recommended candidate and of its one-for-all choice only.
    if (!candidate.lines.length) {
      throw conflict(
        `the study keeps the zones of rib ${name}'s recommended candidate (${choiceText(rib.study.recommended)}) and of the wing's one-for-all choice (${choiceText(result.trade.recommendedUniform)}) only: choose one of those`,
      );
    }
    const design = await targetDesign(user, study, body.partDesignId, ['rib', 'nose_rib'], `rib ${name}`);
    const inputs = study.inputs as WingStudyInputValues;
    const { study: ribStudy, ...place } = rib;
    const basis = wingBasis(study, result, { kind: 'rib', ...place }, candidate, [
      ...result.warnings,
      ...candidate.warnings,
    ]);
    void ribStudy;
    return writeRevision(
      user,
      design,
      {
        ...sheetOf(inputs.material, candidate, candidate.lines),
        chordIn: rib.chordIn,
        lines: ribRevisionLines(candidate.lines, rib.study.lines),
        changeNote: `Gauge, rivet and pitch schedule of rib ${name} from wing study "${study.name}" revision ${study.revision}`,
      },
      basis,
      study.id,
    );
  }

  async function applyWingSkin(user: Express.User, study: StudyDetail, body: ApplyStudyInput, name: string) {
    const result = study.result as WingResult;
    const panel = result.skins.find((s) => s.name === name);
    if (!panel) throw notFound(`skin panel ${name} in this study`);
    const candidate = panel.candidates.find((c) => sameChoice(c, body));
    if (!candidate)
      throw notFound(`candidate ${body.gaugeIn} in with ${body.rivet} for skin panel ${name} in this study`);
    refuseUnfeasible(candidate, ` on skin panel ${name}`);
    if (candidate.lines.length !== SKIN_LINES.length) {
      throw conflict(
        `the study keeps the zones of skin panel ${name}'s recommended candidate (${choiceText(panel.recommended)}) only: choose that one`,
      );
    }
    const design = await targetDesign(user, study, body.partDesignId, ['skin_panel'], `skin panel ${name}`);
    const inputs = study.inputs as WingStudyInputValues;
    const lines = candidate.lines.map((schedule, i) => ({
      // A panel's lines are 'flat' (a panel's convention): drawn as rows of their own, not along an airfoil.
      code: SKIN_LINES[i].code,
      name: SKIN_LINES[i].name(panel),
      surface: 'flat' as const,
      startIn: 0,
      lengthIn: thou(schedule.lengthIn),
      zones: revisionZones(schedule),
    }));
    // A revision's lines all run one way from startIn; a panel's spar lines run spanwise (its width) and
    // its rib lines chordwise between the spars. chordIn is the panel's longest side so that the drawing
    // holds every line; its true sides are in the basis. (See server/studies/README.md.)
    const chordIn =
      Math.ceil(Math.max(panel.outerStationIn - panel.innerStationIn, ...lines.map((l) => l.lengthIn)) * 1000) / 1000;
    const { candidates: _all, ...place } = panel;
    void _all;
    const basis = wingBasis(study, result, { kind: 'skin', ...place }, candidate, [
      ...result.warnings,
      ...candidate.warnings,
    ]);
    return writeRevision(
      user,
      design,
      {
        ...sheetOf(inputs.material, candidate, candidate.lines),
        chordIn,
        lines,
        changeNote: `Skin gauge, rivet and pitch schedules of panel ${name} from wing study "${study.name}" revision ${study.revision}`,
      },
      basis,
      study.id,
    );
  }

  return {
    detail,

    async list(user: Express.User, q: PageQuery): Promise<Page<StudySummary>> {
      if (!user.organizationId) return { items: [], next: null };
      const page = await pageStudyRows(db, user.organizationId, q);
      return {
        items: page.items.map(({ updatedAt, recommended, ...s }) => ({
          ...s,
          updatedAt: new Date(updatedAt).toISOString(),
          recommended: recommended ?? null,
        })),
        next: page.next,
      };
    },

    async create(user: Express.User, body: StudyBody) {
      await kits.get(user, body.kitModelId);
      const result = await compute(user, body);
      const id = await withTransaction(db, (tx) =>
        insertStudy(
          tx.db,
          {
            organizationId: user.organizationId!,
            kind: body.kind,
            kitModelId: body.kitModelId,
            name: body.name,
            createdBy: user.id,
          },
          { inputs: body.inputs, result },
        ),
      );
      return detail(user, id);
    },

    /**
     * A change of inputs is a new numbered revision; the earlier ones stay as they were computed. A
     * study keeps its kind: its revisions compare with each other.
     */
    async update(user: Express.User, id: string, body: StudyBody) {
      const study = await own(user, id);
      if (study.kind !== body.kind)
        throw conflict(
          `this is a ${study.kind} study: its revisions stay ${study.kind} studies (start a new study for a ${body.kind})`,
          { kind: `this study is of a ${study.kind}` },
        );
      await kits.get(user, body.kitModelId);
      const result = await compute(user, body);
      await withTransaction(db, (tx) =>
        addStudyRevision(
          tx.db,
          id,
          { name: body.name, kitModelId: body.kitModelId },
          { inputs: body.inputs, result, createdBy: user.id },
        ),
      );
      return detail(user, id);
    },

    /**
     * One candidate of a rib study with its holes (the stored result keeps the recommended candidate's
     * only), recomputed on a study thread from the engine input of that revision, the coupons it used
     * included, so it matches what was stored. A wing study keeps zones, not holes.
     */
    async candidate(user: Express.User, id: string, pick: Choice, revision?: number): Promise<StudyCandidate> {
      const study = await own(user, id);
      if (study.kind === 'wing') throw conflict('a wing study stores zones; apply it to see its holes');
      const at = revision ?? study.latestRevision;
      const row = await findStudyEngineInput(db, id, at);
      if (!row?.input) throw notFound(`revision ${at} of this study`);
      try {
        return await runStudy({ kind: 'rib-candidate', input: row.input as unknown as RibStudyInput, pick });
      } catch (err) {
        // ribCandidate names the pick's gauge or rivet when the study did not have it.
        if (err instanceof EngineeringInputError && (err.field === 'gaugeIn' || err.field === 'rivet')) {
          throw notFound(`candidate ${pick.gaugeIn} in with ${pick.rivet} in this study`);
        }
        throw err;
      }
    },

    /**
     * Writes the chosen gauge, rivet and zones into the part design's draft revision (a new one when it
     * has none), with the study revision as its engineering basis. A wing study applies one of its ribs
     * (to a rib part) or one of its skin panels (to a skin panel part), named by the target.
     */
    async apply(user: Express.User, id: string, body: ApplyStudyInput) {
      const study = await detail(user, id);
      if (study.kind === 'rib') return applyRib(user, study, body);
      if (!body.target)
        throw badRequest('a wing study applies one rib or one skin panel: choose which', {
          target: 'choose a rib or a skin panel of the wing',
        });
      return body.target.kind === 'rib'
        ? applyWingRib(user, study, body, body.target.name)
        : applyWingSkin(user, study, body, body.target.name);
    },
  };
};
