/**
 * The science case is a PDF. Its type is judged by its content, never by the file name or the
 * browser's declared type: a PDF file starts with the header `%PDF-x.y` and ends with the marker
 * `%%EOF` (ISO 32000-1:2008, §7.5.2 file header and §7.5.5 file trailer). Readers tolerate a few
 * bytes after the marker (a line end, padding added by mail or upload tools), so the marker is
 * looked for in the last 1024 bytes. Pure: no Node or browser imports, usable on both sides.
 */
import { formatBytes } from "~/lib/format";

/** Largest science case accepted, bytes (10 MiB). */
export const MAX_PDF_BYTES = 10 * 1024 * 1024;

/** How far from the end the end-of-file marker may sit, bytes. */
export const PDF_EOF_WINDOW = 1024;

const HEADER = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"
const EOF_MARK = [0x25, 0x25, 0x45, 0x4f, 0x46]; // "%%EOF"

function startsWith(bytes: Uint8Array, prefix: number[]): boolean {
  if (bytes.length < prefix.length) return false;
  for (let i = 0; i < prefix.length; i++) if (bytes[i] !== prefix[i]) return false;
  return true;
}

function lastIndexOf(bytes: Uint8Array, needle: number[], from: number): number {
  outer: for (let i = bytes.length - needle.length; i >= from; i--) {
    for (let k = 0; k < needle.length; k++) if (bytes[i + k] !== needle[k]) continue outer;
    return i;
  }
  return -1;
}

const isDigit = (b: number | undefined) => b !== undefined && b >= 0x30 && b <= 0x39;

export type PdfCheck = { ok: true; version: string } | { ok: false; reason: string };

/**
 * Checks that bytes are a PDF by content: the header with a version number, and the end-of-file
 * marker near the end. Empty files and files over MAX_PDF_BYTES are refused too.
 */
export function checkPdf(bytes: Uint8Array): PdfCheck {
  if (bytes.length === 0) return { ok: false, reason: "The file is empty." };
  if (bytes.length > MAX_PDF_BYTES) {
    return {
      ok: false,
      reason: `The file is ${formatBytes(bytes.length)}; the limit is ${formatBytes(MAX_PDF_BYTES)}.`,
    };
  }
  if (!startsWith(bytes, HEADER) || !isDigit(bytes[5]) || bytes[6] !== 0x2e || !isDigit(bytes[7])) {
    return {
      ok: false,
      reason:
        "The file is not a PDF: it does not begin with a PDF header (%PDF-1.x or %PDF-2.0), whatever its name says.",
    };
  }
  if (lastIndexOf(bytes, EOF_MARK, Math.max(0, bytes.length - PDF_EOF_WINDOW)) < 0) {
    return {
      ok: false,
      reason:
        "The PDF is incomplete: its end-of-file marker (%%EOF) is missing, so the upload may have been cut short.",
    };
  }
  return { ok: true, version: String.fromCharCode(bytes[5], bytes[6], bytes[7]) };
}

function escapePdfText(s: string): string {
  // Printable ASCII only; the PDF string delimiters and the escape character are escaped.
  return s
    .replace(/[^\x20-\x7e]/g, "?")
    .replace(/\\/g, "\\\\")
    .replace(/\(/g, "\\(")
    .replace(/\)/g, "\\)");
}

/**
 * A small, valid one-page PDF showing the given lines in Helvetica: header, five objects, a
 * cross-reference table with exact byte offsets, trailer, `startxref` and `%%EOF`. For the demo
 * data and the tests; not a general PDF writer.
 */
export function makeTinyPdf(lines: string[]): Uint8Array {
  const text = lines
    .map((line, i) => `BT /F1 ${i === 0 ? 16 : 11} Tf 56 ${760 - i * 22} Td (${escapePdfText(line)}) Tj ET`)
    .join("\n");
  const objects = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << /Font << /F1 5 0 R >> >> /Contents 4 0 R >>",
    `<< /Length ${text.length} >>\nstream\n${text}\nendstream`,
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>",
  ];
  let out = "%PDF-1.4\n";
  const offsets: number[] = [];
  objects.forEach((body, i) => {
    offsets.push(out.length);
    out += `${i + 1} 0 obj\n${body}\nendobj\n`;
  });
  const xref = out.length;
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const off of offsets) out += `${String(off).padStart(10, "0")} 00000 n \n`;
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  const bytes = new Uint8Array(out.length);
  for (let i = 0; i < out.length; i++) bytes[i] = out.charCodeAt(i);
  return bytes;
}
