/**
 * Limits on what one person or team can make the server send or keep, so an account cannot be
 * used to spam. They are documented in the README's security notes; change both together.
 */
export const limits = {
  /** Invitations one person may send per hour (across all their teams). */
  invitesPerInviterPerHour: 20,
  /** Invitations sent from one team per hour, by all of its owners together. */
  invitesPerTeamPerHour: 30,
  /** Invitations a team may have open (sent, not yet used, withdrawn or expired) at once. */
  openInvitesPerTeam: 50,
  /** Mention mails one person's comments may cause per hour; later mentions are kept unmailed. */
  mentionMailsPerPersonPerHour: 30,
  /** Review-request mails one person may cause per hour; more answers 429. */
  reviewRequestMailsPerPersonPerHour: 20,
} as const;

export const HOUR_MS = 60 * 60 * 1000;
