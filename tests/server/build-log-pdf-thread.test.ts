import { fabricationTable, type BuildLogEntry } from '@/db/contracts';
import { startPdfThread } from '@/server/build-log/build-log-pdf-thread';
import { pdfText } from '../helpers/pdf-text';

jest.setTimeout(60000);

/**
 * The build log's PDF is laid out in a worker thread of its own (the request thread only hands it
 * batches and writes the bytes it sends back). The document it makes is checked by reading its text
 * back (tests/helpers/pdf-text.ts, after ISO 32000-1); a failure inside the thread must fail the export,
 * never leave it waiting.
 */
const head = {
  build: {
    id: '00000000-0000-4000-8000-000000000001',
    kitSerial: 'TK-0001',
    kitName: 'Test kit',
    supplierName: 'Invented Kitworks',
    createdAt: '2026-06-01T07:00:00.000Z',
    builders: [{ id: 'b', name: 'Bea Builder', email: 'bea@example.test' }],
    inspectors: [],
    travelerCount: 1,
    holesTotal: 3,
    holesDone: 3,
    openFindings: 0,
  },
  count: 3,
  range: { from: '2026-06-01T07:00:00.000Z', to: '2026-06-01T07:02:00.000Z' },
  chain: { seq: 3, hash: 'ab'.repeat(32) },
  summary: {
    hours: [],
    fabrication: fabricationTable([]),
    parts: [],
    findings: [],
    findingsTotal: 0,
    notices: [],
    noticesTotal: 0,
  },
};
const opts = {
  tz: 'UTC',
  generatedAt: new Date('2026-06-02T09:00:00Z'),
  generatedBy: 'Bea Builder',
  filters: 'none: the whole log',
};
const entry = (i: number): BuildLogEntry => ({
  id: `t:${i}`,
  at: `2026-06-01T07:0${i}:00.000Z`,
  receivedAt: `2026-06-01T07:0${i}:00.000Z`,
  clockOffsetMs: null,
  hash: null,
  actorName: 'Bea Builder',
  actorRole: 'builder',
  kind: 'holes_installed',
  group: 'bench',
  travelerId: 'tr',
  travelerSerial: 'SN-1',
  partNumber: 'W-104',
  partName: 'Wing rib',
  holeIds: [`U-0${i + 1}`],
  text: `Installed hole U-0${i + 1}.`,
});

describe('the PDF thread', () => {
  it('makes the document from batches handed to it, every entry in the order given', async () => {
    const chunks: Buffer[] = [];
    const pdf = startPdfThread(head, opts, (c) => chunks.push(c));
    try {
      await pdf.add([entry(0), entry(1)], new Map());
      await pdf.add([entry(2)], new Map());
      await pdf.end();
    } finally {
      await pdf.stop();
    }
    const bytes = Buffer.concat(chunks);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.subarray(-6).toString('latin1')).toMatch(/%%EOF\s*$/);
    const text = pdfText(bytes);
    const at = ['Installed hole U-01.', 'Installed hole U-02.', 'Installed hole U-03.'].map((s) => text.indexOf(s));
    expect(at.every((i) => i >= 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(text).toContain('End of log: 3 entries.');
  });

  it('fails the export when the thread fails, instead of leaving it waiting', async () => {
    const pdf = startPdfThread(head, opts, () => undefined);
    try {
      // A kind the contract does not have: laying it out throws inside the thread.
      const bad = { ...entry(0), kind: 'no_such_kind' } as unknown as BuildLogEntry;
      await expect(pdf.add([bad], new Map())).rejects.toThrow();
      await expect(pdf.end()).rejects.toThrow();
    } finally {
      await pdf.stop();
    }
  });
});
