import { noticeLevelLabels, type NoticeLevel } from '../../db/contracts';

/** The mail telling one person on one or more builds that a supplier's notice reached them. */

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function noticeMail(f: {
  to: string;
  number: number;
  title: string;
  level: NoticeLevel;
  body: string;
  kitName: string;
  supplierName: string;
  reached: { kitSerial: string; parts: string[] }[];
  link: string;
}) {
  const level = noticeLevelLabels[f.level];
  const kits = f.reached.map((r) => r.kitSerial).join(', ');
  const subject = `[${kits}] Notice ${f.number} (${level.toLowerCase()}): ${f.title}`;
  const where = f.reached.map(
    (r) => `Kit ${r.kitSerial}: ${r.parts.length ? `parts ${r.parts.join(', ')}` : 'the kit as a whole'}`,
  );
  const ask =
    f.level === 'information'
      ? 'Acknowledge it on the build.'
      : 'Acknowledge it on the build, then record what was done (with a photo) or why it does not apply.';
  const text = [
    `Notice ${f.number} from ${f.supplierName}, ${f.kitName}: ${level}`,
    f.title,
    '',
    f.body,
    '',
    ...where,
    ask,
    '',
    `Open the notice: ${f.link}`,
  ].join('\n');
  const html = `<div style="font-family:sans-serif;color:#1b1a17">
<p style="margin:0">${esc(`Notice ${f.number} from ${f.supplierName}, ${f.kitName}`)} · <b>${esc(level)}</b></p>
<h2 style="margin:4px 0 8px">${esc(f.title)}</h2>
<p style="white-space:pre-wrap">${esc(f.body)}</p>
<ul>${where.map((w) => `<li>${esc(w)}</li>`).join('')}</ul>
<p>${esc(ask)}</p>
<p><a href="${esc(f.link)}">Open the notice</a></p></div>`;
  return { to: f.to, subject, text, html };
}
