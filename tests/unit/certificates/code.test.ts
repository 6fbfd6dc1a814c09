import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { encodeCertificateCode, formatCertificateCode, generateCertificateCode, parseCertificateCode } from "@/lib/certificates/code";

// Crockford's base32 alphabet (crockford.com/base32.html): digits, then letters without I, L, O, U.
const crockford = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";

/** The code's value read back digit by digit, to compare with the bytes as one 80-bit number. */
const valueOfCode = (code: string) => [...code].reduce((value, char) => value * 32n + BigInt(crockford.indexOf(char)), 0n);
const valueOfBytes = (bytes: Uint8Array) => [...bytes].reduce((value, byte) => value * 256n + BigInt(byte), 0n);

describe("certificate codes", () => {
  it("write 80 bits as 16 base32 digits, most significant first", () => {
    expect(encodeCertificateCode(new Uint8Array(10))).toBe("0000000000000000");
    expect(encodeCertificateCode(new Uint8Array(10).fill(255))).toBe("ZZZZZZZZZZZZZZZZ");
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 10, maxLength: 10 }), (bytes) => {
        const code = encodeCertificateCode(bytes);
        expect(code).toMatch(/^[0-9A-HJKMNP-TV-Z]{16}$/);
        expect(valueOfCode(code)).toBe(valueOfBytes(bytes));
      }),
    );
  });

  it("refuse any other number of bytes", () => {
    expect(() => encodeCertificateCode(new Uint8Array(9))).toThrow(RangeError);
  });

  it("are fresh every time", () => {
    const codes = new Set(Array.from({ length: 5000 }, generateCertificateCode));
    expect(codes.size).toBe(5000);
  });

  it("are shown in four groups and read back from what people type", () => {
    expect(formatCertificateCode("7K2MQX9P4TDW8HBN")).toBe("7K2M-QX9P-4TDW-8HBN");
    expect(parseCertificateCode("7K2M-QX9P-4TDW-8HBN")).toBe("7K2MQX9P4TDW8HBN");
    expect(parseCertificateCode(" 7k2m qx9p 4tdw 8hbn ")).toBe("7K2MQX9P4TDW8HBN");
    // Look-alikes typed from paper read as the digits they resemble.
    expect(parseCertificateCode("7K2M-QX9P-4TDW-8HBO")).toBe("7K2MQX9P4TDW8HB0");
    expect(parseCertificateCode("IK2M-QX9P-4TDW-8HBL")).toBe("1K2MQX9P4TDW8HB1");
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 10, maxLength: 10 }), (bytes) => {
        const code = encodeCertificateCode(bytes);
        expect(parseCertificateCode(formatCertificateCode(code))).toBe(code);
      }),
    );
  });

  it("reject anything that cannot be a code", () => {
    for (const input of ["", "7K2M-QX9P-4TDW-8HB", "7K2M-QX9P-4TDW-8HBNN", "7K2M-QX9P-4TDW-8HBU", "7K2M-QX9P-4TDW-8HB!", "7K2M/QX9P/4TDW/8HBN", "../../etc/passwd", "7K2M-QX9P-4TDW-8HBN".padEnd(80, "-")]) {
      expect(parseCertificateCode(input), input).toBeNull();
    }
  });
});
