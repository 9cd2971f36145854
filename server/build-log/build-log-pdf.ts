import type { Writable } from 'node:stream';
import PDFDocument from 'pdfkit';
import {
  complianceStatusLabels,
  noticeLevelLabels,
  type ComplianceStatus,
  type NoticeLevel,
  buildLogCaution,
  buildLogKindLabels,
  clockIsOff,
  creditColumnLabels,
  creditColumns,
  fabricationCaution,
  shareText,
  findingClosureLabels,
  findingKindLabels,
  findingStatusLabels,
  whoWithHelp,
  type BuildLogEntry,
  type BuildSummary,
  type FabricationCounts,
  type FabricationTable,
  type FindingClosure,
  type FindingKind,
  type FindingStatus,
  type HoursByWho,
} from '../../db/contracts';
import { hoursText } from '../../lib/hours-text';
import { timingNote } from '../../lib/log-timing';
import { longDay, zonedDateTime } from '../../lib/zoned-time';

export type PdfOptions = {
  tz: string;
  generatedAt: Date;
  generatedBy: string;
  /** The filters in words: a filtered print must never pass for the whole log. */
  filters: string;
};

/** What the title block says before any entry is read: how many entries and their first and last moment. */
export type PdfHead = {
  build: BuildSummary;
  count: number;
  range: { from: string | null; to: string | null };
  /** The build's hash chain as the print began: a later check of the log starts from it. */
  chain: { seq: number; hash: string } | null;
  /** What the inspection reads first: hours, who did the work, parts signed off, findings and how they closed. */
  summary: LogSummary;
};

export type LogSummary = {
  hours: HoursByWho[];
  fabrication: FabricationTable;
  parts: {
    partNumber: string;
    serial: string;
    signedOffAt: string | null;
    signedOffByName: string | null;
    replaced: boolean;
  }[];
  findings: {
    partNumber: string;
    holeIds: string[];
    kind: FindingKind;
    status: FindingStatus;
    closure: FindingClosure | null;
    raisedAt: string;
  }[];
  findingsTotal: number;
  notices: {
    number: number;
    title: string;
    level: NoticeLevel;
    issuedAt: string;
    status: ComplianceStatus;
    answeredAt: string | null;
    answeredByName: string | null;
    note: string | null;
    reason: string | null;
  }[];
  noticesTotal: number;
};

/** Thumbnail bytes by photo id, for one batch of entries; a missing one prints as an empty frame with a word. */
export type Thumbs = Map<string, Buffer>;

/** The PDF as it is written: entries go in oldest first, batch by batch, and each finished page leaves at once. */
export type LogPdfWriter = {
  add(entries: readonly BuildLogEntry[], thumbs: Thumbs): void;
  /** Closes the document; resolves when its last byte has been handed to the output. */
  end(): Promise<void>;
  /** Stops writing into the output (its reader left); what is drawn afterwards is dropped. */
  detach(): void;
};

/**
 * Bytes handed to the output at a time. pdfkit pushes every piece of every object (and each line of
 * the cross-reference table, thousands at the end) as a chunk of its own: written one by one, each
 * became an HTTP chunk and a socket write, a large share of the export's time on the request thread.
 */
export const OUT_CHUNK = 64 * 1024;

// The drafting-sheet look on white paper (it gets printed): near-black ink, thin warm rules, one accent.
const C = {
  ink: '#1C1A16',
  soft: '#47433B',
  faint: '#6F695E',
  rule: '#CBC1AD',
  ruleStrong: '#9C917C',
  accent: '#1F4BC2',
  caution: '#7A5300',
  cautionSoft: '#F3E6C4',
  band: '#EFE9DC',
  flag: '#C2410C',
};

const PAGE = { width: 612, height: 792 }; // US Letter: inches are the product's default units
const M = { left: 40, right: 40, top: 40, bottom: 40 };
const CONTENT_W = PAGE.width - M.left - M.right;
const BOTTOM = PAGE.height - 58; // rows stop here; the footer sits below
const COLS = { time: 50, part: 112, who: 100 };
const ENTRY_W = CONTENT_W - COLS.time - COLS.part - COLS.who;
const PAD = 5;
const THUMB = 44;

function fontFile(pkg: string, file: string): string | null {
  try {
    return require.resolve(`@expo-google-fonts/${pkg}/${file}`);
  } catch {
    return null;
  }
}

