// Invitation settings shared by the server and the manager's form (pure).

/** How long an invitation link works (common practice for account invitations: about a week). */
export const INVITATION_DAYS = 7;
