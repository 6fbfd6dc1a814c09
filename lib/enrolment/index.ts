// The school admin's side of enrolment: cohorts' people, CSV rosters and invitation links. The
// pure parts (CSV reading, row classification, roster states) are also imported by path from
// client components, which must not pull in the database.
export type { Actor } from "./actor";
export { cohortInputSchema, courseOptions } from "./cohort-input";
export { enrolLearner, type EnrolLearnerResult } from "./enrol-learner";
export { importRoster, previewRoster, type RosterPreview } from "./import-roster";
export { resendInvitation, resendWaitingInvitations, revokeInvitationLink } from "./manage-invitations";
export { deactivateLearner, reactivateLearner } from "./learner-access";
export { buildRoster, countRosterStates, filterRoster, rosterStateLabels, type RosterLine, type RosterState } from "./roster-status";
export { describeUnsent, isMailDeliveryError } from "./send-invitations";
