/**
 * A small FITS writer: header cards, a primary HDU without data and binary-table extensions, returned as
 * bytes (pure, no I/O). Follows the FITS Standard 4.0 (IAU FITS Working Group, 2018):
 *  - the file is a sequence of 2880-byte blocks; a header is 80-character ASCII cards ending with END,
 *    padded with blanks to a whole block; a data unit is padded with zero bytes (§3.1, §3.3, §7.3.3);
 *  - a card holds the keyword in columns 1–8, "= " in columns 9–10 and a value in fixed format:
 *    a string starts with a quote in column 11 and has at least 8 characters between its quotes (embedded
 *    quotes doubled), a logical T/F sits in column 30, numbers are right-justified to column 30 (§4.1–4.2);
 *  - a binary table's header starts with XTENSION = 'BINTABLE', BITPIX = 8, NAXIS = 2, NAXIS1 (bytes per
 *    row), NAXIS2 (rows), PCOUNT = 0, GCOUNT = 1, TFIELDS, then TFORMn/TTYPEn/TUNITn (§7.3.1);
 *  - fields are big-endian: I (16-bit), J (32-bit) two's-complement integers, E/D IEEE-754 single/double,
 *    L the ASCII bytes T/F, A ASCII text padded with blanks (§7.3.3).
 */

export type FitsValue = string | boolean | { int: number } | { real: number };

/** One header card: keyword (≤ 8 characters of A–Z, 0–9, _ and -), value and comment; COMMENT cards have no value. */
export interface FitsCard {
  key: string;
  value?: FitsValue;
  comment?: string;
}

const CARD = 80;
const BLOCK = 2880;

function checkKey(key: string): void {
  if (!/^[A-Z0-9_-]{1,8}$/.test(key)) throw new RangeError(`invalid FITS keyword "${key}"`);
}

function printable(text: string): string {
  return text.replace(/[^\x20-\x7e]/g, "?");
}

/** A real number as FITS text: always with a decimal point (and an upper-case exponent when there is one). */
export function formatReal(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError("a FITS header value must be finite");
  let s = String(x).toUpperCase();
  if (!s.includes(".")) s = s.includes("E") ? s.replace("E", ".0E") : `${s}.0`;
  return s;
}