/**
 * The app's own open-licensed faces when installed (they carry curly quotes and accents); PDF base fonts
 * otherwise. The mono face's empty space glyph trips the font reader, so a mono string with a space in
 * it prints in Courier instead (serials, part numbers and times normally have none).
 */
function registerFonts(doc: PDFKit.PDFDocument): (s: string, bold?: boolean) => string {
  const faces: [string, string | null, string][] = [
    ['text', fontFile('atkinson-hyperlegible', '400Regular/AtkinsonHyperlegible_400Regular.ttf'), 'Helvetica'],
    ['bold', fontFile('atkinson-hyperlegible', '700Bold/AtkinsonHyperlegible_700Bold.ttf'), 'Helvetica-Bold'],
    [
      'italic',
      fontFile('atkinson-hyperlegible', '400Regular_Italic/AtkinsonHyperlegible_400Regular_Italic.ttf'),
      'Helvetica-Oblique',
    ],
    ['mono', fontFile('ibm-plex-mono', '400Regular/IBMPlexMono_400Regular.ttf'), 'Courier'],
    ['monoBold', fontFile('ibm-plex-mono', '600SemiBold/IBMPlexMono_600SemiBold.ttf'), 'Courier-Bold'],
  ];
  for (const [name, file, fallback] of faces) {
    try {
      doc.registerFont(name, file ?? fallback);
      doc.font(name).widthOfString('0');
    } catch {
      doc.registerFont(name, fallback);
    }
  }
  doc.registerFont('monoPlain', 'Courier');
  doc.registerFont('monoPlainBold', 'Courier-Bold');
  let spaces = true;
  try {
    doc.font('mono').widthOfString('a b');
    doc.font('monoBold').widthOfString('a b');
  } catch {
    spaces = false;
  }
  doc.font('text');
  return (s, bold) => (spaces || !/\s/.test(s) ? (bold ? 'monoBold' : 'mono') : bold ? 'monoPlainBold' : 'monoPlain');
}

function when(iso: string | null, tz: string): string {
  if (!iso) return '–';
  const z = zonedDateTime(new Date(iso), tz);
  return `${z.date} ${z.hm}`;
}

/**
 * Starts the PDF and writes it into `out` in chunks of OUT_CHUNK bytes. Pages are not buffered (pdfkit writes a page out when the next
 * one starts), so the memory it takes is one page and one batch, whatever the length of the log; the
 * footer is drawn as each page starts and says "Page n", the count of pages not being known until the end.
 */
