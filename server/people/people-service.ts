import {
  allowedPersonActions,
  memberRoleOfPlace,
  mayInvite,
  rolesOfOrganizationKind,
  type AcceptInvitationInput,
  type InvitationView,
  type InviteInput,
  type Manager,
  type OrganizationInput,
  type OrganizationSummary,
  type Page,
  type PageQuery,
  type PendingInvitation,
  type PersonSummary,
  type PersonUpdateInput,
} from '../../db/contracts';
import { withTransaction, type Db } from '../../db';
import type { AppContext } from '../context';
import { hashPassword } from '../auth/passwords';
import { requireStrongPassword } from '../auth/password-strength';
import { signInResult } from '../auth/session';
import { hashOneTimeToken } from '../auth/tokens';
import { insertBuildEvent } from '../builds/builds-repository';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../http-error';
import { invite } from './invitations';
import {
  addBuildMember,
  findLiveInvitation,
  findOrganization,
  findPerson,
  findUserByEmail,
  insertOrganization,
  insertUser,
  pageOrganizations,
  pagePendingInvitations,
  pagePeople,
  takeOpenInvitations,
  updatePerson,
} from './people-repository';

type Deps = Pick<AppContext, 'db' | 'pool' | 'config' | 'mailQueue'>;

const managerOf = (u: Express.User): Manager => ({
  id: u.id,
  role: u.role,
  organizationId: u.organizationId,
  lead: u.lead,
});
const manages = (u: Express.User) => u.role === 'admin' || (u.role === 'supplier' && u.lead);

