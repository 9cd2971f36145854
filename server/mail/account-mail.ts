import { memberPlaceLabels, roleLabels, type MemberPlace, type Role } from '../../db/contracts';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function message(to: string, subject: string, lines: string[], link: string, linkText: string) {
  const text = [...lines, '', `${linkText}: ${link}`].join('\n');
  const html = `<div style="font-family:sans-serif;color:#1b1a17">${lines.map((l) => `<p>${esc(l)}</p>`).join('\n')}
<p><a href="${esc(link)}">${esc(linkText)}</a></p></div>`;
  return { to, subject, text, html };
}

/** The invitation: who asks, to what, and the one-time link where the person sets their own password. */
export function invitationMail(f: {
  to: string;
  name: string;
  role: Role;
  invitedByName: string;
  organizationName: string | null;
  build: { kitSerial: string; kitName: string; place: MemberPlace } | null;
  link: string;
  expiresAt: Date;
}) {
  const what = f.build
    ? `${f.invitedByName} adds you to build ${f.build.kitSerial} (${f.build.kitName}) as ${memberPlaceLabels[f.build.place].toLowerCase()}.`
    : `${f.invitedByName} invites you to Pitchcard as ${roleLabels[f.role].toLowerCase()}${f.organizationName ? ` of ${f.organizationName}` : ''}.`;
  return message(
    f.to,
    f.build ? `You are invited to build ${f.build.kitSerial} on Pitchcard` : 'You are invited to Pitchcard',
    [
      `Hello ${f.name},`,
      what,
      `Open the link to set your own password. It works once and until ${f.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC.`,
    ],
    f.link,
    'Set your password and join',
  );
}

export function resetMail(f: { to: string; name: string; link: string; minutes: number }) {
  return message(
    f.to,
    'Set a new Pitchcard password',
    [
      `Hello ${f.name},`,
      `Someone (we hope you) asked to set a new password for this address. The link works once, for ${f.minutes} minutes.`,
      'If it was not you, do nothing: your password stays as it is.',
    ],
    f.link,
    'Set a new password',
  );
}
