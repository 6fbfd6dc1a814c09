import { PDFDocument, PageSizes, rgb, type PDFPage } from "pdf-lib";
import QRCode from "qrcode";
import type { CertificateScoreSummary } from "@/db/schema";
import { formatCertificateCode } from "../code";
import { formatCertificateDate } from "../dates";
import { CertificateText } from "../fonts/certificate-fonts";

export type CertificateDocument = {
  code: string;
  learnerName: string;
  courseTitle: string;
  schoolName: string;
  cohortName: string | null;
  issuedAt: Date;
  scoreSummary: CertificateScoreSummary;
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
  page.drawSvgPath(path, { x: 0, y: 528, borderColor: colours.accent, borderWidth: 1, borderOpacity: 0.45 });
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

/** One landscape A4 page: who, what, where and when, the results, the code and a QR code of the verification address. */
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
  ]);

  const page = doc.addPage([pageWidth, pageHeight]);
  drawFrame(page);
  drawPulseTrain(page);

  const school = certificate.schoolName.toUpperCase();
  text.drawCentred(page, school, { centreX, y: 500 }, { size: text.fitSize(school, 13, 600, 8), color: colours.copper });
  text.drawCentred(page, "CERTIFICATE OF COMPLETION", { centreX, y: 462 }, { size: 26, color: colours.accent });
  text.drawCentred(page, "This certifies that", { centreX, y: 428 }, { size: 12, color: colours.inkSoft });
  const nameSize = text.fitSize(certificate.learnerName, 34, 620, 14);
  text.drawCentred(page, certificate.learnerName, { centreX, y: 388 }, { size: nameSize, color: colours.ink });
  page.drawLine({ start: { x: centreX - 170, y: 376 }, end: { x: centreX + 170, y: 376 }, thickness: 0.9, color: colours.copper });
  text.drawCentred(page, "has completed the course", { centreX, y: 352 }, { size: 12, color: colours.inkSoft });
  const titleSize = text.fitSize(certificate.courseTitle, 22, 620, 11);
  text.drawCentred(page, certificate.courseTitle, { centreX, y: 324 }, { size: titleSize, color: colours.accent });
  if (cohortLine) {
    text.drawCentred(page, cohortLine, { centreX, y: 302 }, { size: text.fitSize(cohortLine, 11, 620, 7), color: colours.inkSoft });
  }

  // Results, left; the date and code, middle; the QR code, right.
  const resultsX = margin + 8;
  const resultsWidth = 330;
  text.draw(page, "Results", { x: resultsX, y: 268 }, { size: 11, color: colours.accent });
  text.draw(page, "Best passing score in each lab", { x: resultsX + 48, y: 268 }, { size: 8, color: colours.inkFaint });
  const rowHeight = Math.min(14, 170 / Math.max(1, results.length));
  const rowSize = Math.min(9, rowHeight - 3);
  results.forEach((line, i) => {
    const y = 250 - i * rowHeight;
    const value = line.value;
    const label = line.label;
    text.draw(page, label, { x: resultsX, y }, { size: text.fitSize(label, rowSize, resultsWidth - 110, 5), color: colours.ink });
    text.drawRight(page, value, { rightX: resultsX + resultsWidth, y }, { size: rowSize, color: colours.inkSoft });
  });
  const averageY = 250 - results.length * rowHeight - 6;
  page.drawLine({ start: { x: resultsX, y: averageY + 11 }, end: { x: resultsX + resultsWidth, y: averageY + 11 }, thickness: 0.5, color: colours.line });
  text.draw(page, "Average lab score", { x: resultsX, y: averageY }, { size: 10, color: colours.ink });
  text.drawRight(page, `${certificate.scoreSummary.averageScore} / 100`, { rightX: resultsX + resultsWidth, y: averageY }, { size: 10, color: colours.accent });

  const middleX = 450;
  text.draw(page, "Issued", { x: middleX, y: 168 }, { size: 9, color: colours.inkFaint });
  text.draw(page, issued, { x: middleX, y: 150 }, { size: 14, color: colours.ink });
  text.draw(page, "Verification code", { x: middleX, y: 116 }, { size: 9, color: colours.inkFaint });
  text.draw(page, code, { x: middleX, y: 98 }, { size: 14, color: colours.ink });

  const qrSize = 118;
  const qrX = pageWidth - margin - qrSize;
  const qrPng = await QRCode.toBuffer(verificationUrl, { errorCorrectionLevel: "M", margin: 4, scale: 8, type: "png" });
  page.drawImage(await doc.embedPng(qrPng), { x: qrX, y: 96, width: qrSize, height: qrSize });
  text.drawCentred(page, "Scan or visit to verify", { centreX: qrX + qrSize / 2, y: 84 }, { size: 8, color: colours.inkFaint });
  const urlSize = text.fitSize(verificationUrl, 7, 250, 4);
  text.drawRight(page, verificationUrl, { rightX: pageWidth - margin, y: 70 }, { size: urlSize, color: colours.inkSoft });

  return doc.save();
}
