import { INVITATION_TTL_HOURS, type MemberPlace, type Role } from '../../db/contracts';
import type { Db, Tx } from '../../db';
import type { AppContext } from '../context';
import { invitationMail } from '../mail/account-mail';
import { newOneTimeToken } from '../auth/tokens';
import { findBuildBrief, insertInvitation } from './people-repository';

export type InvitationRequest = {
  email: string;
  name: string;
  role: Role;
  organizationId: string | null;
  lead?: boolean;
  build?: { id: string; place: MemberPlace } | null;
  invitedBy: { id: string; name: string };
};

/**
 * Writes an invitation and queues its mail in the caller's unit of work: the mail goes if and only if the
 * invitation is saved. The token lives only in the mail; we keep its hash.
 */
export async function invite(
  ctx: Pick<AppContext, 'mailQueue'> & { config: Pick<AppContext['config'], 'publicUrl'> },
  tx: Tx,
  r: InvitationRequest,
  organizationName: string | null,
) {
  const { token, hash } = newOneTimeToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_HOURS * 3600_000);
  const build = r.build ? await findBuildBrief(tx.db as Db, r.build.id) : null;
  const row = await insertInvitation(tx.db, {
    email: r.email,
    name: r.name,
    role: r.role,
    organizationId: r.organizationId,
    lead: r.lead ?? false,
    buildId: r.build?.id ?? null,
    place: r.build?.place ?? null,
    tokenHash: hash,
    invitedBy: r.invitedBy.id,
    expiresAt,
  });
  await ctx.mailQueue.enqueue(tx, {
    message: invitationMail({
      to: r.email,
      name: r.name,
      role: r.role,
      invitedByName: r.invitedBy.name,
      organizationName,
      build: build && r.build ? { kitSerial: build.kitSerial, kitName: build.kitName, place: r.build.place } : null,
      link: `${ctx.config.publicUrl}/invite/${token}`,
      expiresAt,
    }),
  });
  return row;
}
