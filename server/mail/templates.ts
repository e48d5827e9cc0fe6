import type { OutgoingMail } from './mailer';

const esc = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

interface Parts {
  to: string;
  subject: string;
  /** Paragraphs of plain text. */
  lines: string[];
  action: { label: string; url: string };
  /** Footer that says why this arrived and how to stop it. */
  footer: string;
  settingsUrl?: string;
}

function render(p: Parts): OutgoingMail {
  const text = [...p.lines, `${p.action.label}: ${p.action.url}`, '', '--', p.footer].join('\n\n');
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1c2430;max-width:560px">
${p.lines.map((l) => `<p>${esc(l).replace(/\n/g, '<br>')}</p>`).join('\n')}
<p><a href="${esc(p.action.url)}" style="display:inline-block;padding:8px 14px;background:#0f5f73;color:#fff;border-radius:6px;text-decoration:none">${esc(p.action.label)}</a></p>
<p style="font-size:12px;color:#5b6673">${esc(p.footer)}</p>
</body></html>`;
  return {
    to: p.to,
    subject: p.subject,
    text,
    html,
    headers: p.settingsUrl ? { 'List-Unsubscribe': `<${p.settingsUrl}>` } : undefined,
  };
}

export interface Links {
  publicUrl: string;
}

/** The page where an invite is read and accepted; the token is the only key to it. */
export const inviteUrl = (l: Links, token: string) => `${l.publicUrl}/invite/${token}`;

export const inviteMail = (
  l: Links,
  a: {
    to: string;
    teamName: string;
    role: string;
    invitedBy: string;
    token: string;
    expiresAt: Date;
  },
) =>
  render({
    to: a.to,
    subject: `${a.invitedBy} invited you to ${a.teamName} on Hoverprint`,
    lines: [
      `${a.invitedBy} invited you to join the team "${a.teamName}" as ${a.role}.`,
      `The link works once and expires on ${a.expiresAt.toUTCString()}. If you do not have an account yet, you can create one from the link.`,
    ],
    action: { label: 'Join the team', url: inviteUrl(l, a.token) },
    footer:
      'You received this because someone entered your address in a team invitation. Ignore it if you were not expecting it.',
  });

export const resetMail = (
  l: Links,
  a: { to: string; name: string; token: string; expiresAt: Date },
) =>
  render({
    to: a.to,
    subject: 'Reset your Hoverprint password',
    lines: [
      `Hello ${a.name},`,
      `Someone asked to reset the password of this Hoverprint account. The link works once and expires at ${a.expiresAt.toUTCString()}. Setting a new password signs out every device.`,
    ],
    action: { label: 'Choose a new password', url: `${l.publicUrl}/reset/${a.token}` },
    footer: 'If you did not ask for this, ignore this message: your password stays as it is.',
  });

const flightUrl = (l: Links, flightId: string, commentId?: string) =>
  `${l.publicUrl}/flights/${flightId}${commentId ? `?comment=${commentId}` : ''}`;

const fmtT = (tS: number) => `${Math.floor(tS / 60)}:${(tS % 60).toFixed(1).padStart(4, '0')}`;

export type CommentMailKind = 'comment-on-flight' | 'reply' | 'mention';

export const commentMail = (
  l: Links,
  a: {
    kind: CommentMailKind;
    to: string;
    author: string;
    flightName: string;
    flightId: string;
    commentId: string;
    tS: number;
    body: string;
  },
) => {
  const what =
    a.kind === 'mention'
      ? `${a.author} mentioned you on ${a.flightName} at ${fmtT(a.tS)}:`
      : a.kind === 'reply'
        ? `${a.author} replied to your comment on ${a.flightName} at ${fmtT(a.tS)}:`
        : `${a.author} commented on your flight ${a.flightName} at ${fmtT(a.tS)}:`;
  const subject =
    a.kind === 'mention'
      ? `${a.author} mentioned you on ${a.flightName}`
      : a.kind === 'reply'
        ? `${a.author} replied on ${a.flightName}`
        : `New comment on ${a.flightName}`;
  const settingsUrl = `${l.publicUrl}/account`;
  return render({
    to: a.to,
    subject,
    lines: [what, a.body],
    action: { label: 'Open the review', url: flightUrl(l, a.flightId, a.commentId) },
    footer:
      a.kind === 'mention'
        ? 'You received this because a team member mentioned you.'
        : `You receive comment mail because it is on in your settings. Turn it off at ${settingsUrl}`,
    settingsUrl: a.kind === 'mention' ? undefined : settingsUrl,
  });
};

export const reviewRequestMail = (
  l: Links,
  a: { to: string; from: string; flightName: string; flightId: string; note?: string },
) =>
  render({
    to: a.to,
    subject: `${a.from} asks you to review ${a.flightName}`,
    lines: [
      `${a.from} asks you to review the flight ${a.flightName}.`,
      ...(a.note ? [a.note] : []),
    ],
    action: { label: 'Review the flight', url: flightUrl(l, a.flightId) },
    footer: 'You received this because a team member asked for your review.',
  });

export const reviewDoneMail = (
  l: Links,
  a: {
    to: string;
    by: string;
    state: 'reviewed' | 'changes-requested';
    flightName: string;
    flightId: string;
    note?: string;
  },
) =>
  render({
    to: a.to,
    subject:
      a.state === 'reviewed'
        ? `${a.by} reviewed ${a.flightName}`
        : `${a.by} requests changes on ${a.flightName}`,
    lines: [
      a.state === 'reviewed'
        ? `${a.by} marked ${a.flightName} as reviewed.`
        : `${a.by} requests changes after reviewing ${a.flightName}. Findings are advice, not an airworthiness sign-off: check the aircraft on the bench with props off before the next flight.`,
      ...(a.note ? [a.note] : []),
    ],
    action: { label: 'Open the review', url: flightUrl(l, a.flightId) },
    footer: 'You received this because you asked for this review.',
  });
