// The school admin's side of enrolment: cohorts' people, CSV rosters and invitation links.
export type { Actor } from "./actor";
export { cohortInputSchema, courseOptions, type CohortInput } from "./cohort-input";
export { classifyRoster, countRoster, type ClassifiedRow, type RosterCounts, type RowStatus } from "./classify-roster";
export { parseRosterCsv, type RosterEntry } from "./roster-csv";
export { maxRosterFileBytes, rosterFileLimitLabel, readRosterFile } from "./roster-file";
export { enrolLearner, type EnrolLearnerResult } from "./enrol-learner";
export { importRoster, previewRoster, type ImportResult, type PreviewResult, type RosterPreview } from "./import-roster";
export { resendInvitation, resendWaitingInvitations, revokeInvitationLink } from "./manage-invitations";
export { deactivateLearner, reactivateLearner } from "./learner-access";
export { buildRoster, countRosterStates, filterRoster, rosterStateLabels, type RosterLine, type RosterState } from "./roster-status";
export { describeUnsent, isMailDeliveryError, sendInvitationLetters, type LetterOutcome } from "./send-invitations";
