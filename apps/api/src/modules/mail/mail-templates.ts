import { DEFAULT_TIME_ZONE, formatUkDateTime, roleLabels, zoneLabel, type Role } from '@heatfleet/domain';

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

function escapeHtml(s: string): string {
  return s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );
}

function layout(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('\n');
  return `<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">
${body}
<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>
<p style="color:#555">Heatfleet</p></body></html>`;
}

export function invitationEmail(p: {
  firmName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
  /** The firm's zone, so "expires on 10 Dec 2026, 14:05" is the time on the firm's clocks. */
  timeZone?: string;
}): RenderedEmail {
  const lines = [
    `${p.inviterName} has invited you to join ${p.firmName} on Heatfleet as ${roleLabels[p.role]}.`,
    `The link works once and expires on ${formatUkDateTime(p.expiresAt, p.timeZone ?? DEFAULT_TIME_ZONE)} (${zoneLabel(p.timeZone ?? DEFAULT_TIME_ZONE)}).`,
    'If you were not expecting this, you can ignore this e-mail.',
  ];
  return {
    subject: `You are invited to join ${p.firmName} on Heatfleet`,
    text: `${lines.join('\n\n')}\n\nAccept the invitation: ${p.link}\n`,
    html: layout(lines, { href: p.link, label: 'Accept the invitation' }),
  };
}

export function passwordResetEmail(p: { name: string; link: string }): RenderedEmail {
  const lines = [
    `Hello ${p.name},`,
    'Someone asked to reset your Heatfleet password. The link below works once and expires in one hour.',
    'If it was not you, ignore this e-mail: your password stays as it is.',
  ];
  return {
    subject: 'Reset your Heatfleet password',
    text: `${lines.join('\n\n')}\n\nChoose a new password: ${p.link}\n`,
    html: layout(lines, { href: p.link, label: 'Choose a new password' }),
  };
}

export function signUpConfirmEmail(p: { name: string; firmName: string; link: string }): RenderedEmail {
  const lines = [
    `Hello ${p.name},`,
    `To finish creating ${p.firmName} on Heatfleet, open the link below. It works once, for 24 hours.`,
    'If you did not ask for this, ignore this e-mail: nothing is created without the link.',
  ];
  return {
    subject: 'Finish creating your firm on Heatfleet',
    text: `${lines.join('\n\n')}\n\nCreate the firm: ${p.link}\n`,
    html: layout(lines, { href: p.link, label: 'Create the firm' }),
  };
}

/** Sent instead of a confirmation when the address already has an account: the sign-up page says nothing of it. */
export function signUpExistingAccountEmail(p: { name: string; link: string }): RenderedEmail {
  const lines = [
    `Hello ${p.name},`,
    'Someone tried to create a firm on Heatfleet with your e-mail address, which already has an account.',
    'If it was you, sign in and create the new firm from your account (the firm menu has "Create another firm"). If it was not you, ignore this e-mail: nothing was changed and nobody was signed in.',
  ];
  return {
    subject: 'Someone tried to create a firm with your address',
    text: `${lines.join('\n\n')}\n\nSign in: ${p.link}\n`,
    html: layout(lines, { href: p.link, label: 'Sign in to Heatfleet' }),
  };
}
