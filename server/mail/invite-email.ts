/**
 * The e-mail that invites someone into a sightline's crew: plain text and HTML in the app's red
 * night look, one column that reads on a phone.
 */
import type { CrewRole } from '../../shared/policy/sightline-policy';
import { escapeHtml } from '../../shared/html';

export interface InviteEmailInput {
  inviterName: string;
  sightlineName: string;
  role: CrewRole;
  link: string;
  expiresAt: Date;
}

export interface RenderedInviteEmail {
  subject: string;
  text: string;
  html: string;
}

const ROLE_TEXT: Record<CrewRole, string> = {
  editor: 'an editor: you can change the plan (pins, tide times, photos) and add field notes',
  viewer: 'a viewer: you can see the whole plan, add field notes and answer outings',
};

/** Renders the invite; the link is single-use and expires at `expiresAt`. */
export function renderInviteEmail(input: InviteEmailInput): RenderedInviteEmail {
  const expires = input.expiresAt.toISOString().slice(0, 10);
  const subject = `${input.inviterName} invites you to plan “${input.sightlineName}” on Gnomon`;
  const text = [
    `${input.inviterName} invites you into the crew of the sightline “${input.sightlineName}” on Gnomon, as ${ROLE_TEXT[input.role]}.`,
    '',
    `Accept the invite: ${input.link}`,
    '',
    `The link works once, for this e-mail address, until ${expires}. If you have no Gnomon account yet, you can create one from the link.`,
    'If you did not expect this, ignore this e-mail.',
  ].join('\n');
  const html = `<!doctype html><html><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(subject)}</title></head>
<body style="margin:0;padding:0;background:#000000;color:#e0442f;font-family:Inter,Arial,sans-serif;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:#000000;"><tr><td align="center" style="padding:16px 8px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:560px;background:#0c0201;border:1px solid #3a120c;border-radius:8px;">
<tr><td style="padding:18px 18px 8px 18px;"><h1 style="margin:0;font-size:21px;line-height:1.3;font-weight:600;">${escapeHtml(input.inviterName)} invites you to plan “${escapeHtml(input.sightlineName)}”</h1></td></tr>
<tr><td style="padding:4px 18px 12px 18px;font-size:15px;line-height:1.5;">You are invited as ${escapeHtml(ROLE_TEXT[input.role])}.</td></tr>
<tr><td align="center" style="padding:8px 18px 16px 18px;"><a href="${escapeHtml(input.link)}" style="display:inline-block;background:#c4321f;color:#000000;text-decoration:none;font-weight:600;padding:12px 20px;border-radius:6px;">Accept the invite</a></td></tr>
<tr><td style="padding:0 18px 18px 18px;font-size:13px;line-height:1.5;color:#a8301f;">The link works once, for this e-mail address, until ${escapeHtml(expires)}. No account yet? You can create one from the link. If you did not expect this, ignore this e-mail.</td></tr>
</table></td></tr></table></body></html>`;
  return { subject, text, html };
}
