export { DRAFT_ANSWER_MAX, labDraftSchemaFor, openingDraft, scenarioDraft, type LabDraft } from "./draft";
