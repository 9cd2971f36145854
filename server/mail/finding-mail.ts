import {
  dispositionLabels,
  findingKindLabels,
  findingStatusLabels,
  repairSchemeLabels,
  type Disposition,
  type FindingEventAction,
  type FindingKind,
  type FindingStatus,
  type RepairRecord,
} from '../../db/contracts';

export type FindingMailFacts = {
  findingId: string;
  action: FindingEventAction;
  toStatus: FindingStatus;
  disposition: Disposition | null;
  note: string;
  actorName: string;
  partNumber: string;
  partName: string;
  letter: string;
  serial: string;
  kitSerial: string;
  holeIds: string[];
  kind: FindingKind;
  repair: RepairRecord | null;
  link: string;
  thumbnail: Buffer | null;
};

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** The headline of each step of a finding's life, in the words the reader acts on. */
function headline(f: FindingMailFacts): string {
  const d = f.disposition ? dispositionLabels[f.disposition] : '';
  switch (f.action) {
    case 'raise':
      return `Finding raised: ${findingKindLabels[f.kind]}`;
    case 'disposition':
      return f.toStatus === 'awaiting_approval'
        ? `${d}: your approval as design authority is asked`
        : `Disposition: ${d}`;
    case 'amend':
      return f.toStatus === 'awaiting_approval'
        ? `Disposition amended to ${d}: your approval is asked`
        : `Disposition amended: ${d}`;
    case 'not-a-defect':
      return 'Not a defect: finding closed';
    case 'approve':
      return `${d} approved by the design authority`;
    case 'refuse':
      return 'Disposition refused by the design authority: decide again';
    case 'report-done':
      return `${d} done: to inspect`;
    case 'accept':
      return 'Work accepted: finding closed';
    case 'send-back':
      return 'Work sent back: do it again';
    case 'part-replaced':
      return findingStatusLabels[f.toStatus];
  }
}

/**
 * The Content-ID the photo is attached under and the HTML names it by. Many mail clients hide a data:
 * image, but show an inline part named by cid:; the finding's id keeps it unique, as RFC 2392 asks.
 */
export const holePhotoCid = (findingId: string) => `hole-${findingId}@pitchcard`;

/** The message for one step of a finding's life, for whoever must act next. */
export function findingMail(f: FindingMailFacts) {
  const cid = holePhotoCid(f.findingId);
  const holes = f.holeIds.join(', ');
  const what = headline(f);
  const subject = `[${f.kitSerial}] ${f.partNumber} rev ${f.letter} hole ${holes}: ${what}`;
  const repair = f.repair
    ? [
        `Repair: ${repairSchemeLabels[f.repair.scheme]}${f.repair.rivetSpec ? ` (${f.repair.rivetSpec})` : ''}`,
        ...(f.repair.check
          ? [`Repair check: ${f.repair.check.pass ? 'passes' : `fails: ${f.repair.check.reasons.join('; ')}`}`]
          : []),
        ...(f.repair.overrideReason ? [`Chosen anyway because: ${f.repair.overrideReason}`] : []),
      ]
    : [];
  const lines = [
    what,
    `Part: ${f.partNumber} ${f.partName}, revision ${f.letter}, traveler ${f.serial} (kit ${f.kitSerial})`,
    `Hole: ${holes}`,
    `Kind: ${findingKindLabels[f.kind]}`,
    `By: ${f.actorName}`,
    ...(f.note ? [`Note: ${f.note}`] : []),
    ...(f.action === 'disposition' || f.action === 'amend' ? repair : []),
    '',
    `Open the finding: ${f.link}`,
  ];
  const html = `<div style="font-family:sans-serif;color:#1b1a17">
<h2 style="margin:0 0 8px">${esc(what)}</h2>
<p><b>${esc(f.partNumber)}</b> ${esc(f.partName)} · rev ${esc(f.letter)} · traveler <code>${esc(f.serial)}</code> · kit <code>${esc(f.kitSerial)}</code></p>
<p>Hole <code>${esc(holes)}</code> — ${esc(findingKindLabels[f.kind])}, by ${esc(f.actorName)}</p>
${f.note ? `<p>${esc(f.note)}</p>` : ''}
${f.action === 'disposition' || f.action === 'amend' ? repair.map((l) => `<p>${esc(l)}</p>`).join('\n') : ''}
${f.thumbnail ? `<p><img src="cid:${esc(cid)}" alt="photo of the hole" width="240"></p>` : ''}
<p><a href="${esc(f.link)}">Open the finding</a></p></div>`;
  return {
    subject,
    text: lines.join('\n'),
    html,
    // contentDisposition inline: shown in the text where the HTML names it, not listed as a file to open.
    attachments: f.thumbnail
      ? [
          {
            filename: 'hole.jpg',
            content: f.thumbnail,
            cid,
            contentType: 'image/jpeg',
            contentDisposition: 'inline' as const,
          },
        ]
      : [],
  };
}