export const peopleService = (ctx: Deps) => {
  const { db, pool } = ctx;
  /** The admin sees everyone; a lead engineer their own organisation. */
  const scope = (u: Express.User) => {
    if (!manages(u)) throw forbidden('only an admin or a supplier’s lead engineer manages people');
    return u.role === 'admin' ? undefined : (u.organizationId ?? undefined);
  };

  /** A change of a person's role or standing, checked against the rules on their locked row. */
  async function changePerson(tx: Db, user: Express.User, id: string, input: PersonUpdateInput) {
    const person = await findPerson(tx, id, true);
    if (!person || (user.role !== 'admin' && person.organizationId !== user.organizationId)) throw notFound('person');
    const allowed = allowedPersonActions(managerOf(user), person);
    const need = [
      input.role !== undefined && input.role !== person.role ? 'change-role' : null,
      input.active === false && person.active ? 'deactivate' : null,
      input.active === true && !person.active ? 'reactivate' : null,
      input.lead === true && !person.lead ? 'make-lead' : null,
    ].filter((x): x is PersonSummary['allowed'][number] => x !== null);
    const refused = need.find((a) => !allowed.includes(a));
    if (refused)
      throw forbidden(
        user.id === id
          ? 'you cannot change your own account here'
          : `you may not ${refused.replace('-', ' ')} this person`,
      );
    if (input.role && person.organizationId) {
      const org = (await findOrganization(tx, person.organizationId))!;
      if (!rolesOfOrganizationKind[org.kind].includes(input.role))
        throw badRequest('not a role of this person’s organisation', { role: 'not a role of this organisation' });
    }
    await updatePerson(tx, id, { role: input.role, active: input.active, lead: input.lead });
  }

  return {
    async organizations(user: Express.User, q: PageQuery): Promise<Page<OrganizationSummary>> {
      if (user.role !== 'admin') throw forbidden('only an admin manages organisations');
      const page = await pageOrganizations(db, q);
      return { items: page.items.map((o) => ({ ...o, createdAt: o.createdAt.toISOString() })), next: page.next };
    },

    async createOrganization(user: Express.User, input: OrganizationInput & { kind: OrganizationSummary['kind'] }) {
      if (user.role !== 'admin') throw forbidden('only an admin manages organisations');
      const o = await insertOrganization(db, input.name, input.kind);
      return { ...o, people: 0, createdAt: o.createdAt.toISOString() };
    },

    async people(user: Express.User, q: PageQuery): Promise<Page<PersonSummary>> {
      const page = await pagePeople(db, scope(user), q);
      return {
        items: page.items.map((p) => ({
          ...p,
          createdAt: p.createdAt.toISOString(),
          allowed: allowedPersonActions(managerOf(user), p),
        })),
        next: page.next,
      };
    },

    async pending(user: Express.User, q: PageQuery): Promise<Page<PendingInvitation>> {
      const page = await pagePendingInvitations(db, scope(user), q);
      return {
        items: page.items.map(({ createdKey: _, ...i }) => ({ ...i, expiresAt: i.expiresAt.toISOString() })),
        next: page.next,
      };
    },

    async invite(
      user: Express.User,
      input: Required<Pick<InviteInput, 'email' | 'name' | 'role'>> & { organizationId: string | null; lead: boolean },
    ) {
      const why = mayInvite(managerOf(user), input.role, input.organizationId);
      if (why) throw forbidden(why);
      const org = input.organizationId ? await findOrganization(db, input.organizationId) : null;
      if (input.organizationId && !org)
        throw badRequest('no such organisation', { organizationId: 'no such organisation' });
      if (input.role === 'admin' && org)
        throw badRequest('an admin belongs to no organisation', { organizationId: 'leave empty for an admin' });
      if (input.role === 'supplier' && !org)
        throw badRequest('a supplier’s engineer belongs to a kit supplier', {
          organizationId: 'choose the kit supplier',
        });
      if (org && !rolesOfOrganizationKind[org.kind].includes(input.role)) {
        throw badRequest(
          `a ${org.kind === 'supplier' ? 'kit supplier' : org.kind === 'shop' ? 'build shop' : 'inspection body'} holds no ${input.role}`,
          { role: 'not a role of this organisation' },
        );
      }
      if (input.lead && input.role !== 'supplier')
        throw badRequest('only a supplier’s engineer can be a lead engineer', { lead: 'suppliers only' });
      await withTransaction(pool, async (tx) => {
        if (await findUserByEmail(tx.db, input.email))
          throw conflict('this address already has an account', { email: 'already has an account' });
        await invite(ctx, tx, { ...input, invitedBy: user }, org?.name ?? null);
      });
      return { ok: true as const };
    },

    async update(user: Express.User, id: string, input: PersonUpdateInput) {
      // The rules read the person as they stand, their row locked, in the unit of work that changes them.
      await withTransaction(pool, (tx) => changePerson(tx.db, user, id, input));
      const after = (await findPerson(db, id))!;
      return {
        ...after,
        createdAt: after.createdAt.toISOString(),
        allowed: allowedPersonActions(managerOf(user), after),
      };
    },

    async viewInvitation(token: string): Promise<InvitationView> {
      const found = await findLiveInvitation(db, hashOneTimeToken(token));
      if (!found)
        throw new HttpError(404, 'not_found', 'this invitation has expired or was already used: ask for a new one');
      const i = found.invitation;
      return {
        email: i.email,
        name: i.name,
        role: i.role,
        organizationName: found.organizationName,
        invitedByName: found.invitedByName,
        expiresAt: i.expiresAt.toISOString(),
      };
    },

    /** Joins: the account with the person's own password, and every build they were invited to. */
    async accept(input: Required<AcceptInvitationInput>) {
      const found = await findLiveInvitation(db, hashOneTimeToken(input.token));
      if (!found)
        throw new HttpError(404, 'not_found', 'this invitation has expired or was already used: ask for a new one');
      const i = found.invitation;
      requireStrongPassword(input.password, [i.email, input.name]);
      const passwordHash = await hashPassword(input.password);
      const userId = await withTransaction(pool, async (tx) => {
        if (await findUserByEmail(tx.db, i.email))
          throw conflict('this address already has an account: sign in instead');
        const u = await insertUser(tx.db, {
          email: i.email,
          name: input.name,
          role: i.role,
          organizationId: i.organizationId,
          lead: i.lead,
          passwordHash,
        });
        for (const open of await takeOpenInvitations(tx.db, i.email)) {
          if (!open.buildId || !open.place || memberRoleOfPlace[open.place] !== u.role) continue;
          await addBuildMember(tx.db, {
            buildId: open.buildId,
            userId: u.id,
            place: open.place,
            role: memberRoleOfPlace[open.place],
            addedBy: open.invitedBy,
          });
          await insertBuildEvent(tx.db, {
            buildId: open.buildId,
            actorId: u.id,
            kind: 'member_joined',
            detail: { name: u.name, place: open.place },
          });
        }
        return u.id;
      });
      return signInResult(ctx, userId);
    },
  };
};