export function startLogPdf(out: Writable, head: PdfHead, opts: PdfOptions): LogPdfWriter {
  const { build } = head;
  const doc = new PDFDocument({
    size: 'LETTER',
    margins: M,
    bufferPages: false,
    info: {
      Title: `Build log ${build.kitSerial}`,
      Author: 'Pitchcard',
      Subject: `${build.kitName}, ${build.supplierName}`,
      CreationDate: opts.generatedAt,
    },
  });
  const mono = registerFonts(doc);
  // The reader's pace is kept by the caller (it waits for `drain` on `out` between slices), as with a pipe.
  let held: Buffer[] = [];
  let heldBytes = 0;
  let attached = true;
  const flush = () => {
    if (heldBytes && attached && !out.destroyed && !out.writableEnded)
      out.write(held.length === 1 ? held[0] : Buffer.concat(held, heldBytes));
    held = [];
    heldBytes = 0;
  };
  const done = new Promise<void>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => {
      held.push(chunk);
      heldBytes += chunk.length;
      if (heldBytes >= OUT_CHUNK) flush();
    });
    doc.on('end', () => {
      flush();
      if (attached && !out.destroyed && !out.writableEnded) out.end();
      resolve();
    });
    doc.on('error', reject);
  });

  const hrule = (y: number, color = C.rule, width = 0.5) => {
    doc
      .save()
      .moveTo(M.left, y)
      .lineTo(PAGE.width - M.right, y)
      .lineWidth(width)
      .strokeColor(color)
      .stroke()
      .restore();
  };
  const label = (s: string, x: number, y: number, width: number, color = C.faint) =>
    doc
      .font('bold')
      .fontSize(6.5)
      .fillColor(color)
      .text(s.toUpperCase(), x, y, { width, characterSpacing: 0.6, lineBreak: true });

  // ── Footer, drawn as each page starts (also a page pdfkit adds itself for an entry taller than the room left) ──
  let pageNo = 0;
  const footer = () => {
    pageNo += 1;
    const keep = { x: doc.x, y: doc.y };
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0; // writing below the margin must not start a new page
    const fy = PAGE.height - 40;
    hrule(fy - 4, C.ruleStrong);
    doc
      .font('text')
      .fontSize(7)
      .fillColor(C.faint)
      .text(
        `Pitchcard build log · ${build.kitSerial} · printed ${when(opts.generatedAt.toISOString(), opts.tz)} (${opts.tz}) · an aid, not certification`,
        M.left,
        fy,
        { width: CONTENT_W - 80, lineBreak: false },
      );
    doc
      .font('text')
      .fontSize(7.5)
      .fillColor(C.ink)
      .text(`Page ${pageNo}`, PAGE.width - M.right - 80, fy, { width: 80, align: 'right', lineBreak: false });
    doc.page.margins.bottom = bottom;
    doc.x = keep.x;
    doc.y = keep.y;
  };
  footer();
  doc.on('pageAdded', footer);

  // ── Title block ────────────────────────────────────────────────────────────────────────────────
  let y = M.top;
  label('Build log', M.left, y, CONTENT_W, C.accent);
  y += 11;
  doc
    .font(mono(build.kitSerial, true))
    .fontSize(20)
    .fillColor(C.ink)
    .text(build.kitSerial, M.left, y, { width: CONTENT_W });
  y = doc.y + 1;
  doc
    .font('text')
    .fontSize(11)
    .fillColor(C.soft)
    .text(`${build.kitName} · ${build.supplierName}`, M.left, y, { width: CONTENT_W });
  y = doc.y + 8;

  const people = (xs: { name: string; email: string }[]) => xs.map((p) => `${p.name} <${p.email}>`).join('\n') || '–';
  const cells: [string, string, boolean?][][] = [
    [
      ['Kit serial', build.kitSerial, true],
      ['Kit', build.kitName],
      ['Supplier', build.supplierName],
    ],
    [
      ['Builder(s)', people(build.builders)],
      ['Inspector(s)', people(build.inspectors)],
      [
        'Entries',
        head.count
          ? `${when(head.range.from, opts.tz)}\nto ${when(head.range.to, opts.tz)}\n${head.count} in all`
          : 'none',
      ],
    ],
    [
      ['Filters', opts.filters],
      ['Times shown in', opts.tz],
      ['Printed', `${when(opts.generatedAt.toISOString(), opts.tz)}\nby ${opts.generatedBy}`],
    ],
    [
      [
        'Log chain head when printed',
        head.chain ? `link ${head.chain.seq}\n${head.chain.hash}` : 'no entries yet',
        true,
      ],
    ],
  ];
  const cellW = CONTENT_W / 3;
  const blockTop = y;
  hrule(y, C.ink, 1);
  for (const row of cells) {
    const heights = row.map(([, v, isMono]) =>
      doc
        .font(isMono ? mono(v, true) : 'text')
        .fontSize(9)
        .heightOfString(v, { width: cellW - 2 * PAD }),
    );
    const h = 10 + Math.max(...heights) + 2 * PAD;
    row.forEach(([k, v, isMono], i) => {
      const x = M.left + i * cellW;
      label(k, x + PAD, y + PAD, cellW - 2 * PAD);
      doc
        .font(isMono ? mono(v, true) : 'text')
        .fontSize(9)
        .fillColor(C.ink)
        .text(v, x + PAD, y + PAD + 10, { width: cellW - 2 * PAD });
      if (i > 0)
        doc
          .save()
          .moveTo(x, y)
          .lineTo(x, y + h)
          .lineWidth(0.5)
          .strokeColor(C.rule)
          .stroke()
          .restore();
    });
    y += h;
    hrule(y, C.rule);
  }
  hrule(y, C.ink, 1);
  doc
    .save()
    .rect(M.left, blockTop, CONTENT_W, y - blockTop)
    .lineWidth(1)
    .strokeColor(C.ink)
    .stroke()
    .restore();
  y += 10;

  // ── Caution (the product's safety caution) ─────────────────────────────────────────────────────────────────
  const cautionH =
    doc
      .font('text')
      .fontSize(8.5)
      .heightOfString(buildLogCaution, { width: CONTENT_W - 24 }) + 22;
  doc.save().rect(M.left, y, CONTENT_W, cautionH).fill(C.cautionSoft).restore();
  doc.save().rect(M.left, y, 3, cautionH).fill(C.caution).restore();
  label('Caution', M.left + 12, y + 6, CONTENT_W - 24, C.caution);
  doc
    .font('text')
    .fontSize(8.5)
    .fillColor(C.caution)
    .text(buildLogCaution, M.left + 12, y + 16, { width: CONTENT_W - 24 });
  y += cautionH + 14;

  // ── Summary: hours, who did the work, parts signed off, findings ─────────────────────────────────────────
  const room = (h: number) => {
    if (y + h > BOTTOM) {
      doc.addPage();
      y = M.top;
    }
  };
  const heading = (s: string) => {
    room(40);
    label(s, M.left, y, CONTENT_W, C.accent);
    y += 11;
  };
  const line = (s: string, color = C.ink, size = 8.5) => {
    const h = doc.font('text').fontSize(size).heightOfString(s, { width: CONTENT_W });
    room(h + 2);
    doc.font('text').fontSize(size).fillColor(color).text(s, M.left, y, { width: CONTENT_W });
    y += h + 2;
  };
  const { summary } = head;
  label('Summary', M.left, y, CONTENT_W, C.ink);
  y += 13;

  heading('Hours worked');
  const totalHours = summary.hours.reduce((n, h) => n + h.hours, 0);
  if (!summary.hours.length) line('No hours recorded.', C.soft);
  for (const h of summary.hours) line(`${whoWithHelp(h.who, h.by)}: ${hoursText(h.hours)}`);
  if (summary.hours.length) line(`In all: ${hoursText(totalHours)}`, C.ink);
  y += 6;

  heading('Fabrication and assembly (done steps, by whose work they were)');
  const fabCols: [string, number][] = [
    ['Part', 92],
    ...creditColumns.map((c) => [creditColumnLabels[c], 62] as [string, number]),
    ['Inspections', 52],
    ['Not done', 46],
    ['Builder’s share', 40],
  ];
  const fabRow = (cells: string[], bold = false) => {
    room(14);
    let cx = M.left;
    cells.forEach((c, i) => {
      doc
        .font(bold ? 'bold' : 'text')
        .fontSize(7.5)
        .fillColor(C.ink)
        .text(c, cx, y, { width: fabCols[i][1] - 4, align: i === 0 ? 'left' : 'right', lineBreak: false });
      cx += fabCols[i][1];
    });
    y += 11;
  };
  const counts = (c: FabricationCounts) => [
    ...creditColumns.map((k) => String(c.credited[k])),
    String(c.inspections),
    String(c.notDone),
    shareText(c.builderShare),
  ];
  fabRow(
    fabCols.map(([t]) => t),
    true,
  );
  hrule(y - 2, C.rule);
  for (const p of summary.fabrication.parts) fabRow([p.partNumber, ...counts(p)]);
  hrule(y - 2, C.rule);
  fabRow(['The build', ...counts(summary.fabrication.total)], true);
  line(fabricationCaution, C.caution, 7.5);
  y += 6;

  heading('Parts signed off');
  const live = summary.parts.filter((p) => !p.replaced);
  line(`${live.filter((p) => p.signedOffAt).length} of ${live.length} parts signed off.`);
  for (const p of summary.parts)
    line(
      `${p.partNumber} ${p.serial}: ${
        p.replaced
          ? 'replaced'
          : p.signedOffAt
            ? `signed off ${when(p.signedOffAt, opts.tz)}${p.signedOffByName ? ` by ${p.signedOffByName}` : ''}`
            : 'not signed off'
      }`,
      p.signedOffAt ? C.ink : C.soft,
    );
  y += 6;

  heading('Findings and how they closed');
  const open = summary.findings.filter((f) => f.status !== 'closed').length;
  line(
    summary.findingsTotal
      ? `${summary.findingsTotal} finding${summary.findingsTotal === 1 ? '' : 's'}${
          summary.findingsTotal > summary.findings.length ? ` (the first ${summary.findings.length} listed)` : ''
        }; ${open} of those listed still open.`
      : 'No findings.',
  );
  for (const f of summary.findings)
    line(
      `${f.partNumber} ${f.holeIds.join(', ')} · ${findingKindLabels[f.kind]} · raised ${when(f.raisedAt, opts.tz)} · ${
        f.closure ? `closed: ${findingClosureLabels[f.closure]}` : findingStatusLabels[f.status]
      }`,
    );
  y += 6;

  heading('Notices from the supplier and what was done');
  const answered = summary.notices.filter((n) => n.status === 'done' || n.status === 'not_applicable').length;
  line(
    summary.noticesTotal
      ? `${summary.noticesTotal} notice${summary.noticesTotal === 1 ? '' : 's'}${
          summary.noticesTotal > summary.notices.length ? ` (the first ${summary.notices.length} listed)` : ''
        }; ${answered} of those listed answered.`
      : 'No notices.',
  );
  for (const n of summary.notices) {
    const answer =
      n.status === 'done' || n.status === 'not_applicable'
        ? `${complianceStatusLabels[n.status].toLowerCase()} ${n.answeredAt ? when(n.answeredAt, opts.tz) : ''}${
            n.answeredByName ? ` by ${n.answeredByName}` : ''
          }: ${n.note ?? n.reason ?? ''}`
        : complianceStatusLabels[n.status].toLowerCase();
    line(
      `Notice ${n.number} (${noticeLevelLabels[n.level].toLowerCase()}), ${n.title} · issued ${when(n.issuedAt, opts.tz)} · ${answer}`,
      n.level === 'mandatory' && n.status !== 'done' && n.status !== 'not_applicable' ? C.caution : C.ink,
    );
  }
  y += 12;
  room(80);

  // ── The chronological list, oldest first ───────────────────────────────────────────────────────
  const x = {
    time: M.left,
    part: M.left + COLS.time,
    who: M.left + COLS.time + COLS.part,
    entry: M.left + COLS.time + COLS.part + COLS.who,
  };
  const tableHeader = () => {
    hrule(y, C.ink, 1);
    label('Time', x.time + PAD, y + 4, COLS.time - PAD);
    label('Part', x.part + PAD, y + 4, COLS.part - PAD);
    label('Who', x.who + PAD, y + 4, COLS.who - PAD);
    label('What happened', x.entry + PAD, y + 4, ENTRY_W - PAD);
    y += 15;
    hrule(y, C.ink, 0.75);
  };
  const newPage = () => {
    doc.addPage();
    y = M.top;
    tableHeader();
  };

  const entryParts = (e: BuildLogEntry) => {
    const w = ENTRY_W - 2 * PAD;
    const kindH = 9;
    const textH = doc.font('text').fontSize(9).heightOfString(e.text, { width: w });
    const note = e.note ? `“${e.note}”` : '';
    const noteH = note ? doc.font('italic').fontSize(9).heightOfString(note, { width: w }) + 2 : 0;
    const timing = timingNote(e, opts.tz) ?? '';
    const timingH = timing ? doc.font('text').fontSize(7.5).heightOfString(timing, { width: w }) + 2 : 0;
    const photos = e.photos ?? [];
    const perRow = Math.max(1, Math.floor((w + 4) / (THUMB + 4)));
    const photoH = photos.length ? Math.ceil(photos.length / perRow) * (THUMB + 4) + 2 : 0;
    const partH =
      doc
        .font(mono(e.partNumber, true))
        .fontSize(8.5)
        .heightOfString(e.partNumber, { width: COLS.part - 2 * PAD }) +
      doc
        .font(mono(e.travelerSerial))
        .fontSize(7)
        .heightOfString(e.travelerSerial, { width: COLS.part - 2 * PAD });
    const whoH =
      doc
        .font('text')
        .fontSize(8.5)
        .heightOfString(e.actorName, { width: COLS.who - 2 * PAD }) + 9;
    const h = Math.max(kindH + textH + noteH + timingH + photoH, partH, whoH) + 2 * PAD;
    return { note, timing, photos, perRow, h, w };
  };

  const drawEntry = (e: BuildLogEntry, thumbs: Thumbs) => {
    const p = entryParts(e);
    if (y + p.h > BOTTOM) newPage();
    const top = y + PAD;
    doc
      .font('mono')
      .fontSize(8.5)
      .fillColor(C.ink)
      .text(zonedDateTime(new Date(e.at), opts.tz).hm, x.time + PAD, top, { width: COLS.time - 2 * PAD });
    doc
      .font(mono(e.partNumber, true))
      .fontSize(8.5)
      .fillColor(C.ink)
      .text(e.partNumber, x.part + PAD, top, { width: COLS.part - 2 * PAD });
    doc
      .font(mono(e.travelerSerial))
      .fontSize(7)
      .fillColor(C.soft)
      .text(e.travelerSerial, x.part + PAD, doc.y, { width: COLS.part - 2 * PAD });
    doc
      .font('text')
      .fontSize(8.5)
      .fillColor(C.ink)
      .text(e.actorName, x.who + PAD, top, { width: COLS.who - 2 * PAD });
    doc
      .font('text')
      .fontSize(7)
      .fillColor(C.faint)
      .text(e.actorRole, x.who + PAD, doc.y, { width: COLS.who - 2 * PAD });

    label(
      buildLogKindLabels[e.kind],
      x.entry + PAD,
      top,
      p.w,
      e.group === 'findings' ? C.flag : e.group === 'sign_off' ? C.accent : C.soft,
    );
    doc
      .font('text')
      .fontSize(9)
      .fillColor(C.ink)
      .text(e.text, x.entry + PAD, top + 9, { width: p.w });
    if (p.note)
      doc
        .font('italic')
        .fontSize(9)
        .fillColor(C.soft)
        .text(p.note, x.entry + PAD, doc.y + 2, { width: p.w });
    if (p.timing)
      doc
        .font('text')
        .fontSize(7.5)
        .fillColor(clockIsOff(e.clockOffsetMs) ? C.flag : C.soft)
        .text(p.timing, x.entry + PAD, doc.y + 2, { width: p.w });
    if (p.photos.length) {
      const py = doc.y + 4;
      p.photos.forEach((ph, i) => {
        const px = x.entry + PAD + (i % p.perRow) * (THUMB + 4);
        const row = Math.floor(i / p.perRow) * (THUMB + 4);
        const bytes = thumbs.get(ph.id);
        let drawn = false;
        if (bytes) {
          try {
            doc.image(bytes, px, py + row, { fit: [THUMB, THUMB], align: 'center', valign: 'center' });
            drawn = true;
          } catch {
            /* not an image pdfkit reads: framed gap below */
          }
        }
        if (!drawn)
          doc
            .font('text')
            .fontSize(6)
            .fillColor(C.faint)
            .text('photo not available', px + 3, py + row + 14, { width: THUMB - 6, align: 'center' });
        doc
          .save()
          .rect(px, py + row, THUMB, THUMB)
          .lineWidth(0.5)
          .strokeColor(C.ruleStrong)
          .stroke()
          .restore();
      });
    }
    y += p.h;
    hrule(y, C.rule);
  };

  tableHeader();
  let day = '';
  let written = 0;
  return {
    detach() {
      attached = false;
      held = [];
      heldBytes = 0;
    },
    add(entries, thumbs) {
      for (const e of entries) {
        const d = zonedDateTime(new Date(e.at), opts.tz).date;
        if (d !== day) {
          // A day band never sits alone at the foot of a page.
          if (y + 18 + entryParts(e).h > BOTTOM) newPage();
          doc.save().rect(M.left, y, CONTENT_W, 17).fill(C.band).restore();
          doc
            .font('bold')
            .fontSize(9)
            .fillColor(C.ink)
            .text(longDay(d), M.left + PAD, y + 4, { width: CONTENT_W - 2 * PAD });
          y += 17;
          hrule(y, C.ruleStrong);
          day = d;
        }
        drawEntry(e, thumbs);
        written += 1;
      }
    },
    end() {
      if (!written) {
        doc
          .font('text')
          .fontSize(10)
          .fillColor(C.soft)
          .text('No entries match these filters.', M.left + PAD, y + 8, { width: CONTENT_W });
      } else {
        y += 8;
        if (y + 12 > BOTTOM) newPage();
        doc
          .font('text')
          .fontSize(8)
          .fillColor(C.faint)
          .text(`End of log: ${written} ${written === 1 ? 'entry' : 'entries'}.`, M.left, y, { width: CONTENT_W });
      }
      doc.end();
      return done;
    },
  };
}
