import type { Disposition, FindingKind, FindingStatus } from '../../db/contracts';
import { dispositionLabels, findingKindLabels, findingStatusLabels } from '../../db/contracts';

export type FindingMailFacts = {
  findingId: string; toStatus: FindingStatus; disposition: Disposition | null; note: string; actorName: string;
  partNumber: string; partName: string; letter: string; serial: string; kitSerial: string; holeIds: string[]; kind: FindingKind;
  link: string; thumbnail: Buffer | null;
};

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** The message for one step of a finding's life, for whoever must act next. */
export function findingMail(f: FindingMailFacts) {
  const holes = f.holeIds.join(', ');
  const what = f.toStatus === 'flagged'
    ? `Suspect hole flagged: ${findingKindLabels[f.kind]}`
    : f.disposition && f.toStatus !== 'rework_done' && f.toStatus !== 'closed'
      ? `Disposition: ${dispositionLabels[f.disposition]}`
      : findingStatusLabels[f.toStatus];
  const subject = `[${f.kitSerial}] ${f.partNumber} rev ${f.letter} hole ${holes}: ${what}`;
  const lines = [
    `${what}`,
    `Part: ${f.partNumber} ${f.partName}, revision ${f.letter}, traveler ${f.serial} (kit ${f.kitSerial})`,
    `Hole: ${holes}`,
    `Kind: ${findingKindLabels[f.kind]}`,
    `By: ${f.actorName}`,
    ...(f.note ? [`Note: ${f.note}`] : []),
    '',
    `Open the finding: ${f.link}`,
  ];
  const html = `<div style="font-family:sans-serif;color:#1b1a17">
<h2 style="margin:0 0 8px">${esc(what)}</h2>
<p><b>${esc(f.partNumber)}</b> ${esc(f.partName)} · rev ${esc(f.letter)} · traveler <code>${esc(f.serial)}</code> · kit <code>${esc(f.kitSerial)}</code></p>
<p>Hole <code>${esc(holes)}</code> — ${esc(findingKindLabels[f.kind])}, by ${esc(f.actorName)}</p>
${f.note ? `<p>${esc(f.note)}</p>` : ''}
${f.thumbnail ? '<p><img src="cid:thumb" alt="photo of the hole" width="240"></p>' : ''}
<p><a href="${esc(f.link)}">Open the finding</a></p></div>`;
  return {
    subject, text: lines.join('\n'), html,
    attachments: f.thumbnail ? [{ filename: 'hole.jpg', content: f.thumbnail, cid: 'thumb', contentType: 'image/jpeg' }] : [],
  };
}
