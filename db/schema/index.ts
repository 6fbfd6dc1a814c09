export * from "./schools";
export * from "./users";
export * from "./sessions";
export * from "./cohorts";
export * from "./invitations";
export * from "./password-resets";
export * from "./sign-in-attempts";
export * from "./course";
