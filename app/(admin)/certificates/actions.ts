"use server";

import { revalidatePath } from "next/cache";
import { requirePermission } from "@/lib/auth/current-user";
import { revokeCertificate } from "@/lib/certificates/revoke";
import { setSchoolSignatory } from "@/lib/certificates/signatory-settings";
import {
  failedFormState,
  formDataOrEmpty,
  invalidFormState,
  readFormValues,
  unexpectedFormState,
  type FormState,
} from "@/lib/http/form-state";

export type RevokeField = "certificateId" | "reason";
export type RevokeState = FormState<RevokeField>;

export async function revokeCertificateAction(_previous: RevokeState, formData: FormData): Promise<RevokeState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("certificates:revoke", { returnTo: "/certificates" });
  const values = readFormValues(formData, ["certificateId", "reason"] as const);
  try {
    const outcome = await revokeCertificate({
      admin,
      input: { certificateId: formData.get("certificateId"), reason: formData.get("reason") },
    });
    if (outcome.status === "invalid") return invalidFormState(outcome.error, values);
    if (outcome.status !== "revoked") {
      return failedFormState("This certificate cannot be revoked from here: it is already revoked or not one of your school's.", values);
    }
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  revalidatePath("/certificates");
  return { status: "success", message: "Revoked. Its public check page now says so, and it can no longer be downloaded." };
}

export type SignatoryField = "signatoryName" | "signatoryRole";
export type SignatoryState = FormState<SignatoryField>;

export async function saveSignatoryAction(_previous: SignatoryState, formData: FormData): Promise<SignatoryState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("certificates:sign", { returnTo: "/certificates" });
  const values = readFormValues(formData, ["signatoryName", "signatoryRole"] as const);
  try {
    const outcome = await setSchoolSignatory({
      admin,
      input: { signatoryName: formData.get("signatoryName"), signatoryRole: formData.get("signatoryRole") },
    });
    if (outcome.status === "invalid") return invalidFormState(outcome.error, values);
    if (outcome.status === "forbidden") return failedFormState("Only your school's admins name who signs its certificates.", values);
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  revalidatePath("/certificates");
  return { status: "success", message: "Saved. Certificates issued from now on carry this signatory; those already issued keep theirs." };
}
