import { PDFDocument, PageSizes, rgb, type PDFPage } from "pdf-lib";
import QRCode from "qrcode";
import type { CertificateCertification, CertificateScoreSummary } from "@/db/schema";
import { formatStudyHours } from "../certification";
import { formatCertificateCode } from "../code";
import { formatCertificateDate } from "../dates";
import { CertificateText } from "../fonts/certificate-fonts";
import type { Signatory } from "../signatory";

export type CertificateDocument = {
  code: string;
  learnerName: string;
  courseTitle: string;
  schoolName: string;
  cohortName: string | null;
  issuedAt: Date;
  scoreSummary: CertificateScoreSummary;
  certification: CertificateCertification;
  /** Who signed for the school when it was issued; none on certificates issued before the school named one. */
  signatory: Signatory | null;
};

// The app's palette (app/globals.css), so the paper matches the pages it came from.
const colours = {
  ink: rgb(0x1c / 255, 0x25 / 255, 0x29 / 255),
  inkSoft: rgb(0x4a / 255, 0x55 / 255, 0x5c / 255),
  inkFaint: rgb(0x6b / 255, 0x75 / 255, 0x7b / 255),
  accent: rgb(0x1d / 255, 0x5c / 255, 0x63 / 255),
  accentSoft: rgb(0xe2 / 255, 0xee / 255, 0xed / 255),
  copper: rgb(0xb0 / 255, 0x5f / 255, 0x26 / 255),
  line: rgb(0xdc / 255, 0xd7 / 255, 0xcb / 255),
};

const [pageHeight, pageWidth] = PageSizes.A4;
const centreX = pageWidth / 2;
const margin = 56;

/** A short run of data-line pulses above the heading: the course's subject, drawn as a plain line. */
function drawPulseTrain(page: PDFPage): void {
  const highTimes = [14, 6, 6, 14, 14, 6, 14, 6, 6, 14, 6, 14];
  const period = 20;
  const high = 8;
  const startX = centreX - (highTimes.length * period) / 2;
  let path = `M ${startX - 12} 0`;
  highTimes.forEach((highTime, i) => {
    const x = startX + i * period;
    path += ` L ${x} 0 L ${x} ${-high} L ${x + highTime} ${-high} L ${x + highTime} 0`;
  });
  path += ` L ${startX + highTimes.length * period + 12} 0`;
  page.drawSvgPath(path, { x: 0, y: 548, borderColor: colours.accent, borderWidth: 1, borderOpacity: 0.45 });
}

function drawFrame(page: PDFPage): void {
  page.drawRectangle({ x: 22, y: 22, width: pageWidth - 44, height: pageHeight - 44, borderColor: colours.accent, borderWidth: 2 });
  page.drawRectangle({ x: 30, y: 30, width: pageWidth - 60, height: pageHeight - 60, borderColor: colours.line, borderWidth: 0.75 });
}

function resultLines(summary: CertificateScoreSummary): { label: string; value: string }[] {
  return [
    ...summary.labs.map((lab) => ({ label: lab.title, value: `${lab.bestScore} / 100` })),
    ...summary.benchExercises.map((exercise) => ({
      label: `Bench: ${exercise.title}`,
      value: `accepted, ${exercise.points} / ${exercise.maxPoints}`,
    })),
  ];
}

/**
 * One landscape A4 page: who, what, where and when; what the course certifies and its hours; the
 * results; the date, the code and who signed for the school; a QR code of the verification address.
 */
