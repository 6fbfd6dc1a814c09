const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

/** "12 March 2026": the certificate's own way of writing a date, on paper and on its pages. */
export function formatCertificateDate(date: Date): string {
  return dayFormat.format(date);
}
