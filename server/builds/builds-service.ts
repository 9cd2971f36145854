import {
  allowedBuildActions,
  allowedBuildPeopleActions,
  buildWorkRefusal,
  checkBuildAction,
  memberRoleOfPlace,
  removalRefusal,
  singlePlaces,
  fabricationTable,
  type FabricationTable,
  type HoursByWho,
  type BuildAction,
  type BuildChangeInput,
  type BuildPeople,
  type BuildPeopleAction,
  type BuildSummary,
  type MemberPlace,
  type PageQuery,
} from '../../db/contracts';
import { withTransaction, type Db, type Tx } from '../../db';
import type { AppContext } from '../context';
import { invite } from '../people/invitations';
import { addBuildMember, findBuildBrief, findUserByEmail, listPendingInvitations } from '../people/people-repository';
import { badRequest, conflict, forbidden, notFound } from '../http-error';
import { kitsService } from '../kits/kits-service';
import { listPublishedParts } from '../designs/designs-repository';
import { insertTraveler, listTravelers } from '../travelers/travelers-repository';
import { readBuildHours } from '../travelers/work-repository';
import {
  buildWork,
  deleteBuild,
  findBuildRow,
  insertBuild,
  insertBuildEvent,
  kitSerialTaken,
  listFabricationSteps,
  listBuildMembers,
  listVisibleBuilds,
  lockBuild,
  pageVisibleBuilds,
  removeBuildMember,
  renameBuildSerial,
  setBuildNote,
  setMemberPlace,
} from './builds-repository';

type BuildBody = {
  kitModelId: string;
  kitSerial: string;
  builderEmail: string;
  builderName?: string;
  inspectorEmail: string;
  inspectorName?: string;
};
type Deps = Pick<AppContext, 'db' | 'pool' | 'mailQueue'> & { config: Pick<AppContext['config'], 'publicUrl'> };

const nameFromEmail = (email: string) =>
  email
    .split('@')[0]
    .replace(/[._-]+/g, ' ')
    .trim() || email;