export async function renderCertificatePdf(certificate: CertificateDocument, verificationUrl: string): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const code = formatCertificateCode(certificate.code);
  const issued = formatCertificateDate(certificate.issuedAt);
  doc.setTitle(`Certificate: ${certificate.courseTitle} — ${certificate.learnerName}`);
  doc.setAuthor(certificate.schoolName);
  doc.setSubject(`Certificate of completion, verification code ${code}`);
  doc.setCreator("Edgewise");
  doc.setProducer("Edgewise");
  doc.setCreationDate(certificate.issuedAt);
  doc.setModificationDate(certificate.issuedAt);

  const results = resultLines(certificate.scoreSummary);
  const { competences, studyHours } = certificate.certification;
  const hoursLine = formatStudyHours(studyHours);
  const signatory = certificate.signatory;
  const cohortLine = certificate.cohortName ? `as a member of the cohort ${certificate.cohortName}` : "";
  const labels = [
    "CERTIFICATE OF COMPLETION",
    "This certifies that",
    "has completed the course",
    "Results",
    "Best passing score in each lab",
    "Average lab score",
    "Issued",
    "Verification code",
    "Scan or visit to verify",
    "What the holder can do",
    "Signed for the school",
    "•",
  ];
  const text = await CertificateText.embed(doc, [
    ...labels,
    certificate.schoolName.toUpperCase(),
    certificate.learnerName,
    certificate.courseTitle,
    cohortLine,
    issued,
    code,
    verificationUrl,
    ...results.flatMap((line) => [line.label, line.value]),
    ...competences,
    hoursLine,
    ...(signatory ? [signatory.name, signatory.role] : []),
  ]);

  const page = doc.addPage([pageWidth, pageHeight]);
  drawFrame(page);
  drawPulseTrain(page);

  const school = certificate.schoolName.toUpperCase();
  text.drawCentred(page, school, { centreX, y: 520 }, { size: text.fitSize(school, 13, 600, 8), color: colours.copper });
  text.drawCentred(page, "CERTIFICATE OF COMPLETION", { centreX, y: 484 }, { size: 26, color: colours.accent });
  text.drawCentred(page, "This certifies that", { centreX, y: 452 }, { size: 12, color: colours.inkSoft });
  const nameSize = text.fitSize(certificate.learnerName, 34, 620, 14);
  text.drawCentred(page, certificate.learnerName, { centreX, y: 414 }, { size: nameSize, color: colours.ink });
  page.drawLine({ start: { x: centreX - 170, y: 402 }, end: { x: centreX + 170, y: 402 }, thickness: 0.9, color: colours.copper });
  text.drawCentred(page, "has completed the course", { centreX, y: 380 }, { size: 12, color: colours.inkSoft });
  const titleSize = text.fitSize(certificate.courseTitle, 22, 620, 11);
  text.drawCentred(page, certificate.courseTitle, { centreX, y: 354 }, { size: titleSize, color: colours.accent });
  if (cohortLine) {
    text.drawCentred(page, cohortLine, { centreX, y: 334 }, { size: text.fitSize(cohortLine, 11, 620, 7), color: colours.inkSoft });
  }

  // What the course certifies, across the page: one line a competence, and the hours of study.
  const left = margin + 8;
  const fullWidth = pageWidth - 2 * left;
  text.draw(page, "What the holder can do", { x: left, y: 306 }, { size: 11, color: colours.accent });
  text.drawRight(page, hoursLine, { rightX: left + fullWidth, y: 306 }, { size: 10, color: colours.ink });
  competences.forEach((competence, i) => {
    const y = 290 - i * 12;
    text.draw(page, "•", { x: left, y }, { size: 8.5, color: colours.copper });
    text.draw(page, competence, { x: left + 10, y }, { size: text.fitSize(competence, 8.5, fullWidth - 10, 5), color: colours.ink });
  });

  // Results, left; the date, the code and the signatory, middle; the QR code, right.
  const resultsTop = 290 - competences.length * 12 - 14;
  const resultsWidth = 330;
  text.draw(page, "Results", { x: left, y: resultsTop }, { size: 11, color: colours.accent });
  text.draw(page, "Best passing score in each lab", { x: left + 48, y: resultsTop }, { size: 8, color: colours.inkFaint });
  const rowHeight = Math.min(12, (resultsTop - 90) / Math.max(1, results.length + 1));
  const rowSize = Math.min(8.5, rowHeight - 2.5);
  results.forEach((line, i) => {
    const y = resultsTop - 15 - i * rowHeight;
    text.draw(page, line.label, { x: left, y }, { size: text.fitSize(line.label, rowSize, resultsWidth - 110, 5), color: colours.ink });
    text.drawRight(page, line.value, { rightX: left + resultsWidth, y }, { size: rowSize, color: colours.inkSoft });
  });
  const averageY = resultsTop - 15 - results.length * rowHeight - 4;
  page.drawLine({ start: { x: left, y: averageY + 10 }, end: { x: left + resultsWidth, y: averageY + 10 }, thickness: 0.5, color: colours.line });
  text.draw(page, "Average lab score", { x: left, y: averageY }, { size: 9.5, color: colours.ink });
  text.drawRight(page, `${certificate.scoreSummary.averageScore} / 100`, { rightX: left + resultsWidth, y: averageY }, { size: 9.5, color: colours.accent });

  const middleX = 450;
  const middleWidth = 190;
  text.draw(page, "Issued", { x: middleX, y: resultsTop }, { size: 9, color: colours.inkFaint });
  text.draw(page, issued, { x: middleX, y: resultsTop - 17 }, { size: 13, color: colours.ink });
  text.draw(page, "Verification code", { x: middleX, y: resultsTop - 42 }, { size: 9, color: colours.inkFaint });
  text.draw(page, code, { x: middleX, y: resultsTop - 59 }, { size: 13, color: colours.ink });
  if (signatory) {
    const lineY = resultsTop - 96;
    page.drawLine({ start: { x: middleX, y: lineY }, end: { x: middleX + middleWidth, y: lineY }, thickness: 0.7, color: colours.copper });
    text.draw(page, signatory.name, { x: middleX, y: lineY - 14 }, { size: text.fitSize(signatory.name, 11, middleWidth, 6), color: colours.ink });
    text.draw(page, signatory.role, { x: middleX, y: lineY - 26 }, { size: text.fitSize(signatory.role, 8.5, middleWidth, 5), color: colours.inkSoft });
    text.draw(page, "Signed for the school", { x: middleX, y: lineY + 6 }, { size: 8, color: colours.inkFaint });
  }

  const qrSize = 118;
  const qrX = pageWidth - margin - qrSize;
  const qrPng = await QRCode.toBuffer(verificationUrl, { errorCorrectionLevel: "M", margin: 4, scale: 8, type: "png" });
  page.drawImage(await doc.embedPng(qrPng), { x: qrX, y: 96, width: qrSize, height: qrSize });
  text.drawCentred(page, "Scan or visit to verify", { centreX: qrX + qrSize / 2, y: 84 }, { size: 8, color: colours.inkFaint });
  const urlSize = text.fitSize(verificationUrl, 7, 250, 4);
  text.drawRight(page, verificationUrl, { rightX: pageWidth - margin, y: 70 }, { size: urlSize, color: colours.inkSoft });

  return doc.save();
}
