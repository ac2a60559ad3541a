import { describe, expect, it } from "vitest";
import { formatBytes } from "~/lib/format";
import { checkPdf, MAX_PDF_BYTES, makeTinyPdf } from "~/services/proposals/pdf";

const ascii = (bytes: Uint8Array) => String.fromCharCode(...bytes);
const bytesOf = (s: string) => Uint8Array.from(s, (c) => c.charCodeAt(0));

// The first bytes of every PNG file (PNG specification, ISO/IEC 15948:2004 §5.2).
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

describe("science-case PDF check by content", () => {
  it("accepts the generated one-page PDF and reads its version", () => {
    const pdf = makeTinyPdf(["A title", "A line (with parentheses) and a \\ backslash"]);
    expect(checkPdf(pdf)).toEqual({ ok: true, version: "1.4" });
  });

  it("builds a cross-reference table whose offsets point at the objects (ISO 32000-1 §7.5.4)", () => {
    const text = ascii(makeTinyPdf(["Offsets"]));
    const startxref = Number(/startxref\n(\d+)\n%%EOF\n$/.exec(text)![1]);
    expect(text.slice(startxref, startxref + 4)).toBe("xref");
    const entries = [...text.slice(startxref).matchAll(/^(\d{10}) 00000 n $/gm)].map((m) => Number(m[1]));
    expect(entries).toHaveLength(5);
    for (const [i, offset] of entries.entries()) {
      expect(text.slice(offset, offset + `${i + 1} 0 obj`.length)).toBe(`${i + 1} 0 obj`);
    }
    // The content stream's /Length is the number of bytes between "stream\n" and "\nendstream".
    const m = /<< \/Length (\d+) >>\nstream\n([\s\S]*?)\nendstream/.exec(text)!;
    expect(m[2].length).toBe(Number(m[1]));
  });

  it("refuses a PNG renamed to .pdf, whatever its name", () => {
    const png = new Uint8Array([...PNG_SIGNATURE, ...new Array(200).fill(0)]);
    const out = checkPdf(png);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.reason).toMatch(/not a PDF/);
  });

  it("refuses a header without a version, an empty file and a cut-off file", () => {
    expect(checkPdf(bytesOf("%PDF-x.y\n%%EOF\n")).ok).toBe(false);
    expect(checkPdf(new Uint8Array(0))).toEqual({ ok: false, reason: "The file is empty." });
    const cut = makeTinyPdf(["cut"]).slice(0, 300);
    const out = checkPdf(cut);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.reason).toMatch(/%%EOF/);
  });

  it("finds the end marker within the last 1024 bytes only", () => {
    const pdf = makeTinyPdf(["padding"]);
    const padded = new Uint8Array(pdf.length + 1000);
    padded.set(pdf);
    padded.fill(0x20, pdf.length);
    expect(checkPdf(padded).ok).toBe(true);
    const far = new Uint8Array(pdf.length + 2000);
    far.set(pdf);
    far.fill(0x20, pdf.length);
    expect(checkPdf(far).ok).toBe(false);
  });

  it("refuses more than 10 MiB even when the content looks right", () => {
    const big = new Uint8Array(MAX_PDF_BYTES + 1);
    big.set(bytesOf("%PDF-1.7\n"));
    big.set(bytesOf("%%EOF\n"), big.length - 6);
    const out = checkPdf(big);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.reason).toMatch(/limit is 10\.0 MB/);
    const exact = big.slice(0, MAX_PDF_BYTES);
    exact.set(bytesOf("%%EOF\n"), exact.length - 6);
    expect(checkPdf(exact).ok).toBe(true);
  });

  it("writes sizes in binary units", () => {
    expect(formatBytes(812)).toBe("812 B");
    expect(formatBytes(1536)).toBe("1.5 KB");
    expect(formatBytes(MAX_PDF_BYTES)).toBe("10.0 MB");
  });
});
