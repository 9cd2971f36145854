import { and, eq, inArray } from 'drizzle-orm';
import QRCode from 'qrcode';
import type { BuildSummary, QrLabel } from '../../db/contracts';
import type { Db } from '../../db';
import { buildMembers, builds, designRevisions, partDesigns, travelers } from '../../db/schema';
import { badRequest, conflict, forbidden, notFound } from '../http-error';
import { kitsService } from '../kits/kits-service';
import { insertTraveler, listTravelers } from '../travelers/travelers-repository';
import { findUserByEmail, listVisibleBuilds } from './builds-repository';

type BuildBody = { kitModelId: string; kitSerial: string; builderEmail: string; inspectorEmail: string };

export const buildsService = (db: Db, publicUrl: string) => {
  const kits = kitsService(db);

  async function summary(user: Express.User, id: string): Promise<BuildSummary> {
    const [build] = await listVisibleBuilds(db, user, id);
    if (!build) throw notFound('build');
    return build;
  }

  return {
    list: (user: Express.User) => listVisibleBuilds(db, user),

    async detail(user: Express.User, id: string) {
      const build = await summary(user, id);
      return { ...build, travelers: await listTravelers(db, user, { buildId: id }) };
    },

    /** Ships a kit: the build, its people, and a traveler (holes and steps included) per published part. */
    async create(user: Express.User, input: BuildBody) {
      await kits.get(user, input.kitModelId);
      const [builder, inspector] = await Promise.all([findUserByEmail(db, input.builderEmail), findUserByEmail(db, input.inspectorEmail)]);
      const fields: Record<string, string> = {};
      if (!builder || builder.role !== 'builder') fields.builderEmail = 'no builder has an account with this address';
      if (!inspector || inspector.role !== 'inspector') fields.inspectorEmail = 'no inspector has an account with this address';
      if (Object.keys(fields).length) throw badRequest(Object.values(fields).join('; '), fields);

      const revisions = await db.select().from(designRevisions).innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
        .where(and(eq(partDesigns.kitModelId, input.kitModelId), eq(designRevisions.status, 'published')));
      if (revisions.length === 0) throw badRequest('this kit has no published part designs yet: publish a revision first', { kitModelId: 'no published parts' });

      const id = await db.transaction(async (tx) => {
        const clash = await tx.select({ id: builds.id }).from(builds).where(eq(builds.kitSerial, input.kitSerial));
        if (clash.length) throw conflict(`kit serial ${input.kitSerial} is already shipped`, { kitSerial: 'already used' });
        const [build] = await tx.insert(builds).values({
          organizationId: user.organizationId!, kitModelId: input.kitModelId, kitSerial: input.kitSerial, createdBy: user.id,
        }).returning();
        await tx.insert(buildMembers).values([
          { buildId: build.id, userId: builder!.id, role: 'builder' },
          { buildId: build.id, userId: inspector!.id, role: 'inspector' },
        ]);
        for (const { design_revisions: rev, part_designs: design } of revisions) {
          await insertTraveler(tx, { buildId: build.id, serial: `${input.kitSerial}-${design.partNumber}`, revision: rev });
        }
        return build.id;
      });
      return summary(user, id);
    },

    /** One printable label per traveler: the QR carries a URL, so a phone's own camera opens it too. */
    async labels(user: Express.User, id: string): Promise<QrLabel[]> {
      if (user.role !== 'supplier' && user.role !== 'admin') throw forbidden('only the supplier prints labels');
      await summary(user, id);
      const rows = await db.select({
        travelerId: travelers.id, serial: travelers.serial, shortCode: travelers.shortCode, qrToken: travelers.qrToken,
        partNumber: partDesigns.partNumber, partName: partDesigns.name, letter: designRevisions.letter,
      }).from(travelers).innerJoin(designRevisions, eq(designRevisions.id, travelers.revisionId))
        .innerJoin(partDesigns, eq(partDesigns.id, designRevisions.partDesignId))
        .where(inArray(travelers.buildId, [id])).orderBy(partDesigns.partNumber);
      return Promise.all(rows.map(async ({ qrToken, ...r }) => {
        const url = `${publicUrl}/t/${qrToken}`;
        return { ...r, url, qrDataUrl: await QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 2, scale: 8 }) };
      }));
    },
  };
};