export const buildsService = (ctx: Deps) => {
  const { db, pool } = ctx;
  const kits = kitsService(db);

  async function summary(user: Express.User, id: string): Promise<BuildSummary> {
    const [build] = await listVisibleBuilds(db, user, id);
    if (!build) throw notFound('build');
    return build;
  }

  /** The build's people as the reader may manage them. */
  async function people(user: Express.User, buildId: string, organizationId: string): Promise<BuildPeople> {
    const [members, pending] = await Promise.all([
      listBuildMembers(db, buildId),
      listPendingInvitations(db, { buildId }),
    ]);
    const mine = members.find((m) => m.userId === user.id)?.place ?? null;
    return {
      members: members.map((m) => ({
        userId: m.userId,
        name: m.name,
        email: m.email,
        place: m.place,
        addedAt: m.addedAt.toISOString(),
      })),
      pending: pending
        .filter((p) => p.place)
        .map((p) => ({ email: p.email, name: p.name, place: p.place!, expiresAt: p.expiresAt.toISOString() })),
      allowed: allowedBuildPeopleActions(user, { organizationId }, mine),
    };
  }

  /** The build locked, and the reader's right to change its people checked on it. */
  async function forPeopleChange(tx: Db, user: Express.User, buildId: string, action: BuildPeopleAction) {
    const [visible] = await listVisibleBuilds(tx, user, buildId);
    if (!visible) throw notFound('build');
    const build = await lockBuild(tx, buildId);
    const members = await listBuildMembers(tx, buildId);
    const mine = members.find((m) => m.userId === user.id)?.place ?? null;
    if (!allowedBuildPeopleActions(user, build, mine).includes(action)) {
      throw forbidden('only the supplier who shipped the build or its owner changes its people');
    }
    return { build, members };
  }

  /**
   * A person for a place on a build: their account when they have one (of the right role), else an
   * invitation that makes them a member when they join.
   */
  async function placePerson(
    tx: Tx,
    user: Express.User,
    buildId: string,
    p: { email: string; name?: string; place: MemberPlace },
    field: string,
  ) {
    const role = memberRoleOfPlace[p.place];
    const existing = await findUserByEmail(tx.db, p.email);
    if (existing) {
      if (existing.role !== role)
        throw badRequest(`${p.email} has an account as ${existing.role}, not as ${role}`, {
          [field]: `not a ${role}'s account`,
        });
      if (!existing.active) throw conflict(`${p.email} is deactivated`, { [field]: 'deactivated' });
      await addBuildMember(tx.db, { buildId, userId: existing.id, place: p.place, role, addedBy: user.id });
      await insertBuildEvent(tx.db, {
        buildId,
        actorId: user.id,
        kind: 'member_added',
        detail: { name: existing.name, place: p.place },
      });
      return;
    }
    const name = p.name ?? nameFromEmail(p.email);
    await invite(
      ctx,
      tx,
      { email: p.email, name, role, organizationId: null, build: { id: buildId, place: p.place }, invitedBy: user },
      null,
    );
    await insertBuildEvent(tx.db, {
      buildId,
      actorId: user.id,
      kind: 'member_invited',
      detail: { name, email: p.email, place: p.place },
    });
  }

  /** The build locked (and its travelers, when the work on them decides), with the reader's right to `action` checked on it. */
  async function guarded(
    tx: Db,
    user: Express.User,
    buildId: string,
    actionOf: (b: { kitSerial: string }) => BuildAction,
  ) {
    const build = await lockBuild(tx, buildId);
    if (!build) throw notFound('build');
    const action = actionOf(build);
    const why = checkBuildAction(user, build, await buildWork(tx, buildId, action !== 'edit-note'), action);
    if (why) throw why.code === 403 ? forbidden(why.message) : conflict(why.message);
    return build;
  }

  return {
    list: (user: Express.User, q: PageQuery) => pageVisibleBuilds(db, user, q),

    async detail(user: Express.User, id: string) {
      const build = await summary(user, id);
      const b = (await findBuildBrief(db, id))!;
      const [row, work] = await Promise.all([findBuildRow(db, id), buildWork(db, id)]);
      return {
        ...build,
        note: row.note,
        allowedActions: allowedBuildActions(user, b, work),
        fixedBecause: buildWorkRefusal(work),
        people: await people(user, id, b.organizationId),
        travelers: await listTravelers(db, user, { buildId: id }),
      };
    },

    /** Hours worked on the build's parts, by who did the work. */
    async hours(user: Express.User, id: string): Promise<HoursByWho[]> {
      await summary(user, id);
      return readBuildHours(db, user, id);
    },

    /** The build's fabrication-and-assembly table, summed from its live parts' steps. */
    async fabrication(user: Express.User, id: string): Promise<FabricationTable> {
      await summary(user, id);
      return fabricationTable(await listFabricationSteps(db, user, id));
    },

    /**
     * Corrects the build as shipped: its note at any time, its kit serial (and the travelers' serials made
     * from it) only while no work is recorded. Each change goes into the build's events with old and new.
     */
    async update(user: Express.User, id: string, input: BuildChangeInput) {
      await summary(user, id);
      await withTransaction(pool, async (tx) => {
        // A form sends the serial as it stands: only a different one is a change of serial.
        const build = await guarded(tx.db, user, id, (b) =>
          input.kitSerial !== undefined && input.kitSerial !== b.kitSerial ? 'change-serial' : 'edit-note',
        );
        if (input.kitSerial !== undefined && input.kitSerial !== build.kitSerial) {
          if (await kitSerialTaken(tx.db, input.kitSerial, id))
            throw conflict(`kit serial ${input.kitSerial} is already shipped`, { kitSerial: 'already used' });
          await renameBuildSerial(tx.db, id, build.kitSerial, input.kitSerial);
          await insertBuildEvent(tx.db, {
            buildId: id,
            actorId: user.id,
            kind: 'serial_changed',
            detail: { from: build.kitSerial, to: input.kitSerial },
          });
        }
        if (input.note !== undefined && input.note !== build.note) {
          await setBuildNote(tx.db, id, input.note);
          await insertBuildEvent(tx.db, {
            buildId: id,
            actorId: user.id,
            kind: 'note_changed',
            detail: { from: build.note, to: input.note },
          });
        }
      });
      return this.detail(user, id);
    },

    /** Deletes a build shipped by mistake, while nothing is recorded on it: its travelers, people and invitations go with it. */
    async remove(user: Express.User, id: string) {
      await summary(user, id);
      await withTransaction(pool, async (tx) => {
        await guarded(tx.db, user, id, () => 'delete');
        await deleteBuild(tx.db, id);
      });
    },

    /**
     * Ships a kit: the build, its people (invited by mail when they have no account yet), and a traveler
     * (holes and steps included) per published part.
     */
    async create(user: Express.User, input: BuildBody) {
      await kits.get(user, input.kitModelId);
      const revisions = await listPublishedParts(db, input.kitModelId);
      if (revisions.length === 0)
        throw badRequest('this kit has no published part designs yet: publish a revision first', {
          kitModelId: 'no published parts',
        });

      const id = await withTransaction(pool, async (tx) => {
        if (await kitSerialTaken(tx.db, input.kitSerial))
          throw conflict(`kit serial ${input.kitSerial} is already shipped`, { kitSerial: 'already used' });
        const build = await insertBuild(tx.db, {
          organizationId: user.organizationId!,
          kitModelId: input.kitModelId,
          kitSerial: input.kitSerial,
          createdBy: user.id,
        });
        await placePerson(
          tx,
          user,
          build.id,
          { email: input.builderEmail, name: input.builderName, place: 'owner' },
          'builderEmail',
        );
        await placePerson(
          tx,
          user,
          build.id,
          { email: input.inspectorEmail, name: input.inspectorName, place: 'final_inspector' },
          'inspectorEmail',
        );
        for (const { design_revisions: rev, part_designs: design } of revisions) {
          await insertTraveler(tx.db, {
            buildId: build.id,
            serial: `${input.kitSerial}-${design.partNumber}`,
            revision: rev,
          });
        }
        return build.id;
      });
      return summary(user, id);
    },

    /** Adds a builder or inspector to the build in the place given; an address with no account is invited. */
    async addMember(user: Express.User, buildId: string, input: { email: string; place: MemberPlace; name?: string }) {
      if (singlePlaces.includes(input.place))
        throw conflict('a build has one owner: hand the build over instead', { place: 'hand the build over instead' });
      await withTransaction(pool, async (tx) => {
        const { members } = await forPeopleChange(tx.db, user, buildId, 'add');
        const already = members.find((m) => m.email === input.email);
        if (already) throw conflict(`${already.name} is already on this build`, { email: 'already on this build' });
        await placePerson(tx, user, buildId, input, 'email');
      });
      return this.detail(user, buildId);
    },

    /** Takes a person off the build: their access (photo links included) ends with this request. */
    async removeMember(user: Express.User, buildId: string, userId: string) {
      await withTransaction(pool, async (tx) => {
        const { members } = await forPeopleChange(tx.db, user, buildId, 'remove');
        const member = members.find((m) => m.userId === userId);
        if (!member) throw notFound('person on this build');
        const why = removalRefusal(member);
        if (why) throw conflict(why);
        await removeBuildMember(tx.db, buildId, userId);
        await insertBuildEvent(tx.db, {
          buildId,
          actorId: user.id,
          kind: 'member_removed',
          detail: { name: member.name, place: member.place },
        });
      });
      return this.detail(user, buildId);
    },

    /** Hands the build, its whole log included, to another builder on it; the old owner stays as a helper. */
    async handOver(user: Express.User, buildId: string, userId: string) {
      await withTransaction(pool, async (tx) => {
        const { members } = await forPeopleChange(tx.db, user, buildId, 'hand-over');
        const next = members.find((m) => m.userId === userId);
        if (!next || next.role !== 'builder')
          throw badRequest('hand the build to a builder who is on it', { userId: 'not a builder of this build' });
        if (next.place === 'owner') throw conflict(`${next.name} already owns this build`);
        const owner = members.find((m) => m.place === 'owner');
        if (owner) await setMemberPlace(tx.db, buildId, owner.userId, 'helper');
        await setMemberPlace(tx.db, buildId, userId, 'owner');
        await insertBuildEvent(tx.db, {
          buildId,
          actorId: user.id,
          kind: 'owner_changed',
          detail: { from: owner?.name ?? null, to: next.name },
        });
      });
      return this.detail(user, buildId);
    },
  };
};
