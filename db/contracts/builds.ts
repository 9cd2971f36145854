import { z } from 'zod';
import { plainText } from './common';
import type { BuildPeople } from './people';

export const buildInput = z.object({
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  kitSerial: plainText('the kit serial', 1, 40, 'give the kit serial'),
  builderEmail: z.email({ message: "enter the builder's e-mail address" }).max(254).transform((s) => s.toLowerCase()),
  /** For the invitation, when the address has no account yet. */
  builderName: plainText('the builder’s name', 1, 120).optional(),
  inspectorEmail: z.email({ message: "enter the inspector's e-mail address" }).max(254).transform((s) => s.toLowerCase()),
  inspectorName: plainText('the inspector’s name', 1, 120).optional(),
});
export type BuildInput = z.input<typeof buildInput>;

export type BuildSummary = {
  id: string; kitSerial: string; kitName: string; supplierName: string; createdAt: string;
  builders: { id: string; name: string; email: string }[];
  inspectors: { id: string; name: string; email: string }[];
  travelerCount: number; holesTotal: number; holesDone: number; openFindings: number;
};

/** A build as its page shows it: its parts, and its people with who has not joined yet. */
export type BuildDetail = BuildSummary & { people: BuildPeople };

export type QrLabel = { travelerId: string; serial: string; shortCode: string; partNumber: string; partName: string; letter: string; qrDataUrl: string; url: string };
