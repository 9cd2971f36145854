import { z } from 'zod';
import { emailAddress, plainText } from './common';
import type { Role } from './common';
import type { BuildPeople } from './people';

export const buildInput = z.object({
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  kitSerial: plainText('the kit serial', 1, 40, 'give the kit serial'),
  builderEmail: emailAddress("enter the builder's e-mail address"),
  /** For the invitation, when the address has no account yet. */
  builderName: plainText('the builder’s name', 1, 120).optional(),
  inspectorEmail: emailAddress("enter the inspector's e-mail address"),
  inspectorName: plainText('the inspector’s name', 1, 120).optional(),
});
export type BuildInput = z.input<typeof buildInput>;

export type BuildSummary = {
  id: string;
  kitSerial: string;
  kitName: string;
  supplierName: string;
  createdAt: string;
  builders: { id: string; name: string; email: string }[];
  inspectors: { id: string; name: string; email: string }[];
  travelerCount: number;
  holesTotal: number;
  holesDone: number;
  openFindings: number;
};

/** A correction of a shipped build: its kit serial (while no work is recorded) and the shipping note. */
export const buildChangeInput = z
  .object({
    kitSerial: plainText('the kit serial', 1, 40, 'give the kit serial').optional(),
    note: plainText('the note', 0, 2000).optional(),
  })
  .strict()
  .refine((b) => b.kitSerial !== undefined || b.note !== undefined, { message: 'change the kit serial or the note' });
export type BuildChangeInput = z.input<typeof buildChangeInput>;

export const buildActions = ['edit-note', 'change-serial', 'delete'] as const;
export type BuildAction = (typeof buildActions)[number];

/** What is recorded on a build's travelers: once any of it exists the build is part of someone's log. */
export type BuildWork = {
  holesWorked: number;
  stepsDone: number;
  findings: number;
  signedOff: number;
  logEntries: number;
};

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** Why the build's identity is fixed, or null: the builder's log already names it. */
export function buildWorkRefusal(w: BuildWork): string | null {
  const what =
    [
      w.holesWorked ? count(w.holesWorked, 'hole') + ' worked' : '',
      w.stepsDone ? count(w.stepsDone, 'step') + ' done' : '',
      w.findings ? count(w.findings, 'finding') : '',
      w.signedOff ? count(w.signedOff, 'part') + ' signed off' : '',
    ]
      .filter(Boolean)
      .join(', ') || (w.logEntries ? count(w.logEntries, 'entry', 'entries') + ' in its log' : '');
  return what ? `work is recorded on this build (${what}): it stays as shipped, and its log keeps it` : null;
}

/** Why the reader may not do `action` on the build (403: not theirs; 409: not now), or null. */
export function checkBuildAction(
  who: { role: Role; organizationId: string | null },
  build: { organizationId: string },
  w: BuildWork,
  action: BuildAction,
): { code: 403 | 409; message: string } | null {
  if (who.role !== 'supplier' || who.organizationId !== build.organizationId)
    return { code: 403, message: 'only the supplier who shipped the build changes or deletes it' };
  if (action === 'edit-note') return null;
  const why = buildWorkRefusal(w);
  return why ? { code: 409, message: why } : null;
}

export const allowedBuildActions = (
  who: { role: Role; organizationId: string | null },
  build: { organizationId: string },
  w: BuildWork,
): BuildAction[] => buildActions.filter((a) => checkBuildAction(who, build, w, a) === null);

/** A build as its page shows it: its parts, its people with who has not joined yet, and what the reader may change. */
export type BuildDetail = BuildSummary & {
  people: BuildPeople;
  /*
   * Optional so that a page made before these were answered (or a test's fixture) reads as "nothing
   * to change": the screen offers only what the list holds.
   */
  /** The supplier's note on the shipment. */
  note?: string;
  allowedActions?: BuildAction[];
  /** Why the serial and the build itself are fixed (null while no work is recorded). */
  fixedBecause?: string | null;
};
