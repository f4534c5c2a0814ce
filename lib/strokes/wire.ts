// The packed wire format of a whole pass, for the editor (GET /api/passes/:id
// with `Accept: application/vnd.quadrille.pass`). Strokes travel in their
// stored encoding (quantised, delta-encoded points; lib/strokes/codec.ts) with a
// few fixed fields around them, a fraction of the same pass as JSON, and
// in order, so a reader can draw panels while the rest is still arriving.
//
//   "QPAS" · u8 version · varint n · n bytes of header JSON (everything but the strokes)
//   then per stroke: varint id length · id (UTF-8) · u8 panel · u8 tool index ·
//   f64 grey · f64 size · f64 ox · f64 oy (the stroke's move offset, mm) ·
//   varint points length · points (codec.ts)
//   and last a single 0 byte (an empty id) that says the pass is complete.
// Numbers are little-endian. JSON stays the documented format for scripts.
import { decodePoints } from './codec';
import { type Lightbox, type Room, type Stroke, TOOLS, translatePoints } from './types';

export const PASS_MEDIA_TYPE = 'application/vnd.quadrille.pass';
const MAGIC = [0x51, 0x50, 0x41, 0x53]; // "QPAS"
const VERSION = 1;

export type PassHeader = { id: string; gagId: string; number: number; seq: number; strokeCount: number; rooms: Room[]; lightboxes: Lightbox[] };
export type StrokeRow = {
  strokeId: string;
  panel: number;
  tool: Stroke['tool'];
  grey: number;
  size: number;
  points: Uint8Array;
  ox: number;
  oy: number;
};

const utf8 = new TextEncoder();

function varint(n: number, out: number[]) {
  while (n > 0x7f) {
    out.push((n & 0x7f) | 0x80);
    n = Math.floor(n / 128);
  }
  out.push(n);
}

export function encodeHeader(header: PassHeader): Uint8Array {
  const json = utf8.encode(JSON.stringify(header));
  const lead: number[] = [...MAGIC, VERSION];
  varint(json.length, lead);
  const out = new Uint8Array(lead.length + json.length);
  out.set(lead);
  out.set(json, lead.length);
  return out;
}

/** Stroke records for a run of rows, as one buffer. */
export function encodeStrokes(rows: StrokeRow[]): Uint8Array {
  let size = 0;
  const ids = rows.map((r) => utf8.encode(r.strokeId));
  for (let i = 0; i < rows.length; i++) size += 5 + ids[i]!.length + 2 + 32 + 5 + rows[i]!.points.length;
  const out = new Uint8Array(size);
  const view = new DataView(out.buffer);
  let at = 0;
  const putVarint = (n: number) => {
    const bytes: number[] = [];
    varint(n, bytes);
    out.set(bytes, at);
    at += bytes.length;
  };
  rows.forEach((r, i) => {
    const id = ids[i]!;
    if (id.length === 0) throw new Error('A stroke id cannot be empty.');
    putVarint(id.length);
    out.set(id, at);
    at += id.length;
    out[at++] = r.panel;
    out[at++] = TOOLS.indexOf(r.tool);
    for (const v of [r.grey, r.size, r.ox, r.oy]) {
      view.setFloat64(at, v, true);
      at += 8;
    }
    putVarint(r.points.length);
    out.set(r.points, at);
    at += r.points.length;
  });
  return out.subarray(0, at);
}

/** The closing mark: the pass is complete. */
export const END = Uint8Array.of(0);

const utf8In = new TextDecoder();

/**
 * Reads the packed format as its bytes arrive: `push` each chunk and get the
 * strokes it completed. `header` is set once read; `done` once the end mark is.
 */
export class PassReader {
  header: PassHeader | null = null;
  done = false;
  private buf = new Uint8Array(0);
  private at = 0;

  push(chunk: Uint8Array): Stroke[] {
    if (chunk.length === 0) return [];
    if (this.done) throw new Error('The pass data goes on after its end.');
    const rest = this.buf.subarray(this.at);
    const next = new Uint8Array(rest.length + chunk.length);
    next.set(rest);
    next.set(chunk, rest.length);
    this.buf = next;
    this.at = 0;
    const out: Stroke[] = [];
    for (;;) {
      const start = this.at;
      if (!this.header) {
        if (!this.readHeader()) return ((this.at = start), out);
        continue;
      }
      const stroke = this.readStroke();
      if (stroke === undefined) {
        this.at = start;
        return out;
      }
      if (stroke === null) {
        this.done = true;
        if (this.at !== this.buf.length) throw new Error('The pass data goes on after its end.');
        return out;
      }
      out.push(stroke);
    }
  }

  /** After the last chunk: the strokes are all there, or the data was cut short. */
  finish(): PassHeader {
    if (!this.done || !this.header) throw new Error('The pass data was cut short.');
    return this.header;
  }

  private varint(): number | undefined {
    let n = 0;
    let scale = 1;
    for (;;) {
      if (this.at >= this.buf.length) return undefined;
      const b = this.buf[this.at++]!;
      n += (b & 0x7f) * scale;
      if (b < 0x80) return n;
      scale *= 128;
    }
  }

  private readHeader(): boolean {
    if (this.buf.length - this.at < 5) return false;
    for (let i = 0; i < 4; i++) if (this.buf[this.at + i] !== MAGIC[i]) throw new Error('This is not a Quadrille pass.');
    if (this.buf[this.at + 4] !== VERSION) throw new Error(`Unknown pass data version ${this.buf[this.at + 4]}.`);
    this.at += 5;
    const n = this.varint();
    if (n === undefined || this.buf.length - this.at < n) return false;
    this.header = JSON.parse(utf8In.decode(this.buf.subarray(this.at, this.at + n))) as PassHeader;
    this.at += n;
    return true;
  }

  /** A stroke; null at the end mark; undefined when its bytes are not all here yet. */
  private readStroke(): Stroke | null | undefined {
    const idLen = this.varint();
    if (idLen === undefined) return undefined;
    if (idLen === 0) return null;
    if (this.buf.length - this.at < idLen + 2 + 32) return undefined;
    const id = utf8In.decode(this.buf.subarray(this.at, this.at + idLen));
    this.at += idLen;
    const panel = this.buf[this.at++]!;
    const tool = TOOLS[this.buf[this.at++]!];
    if (!tool) throw new Error('Unknown tool in the pass data.');
    const view = new DataView(this.buf.buffer, this.buf.byteOffset + this.at, 32);
    const [grey, size, ox, oy] = [0, 8, 16, 24].map((o) => view.getFloat64(o, true)) as [number, number, number, number];
    this.at += 32;
    const n = this.varint();
    if (n === undefined || this.buf.length - this.at < n) return undefined;
    const points = translatePoints(decodePoints(this.buf.subarray(this.at, this.at + n)), ox, oy);
    this.at += n;
    return { id, panel, tool, grey, size, points };
  }
}
