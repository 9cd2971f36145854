import { z } from 'zod';

export const buildInput = z.object({
  kitModelId: z.uuid({ message: 'choose a kit model' }),
  kitSerial: z.string().trim().min(1, 'give the kit serial').max(40),
  builderEmail: z.email({ message: "enter the builder's e-mail address" }).transform((s) => s.toLowerCase()),
  inspectorEmail: z.email({ message: "enter the inspector's e-mail address" }).transform((s) => s.toLowerCase()),
});
export type BuildInput = z.input<typeof buildInput>;

export type BuildSummary = {
  id: string; kitSerial: string; kitName: string; supplierName: string; createdAt: string;
  builders: { id: string; name: string; email: string }[];
  inspectors: { id: string; name: string; email: string }[];
  travelerCount: number; holesTotal: number; holesDone: number; openFindings: number;
};

export type QrLabel = { travelerId: string; serial: string; shortCode: string; partNumber: string; partName: string; letter: string; qrDataUrl: string; url: string };