/** Formats one 80-character card (fixed format where the value fits, free format otherwise). */
export function formatCard(card: FitsCard): string {
  checkKey(card.key);
  if (card.value === undefined) {
    const text = card.key === "COMMENT" || card.key === "HISTORY" ? printable(card.comment ?? "") : "";
    return `${card.key.padEnd(8)}${text}`.slice(0, CARD).padEnd(CARD);
  }
  const v = card.value;
  let field: string;
  if (typeof v === "string") {
    const quoted = printable(v).replace(/'/g, "''").padEnd(8);
    if (quoted.length > 68) throw new RangeError(`string value of ${card.key} is too long`);
    field = `'${quoted}'`;
  } else if (typeof v === "boolean") {
    field = (v ? "T" : "F").padStart(20);
  } else if ("int" in v) {
    if (!Number.isInteger(v.int)) throw new RangeError(`${card.key}: not an integer`);
    field = String(v.int).padStart(20);
  } else {
    field = formatReal(v.real).padStart(20);
  }
  let text = `${card.key.padEnd(8)}= ${field}`;
  if (card.comment) text += ` / ${printable(card.comment)}`;
  return text.slice(0, CARD).padEnd(CARD);
}

/** Header bytes: the cards, END, blank padding to a multiple of 2880. */
export function headerBytes(cards: readonly FitsCard[]): Uint8Array {
  const lines = cards.map(formatCard);
  lines.push("END".padEnd(CARD));
  const size = Math.ceil((lines.length * CARD) / BLOCK) * BLOCK;
  const out = new Uint8Array(size).fill(0x20);
  let p = 0;
  for (const line of lines) {
    for (let i = 0; i < CARD; i++) out[p + i] = line.charCodeAt(i);
    p += CARD;
  }
  return out;
}

/** A primary HDU without data (NAXIS = 0, extensions follow). */
export function primaryHdu(cards: readonly FitsCard[]): Uint8Array {
  return headerBytes([
    { key: "SIMPLE", value: true, comment: "conforms to the FITS standard" },
    { key: "BITPIX", value: { int: 8 }, comment: "no primary data array" },
    { key: "NAXIS", value: { int: 0 }, comment: "no primary data array" },
    { key: "EXTEND", value: true, comment: "extensions follow" },
    ...cards,
  ]);
}

export type ColumnCode = "I" | "J" | "E" | "D" | "L" | "A";

/**
 * A column: `repeat` elements per row, values flattened row by row (rows × repeat numbers or booleans;
 * one string per row for "A", cut or blank-padded to `repeat` characters).
 */
export interface BinaryColumn {
  name: string;
  code: ColumnCode;
  repeat: number;
  unit?: string;
  values: ArrayLike<number> | readonly boolean[] | readonly string[];
}

const WIDTH: Record<ColumnCode, number> = { I: 2, J: 4, E: 4, D: 8, L: 1, A: 1 };

/** How one value of each non-text column code is written (big-endian, as FITS stores numbers; L as "T"/"F"). */
const WRITE: Record<Exclude<ColumnCode, "A">, (view: DataView, at: number, x: number | boolean) => void> = {
  L: (view, at, x) => view.setUint8(at, x ? 0x54 : 0x46),
  I: (view, at, x) => view.setInt16(at, Number(x), false),
  J: (view, at, x) => view.setInt32(at, Number(x), false),
  E: (view, at, x) => view.setFloat32(at, Number(x), false),
  D: (view, at, x) => view.setFloat64(at, Number(x), false),
};

/** A binary-table extension (header and data) named `extname`, with extra header cards after the columns. */
export function binaryTableHdu(
  extname: string,
  rows: number,
  columns: readonly BinaryColumn[],
  cards: readonly FitsCard[],
): Uint8Array {
  let rowBytes = 0;
  for (const c of columns) {
    const expected = c.code === "A" ? rows : rows * c.repeat;
    if (c.values.length !== expected)
      throw new RangeError(`column ${c.name}: ${c.values.length} values, ${expected} expected`);
    rowBytes += WIDTH[c.code] * c.repeat;
  }
  const header: FitsCard[] = [
    { key: "XTENSION", value: "BINTABLE", comment: "binary table extension" },
    { key: "BITPIX", value: { int: 8 }, comment: "8-bit bytes" },
    { key: "NAXIS", value: { int: 2 }, comment: "2-dimensional table" },
    { key: "NAXIS1", value: { int: rowBytes }, comment: "bytes per row" },
    { key: "NAXIS2", value: { int: rows }, comment: "number of rows" },
    { key: "PCOUNT", value: { int: 0 }, comment: "no heap" },
    { key: "GCOUNT", value: { int: 1 }, comment: "one group" },
    { key: "TFIELDS", value: { int: columns.length }, comment: "number of columns" },
  ];
  columns.forEach((c, i) => {
    header.push({ key: `TTYPE${i + 1}`, value: c.name });
    header.push({ key: `TFORM${i + 1}`, value: `${c.repeat}${c.code}` });
    if (c.unit) header.push({ key: `TUNIT${i + 1}`, value: c.unit });
  });
  header.push({ key: "EXTNAME", value: extname, comment: "name of this table" }, ...cards);
  const head = headerBytes(header);

  const dataSize = Math.ceil((rowBytes * rows) / BLOCK) * BLOCK;
  const out = new Uint8Array(head.length + dataSize);
  out.set(head, 0);
  const view = new DataView(out.buffer, head.length, dataSize);
  let p = 0;
  for (let r = 0; r < rows; r++) {
    for (const c of columns) {
      if (c.code === "A") {
        const s = printable(String((c.values as readonly string[])[r]));
        for (let i = 0; i < c.repeat; i++) view.setUint8(p + i, i < s.length ? s.charCodeAt(i) : 0x20);
        p += c.repeat;
        continue;
      }
      const write = WRITE[c.code];
      for (let i = 0; i < c.repeat; i++) {
        write(view, p, c.values[r * c.repeat + i] as number | boolean);
        p += WIDTH[c.code];
      }
    }
  }
  return out;
}

/** Joins HDUs into one file. */
export function concatBytes(parts: readonly Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let p = 0;
  for (const part of parts) {
    out.set(part, p);
    p += part.length;
  }
  return out;
}
