import "server-only";
import { issueCertificateOnce, type IssueResult } from "@/db/queries/certificates";
import { getCourse } from "@/lessons";
import { readAppEnv } from "@/lib/env";
import { sendCertificateReadyEmail } from "@/lib/mail/certificate-ready";
import { courseCertification } from "./certification";
import { generateCertificateCode } from "./code";
import { evaluateCompletion } from "./completion";
import { learnerCertificatePath, verificationUrl } from "./urls";

/**
 * Issues the learner's certificate for the course once they meet its completion rule; safe to call
 * at any time and any number of times. Only the call that creates the certificate sends the e-mail,
 * and a mail failure does not undo the certificate (the learner's page shows it either way).
 */
export async function issueCertificateIfComplete(params: { userId: string }): Promise<IssueResult> {
  const course = getCourse();
  const result = await issueCertificateOnce({
    userId: params.userId,
    courseSlug: course.slug,
    decide: (facts) => {
      if (facts.learner.role !== "learner" || !facts.learner.active) return null;
      const status = evaluateCompletion(course, facts);
      if (!status.summary) return null;
      return {
        code: generateCertificateCode(),
        learnerName: facts.learner.name,
        courseTitle: course.title,
        schoolName: facts.learner.schoolName,
        cohortName: facts.cohort?.name ?? null,
        scoreSummary: status.summary,
        // Frozen into the certificate: what it certifies and who signed for the school on the day.
        certification: courseCertification(course),
        signatoryName: facts.learner.schoolSignatoryName,
        signatoryRole: facts.learner.schoolSignatoryRole,
      };
    },
  });
  if (result.status === "issued") {
    const { certificate } = result;
    const appUrl = readAppEnv().APP_URL;
    await sendCertificateReadyEmail({
      schoolId: certificate.schoolId,
      to: result.learnerEmail,
      learnerName: certificate.learnerName,
      courseTitle: certificate.courseTitle,
      schoolName: certificate.schoolName,
      certificateUrl: `${appUrl}${learnerCertificatePath}`,
      verificationUrl: verificationUrl(appUrl, certificate.code),
    }).catch((error: unknown) => console.error(`Could not e-mail certificate ${certificate.id} to its learner`, error));
  }
  return result;
}

/**
 * For the places where course work is recorded (a passing lab attempt, an accepted bench review):
 * checks for a certificate after the work is stored, and never lets a failure here reach that
 * caller. The learner's certificate page checks again on every visit, so nothing is lost.
 */
export async function checkCertificateAfterCourseWork(params: { userId: string }): Promise<void> {
  await issueCertificateIfComplete(params).catch((error: unknown) =>
    console.error(`Could not check learner ${params.userId} for a certificate`, error),
  );
}
