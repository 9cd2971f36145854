/** The mail telling a build's builders that a part's sign-off was taken back, and why. */

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function signOffWithdrawnMail(f: {
  to: string;
  kitSerial: string;
  partNumber: string;
  partName: string;
  letter: string;
  serial: string;
  actorName: string;
  reason: string;
  signedOffAt: Date | null;
  link: string;
}) {
  const what = 'Sign-off withdrawn: the part is open again';
  const subject = `[${f.kitSerial}] ${f.partNumber} rev ${f.letter} traveler ${f.serial}: ${what}`;
  const when = f.signedOffAt ? ` (signed off ${f.signedOffAt.toISOString().slice(0, 16).replace('T', ' ')} UTC)` : '';
  const lines = [
    what,
    `Part: ${f.partNumber} ${f.partName}, revision ${f.letter}, traveler ${f.serial} (kit ${f.kitSerial})${when}`,
    `By: ${f.actorName}`,
    `Why: ${f.reason}`,
    'The sign-off stays in the build log; this withdrawal is a new entry after it.',
  ];
  const text = [...lines, '', `Open the traveler: ${f.link}`].join('\n');
  const html = `<div style="font-family:sans-serif;color:#1b1a17">
<h2 style="margin:0 0 8px">${esc(what)}</h2>
<p><b>${esc(f.partNumber)}</b> ${esc(f.partName)} · rev ${esc(f.letter)} · traveler <code>${esc(f.serial)}</code> · kit <code>${esc(f.kitSerial)}</code>${esc(when)}</p>
<p>By ${esc(f.actorName)}: ${esc(f.reason)}</p>
<p>The sign-off stays in the build log; this withdrawal is a new entry after it.</p>
<p><a href="${esc(f.link)}">Open the traveler</a></p></div>`;
  return { to: f.to, subject, text, html };
}
