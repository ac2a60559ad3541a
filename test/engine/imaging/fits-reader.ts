/**
 * A minimal FITS reader written for the tests, independent of the writer under test: splits a file into
 * HDUs, parses header cards (FITS Standard 4.0 §4.1–4.2: keyword in columns 1–8, "= " in 9–10, value and
 * comment after) and decodes binary-table rows (§7.3: TFORMn = rT, big-endian fields).
 */
export interface Card {
  /** The raw 80 characters. */
  raw: string;
  key: string;
  /** Parsed value: string, boolean or number; undefined for commentary cards. */
  value?: string | boolean | number;
}

export interface Hdu {
  cards: Card[];
  /** Header length in bytes (a multiple of 2880) and data bytes (before padding). */
  headerBytes: number;
  dataBytes: number;
  data: Uint8Array;
  get(key: string): string | boolean | number | undefined;
}

export interface Column {
  name: string;
  code: string;
  repeat: number;
  unit?: string;
  offset: number;
}

function parseValue(text: string): string | boolean | number | undefined {
  const t = text.trimStart();
  if (t.startsWith("'")) {
    let out = "";
    for (let i = 1; i < t.length; i++) {
      if (t[i] === "'") {
        if (t[i + 1] === "'") {
          out += "'";
          i++;
          continue;
        }
        return out.replace(/ +$/, "");
      }
      out += t[i];
    }
    throw new Error(`unterminated string in "${text}"`);
  }
  const v = t.split("/")[0].trim();
  if (v === "T") return true;
  if (v === "F") return false;
  if (v === "") return undefined;
  const n = Number(v.replace("D", "E"));
  if (Number.isNaN(n)) throw new Error(`not a value: "${v}"`);
  return n;
}

export function parseCard(raw: string): Card {
  const key = raw.slice(0, 8).trimEnd();
  if (raw.slice(8, 10) === "= ") return { raw, key, value: parseValue(raw.slice(10)) };
  return { raw, key };
}

export function readFits(bytes: Uint8Array): Hdu[] {
  const hdus: Hdu[] = [];
  let p = 0;
  while (p < bytes.length) {
    const cards: Card[] = [];
    let end = false;
    let q = p;
    while (!end) {
      const raw = String.fromCharCode(...bytes.subarray(q, q + 80));
      q += 80;
      const card = parseCard(raw);
      if (card.key === "END") end = true;
      else cards.push(card);
    }
    const headerBytes = Math.ceil((q - p) / 2880) * 2880;
    const get = (key: string) => cards.find((c) => c.key === key)?.value;
    const naxis = Number(get("NAXIS") ?? 0);
    let dataBytes = 0;
    if (naxis > 0) {
      dataBytes = Math.abs(Number(get("BITPIX"))) / 8;
      for (let i = 1; i <= naxis; i++) dataBytes *= Number(get(`NAXIS${i}`));
      dataBytes += Number(get("PCOUNT") ?? 0);
    }
    const start = p + headerBytes;
    hdus.push({ cards, headerBytes, dataBytes, data: bytes.subarray(start, start + dataBytes), get });
    p = start + Math.ceil(dataBytes / 2880) * 2880;
  }
  return hdus;
}

const WIDTH: Record<string, number> = { L: 1, A: 1, B: 1, I: 2, J: 4, K: 8, E: 4, D: 8 };

export function columns(hdu: Hdu): Column[] {
  const n = Number(hdu.get("TFIELDS"));
  const out: Column[] = [];
  let offset = 0;
  for (let i = 1; i <= n; i++) {
    const form = String(hdu.get(`TFORM${i}`));
    const m = /^(\d*)([A-Z])$/.exec(form);
    if (!m) throw new Error(`bad TFORM ${form}`);
    const repeat = m[1] === "" ? 1 : Number(m[1]);
    out.push({ name: String(hdu.get(`TTYPE${i}`)), code: m[2], repeat, unit: hdu.get(`TUNIT${i}`) as string, offset });
    offset += repeat * WIDTH[m[2]];
  }
  return out;
}

/** The values of one column: numbers/booleans (rows × repeat, flattened) or one string per row. */
export function columnValues(hdu: Hdu, name: string): (number | boolean | string)[] {
  const col = columns(hdu).find((c) => c.name === name);
  if (!col) throw new Error(`no column ${name}`);
  const rowBytes = Number(hdu.get("NAXIS1"));
  const rows = Number(hdu.get("NAXIS2"));
  const view = new DataView(hdu.data.buffer, hdu.data.byteOffset, hdu.data.byteLength);
  const out: (number | boolean | string)[] = [];
  for (let r = 0; r < rows; r++) {
    const base = r * rowBytes + col.offset;
    if (col.code === "A") {
      out.push(String.fromCharCode(...hdu.data.subarray(base, base + col.repeat)).replace(/[ \0]+$/, ""));
      continue;
    }
    for (let i = 0; i < col.repeat; i++) {
      const o = base + i * WIDTH[col.code];
      if (col.code === "L") out.push(view.getUint8(o) === 0x54);
      else if (col.code === "I") out.push(view.getInt16(o, false));
      else if (col.code === "J") out.push(view.getInt32(o, false));
      else if (col.code === "E") out.push(view.getFloat32(o, false));
      else if (col.code === "D") out.push(view.getFloat64(o, false));
    }
  }
  return out;
}
