import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { courseCertification } from "@/lib/certificates/certification";
import { evaluateCompletion } from "@/lib/certificates/completion";
import { renderCertificatePdf, type CertificateDocument } from "@/lib/certificates/pdf/render-certificate";
import { readCertificatePdf } from "./read-certificate-pdf";

const course = getCourse();
const summary = evaluateCompletion(course, {
  bestPassingScores: new Map(course.completion.labs.map(({ lab }, i) => [lab, 71 + i * 3])),
  acceptedBenchWork: new Map(course.completion.benchExercises.map((slug) => [slug, { points: 8, maxPoints: 9 }])),
}).summary!;

const certificate: CertificateDocument = {
  code: "7K2MQX9P4TDW8HBN",
  learnerName: "Priya Castellanos",
  courseTitle: course.title,
  schoolName: "Fernhallow Trades College",
  cohortName: "Data lines — January evenings",
  issuedAt: new Date("2026-03-12T15:20:00Z"),
  scoreSummary: summary,
  certification: courseCertification(course),
  signatory: { name: "Noor Whitcombe", role: "Head of the electrical department" },
};
const url = "https://edgewise.example.test/c/7K2M-QX9P-4TDW-8HBN";

// The first render decodes the typeface files, which takes seconds on a busy machine.
describe("the certificate PDF", { timeout: 60_000 }, () => {
  it("is one landscape A4 page whose real text names the learner, course, school, date, results and code", async () => {
    const read = await readCertificatePdf(await renderCertificatePdf(certificate, url));
    expect(read.pageCount).toBe(1);
    // A4 is 210 × 297 mm = 595.28 × 841.89 pt (ISO 216); landscape puts the long side across.
    expect(read.pageSize[0]).toBeCloseTo(841.89, 1);
    expect(read.pageSize[1]).toBeCloseTo(595.28, 1);
    for (const expected of [
      "Priya Castellanos",
      "Data runs that work",
      "FERNHALLOW TRADES COLLEGE",
      "Data lines — January evenings",
      "12 March 2026",
      "7K2M-QX9P-4TDW-8HBN",
      url,
    ]) {
      expect(read.text).toContain(expected);
    }
    const average = (71 + 74 + 77 + 80 + 83 + 86 + 89 + 92) / 8;
    expect(read.text).toContain(`${average} / 100`);
    expect(read.text).toContain("92 / 100");
  });

  it("states what the course certifies, the hours of study and who signed for the school", async () => {
    const read = await readCertificatePdf(await renderCertificatePdf(certificate, url));
    const lessonMinutes = course.lessons.reduce((sum, lesson) => sum + lesson.minutes + (lesson.bench?.minutes ?? 0), 0);
    expect(course.competences.length).toBeGreaterThanOrEqual(3);
    for (const competence of course.competences) expect(read.text).toContain(competence.statement);
    expect(read.text).toContain(`${Math.round(lessonMinutes / 30) / 2} hours of study`);
    expect(read.text).toContain("Noor Whitcombe");
    expect(read.text).toContain("Head of the electrical department");

    const unsigned = await readCertificatePdf(await renderCertificatePdf({ ...certificate, signatory: null }, url));
    expect(unsigned.text).not.toContain("Signed for the school");
    expect(unsigned.pageCount).toBe(1);
  });

  it("is set in the app's own typeface, embedded, and its QR code opens the verification address", async () => {
    const read = await readCertificatePdf(await renderCertificatePdf(certificate, url));
    expect(read.fontNames.length).toBeGreaterThan(0);
    for (const name of read.fontNames) expect(name).toMatch(/^\/[A-Z]{6}\+Inter.*\(embedded\)$|^\/Inter.*\(embedded\)$/);
    expect(read.qrText).toBe(url);
  });

  it("draws names outside Latin from the other script files of the same typeface", async () => {
    const name = "Zoë Łukasiewicz-Дмитриева";
    const read = await readCertificatePdf(await renderCertificatePdf({ ...certificate, learnerName: name }, url));
    expect(read.text).toContain(name);
    expect(read.fontNames.length).toBe(3);
  });
});
