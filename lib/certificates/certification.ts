import type { Certificate, CertificateCertification } from "@/db/schema";
import type { Course } from "@/lessons";

/**
 * What a certificate of the course certifies, derived from the course itself: its competences
 * (lessons/course.ts, each tied to the labs and bench exercises that show it) and the hours of
 * study, the lessons' and bench exercises' own minutes added up and rounded to the half hour.
 */
export function courseCertification(course: Course): CertificateCertification {
  const minutes = course.lessons.reduce((sum, lesson) => sum + lesson.minutes + (lesson.bench?.minutes ?? 0), 0);
  return {
    competences: course.competences.map((competence) => competence.statement),
    studyHours: Math.round(minutes / 30) / 2,
  };
}

/**
 * What a certificate states: what was stored when it was issued. Certificates issued before they
 * stated it carry none; theirs is the course's, whose competences and hours they were earned on.
 */
export function certificationOf(certificate: Pick<Certificate, "certification">, course: Course): CertificateCertification {
  return certificate.certification ?? courseCertification(course);
}

export function formatStudyHours(hours: number): string {
  return `${hours.toLocaleString("en-GB")} hour${hours === 1 ? "" : "s"} of study`;
}
