// What a person is told when an e-mailed link cannot be used, and what they can do next.

export const invitationProblems = {
  unknown: "This invitation link is not valid. Check that you opened the whole link from the e-mail.",
  expired: "This invitation has expired. Ask your school's Edgewise admin to send a new one.",
  used: "This invitation has already been used. Sign in with the password you chose.",
  revoked: "This invitation was replaced by a newer one. Use the link in the most recent e-mail.",
  "already-registered": "An account with this e-mail address already exists. Sign in instead.",
} as const;

export const passwordResetProblems = {
  unknown: "This reset link is not valid. Check that you opened the whole link from the e-mail.",
  expired: "This reset link has expired. Ask for a new one below.",
  used: "This reset link has already been used. Ask for a new one if you still need it.",
} as const;
