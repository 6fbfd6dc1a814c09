import { describe, expect, it } from "vitest";
import { composeCertificateReadyMail } from "@/lib/mail/certificate-ready";

const mail = composeCertificateReadyMail({
  learnerName: "Priya <b>Castellanos</b>",
  courseTitle: "Data runs that work",
  schoolName: "Fernhallow & Sons Trades College",
  certificateUrl: "https://edgewise.example.test/certificate",
  verificationUrl: "https://edgewise.example.test/c/7K2M-QX9P-4TDW-8HBN",
});

describe("the certificate-ready e-mail", () => {
  it("links to the download page and the public check page in both bodies", () => {
    expect(mail.subject).toBe("Your certificate for Data runs that work");
    for (const body of [mail.text, mail.html]) {
      expect(body).toContain("https://edgewise.example.test/certificate");
      expect(body).toContain("https://edgewise.example.test/c/7K2M-QX9P-4TDW-8HBN");
    }
  });

  it("escapes names in the HTML body", () => {
    expect(mail.html).not.toContain("<b>");
    expect(mail.html).toContain("Fernhallow &amp; Sons");
    expect(mail.text).toContain("Hello Priya,");
  });
});
