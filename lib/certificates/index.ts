// The certificates' public surface for the rest of the app.
export { checkCertificateAfterCourseWork, issueCertificateIfComplete } from "./issue";
export { learnerCertificatePath, verificationPath } from "./urls";
