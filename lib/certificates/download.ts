import "server-only";
import { z } from "zod";
import { findCertificateById } from "@/db/queries/certificates";
import type { Certificate } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-store";
import { readAppEnv } from "@/lib/env";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { getCourse } from "@/lessons";
import { certificationOf } from "./certification";
import { formatCertificateCode } from "./code";
import { renderCertificatePdf } from "./pdf/render-certificate";
import { signatoryOf } from "./signatory";
import { verificationPath, verificationUrl } from "./urls";

/** The learner it was issued to, and the admins of the school that issued it. */
export function canDownloadCertificate(viewer: SessionUser, certificate: Certificate): boolean {
  if (viewer.id === certificate.userId) return true;
  return viewer.role === "admin" && viewer.schoolId === certificate.schoolId;
}

/**
 * The certificate as a PDF for someone allowed to have it; anyone else gets 404, as if it did not
 * exist. A revoked certificate is never served: the request goes to its public page, which says so.
 */
export async function openCertificatePdf(params: { certificateId: string; viewer: SessionUser | null }): Promise<Response> {
  try {
    if (!params.viewer) throw new AppError("unauthenticated");
    const certificate = z.uuid().safeParse(params.certificateId).success
      ? await findCertificateById({ certificateId: params.certificateId })
      : undefined;
    if (!certificate || !canDownloadCertificate(params.viewer, certificate)) throw new AppError("not-found");
    if (certificate.revokedAt) {
      return new Response(null, { status: 303, headers: { location: verificationPath(certificate.code), "cache-control": "no-store" } });
    }
    const pdf = await renderCertificatePdf(
      { ...certificate, certification: certificationOf(certificate, getCourse()), signatory: signatoryOf(certificate) },
      verificationUrl(readAppEnv().APP_URL, certificate.code),
    );
    return new Response(Buffer.from(pdf), {
      headers: {
        "content-type": "application/pdf",
        "content-disposition": `attachment; filename="certificate-${formatCertificateCode(certificate.code)}.pdf"`,
        "cache-control": "private, no-store",
      },
    });
  } catch (error) {
    return errorResponse(error);
  }
}
