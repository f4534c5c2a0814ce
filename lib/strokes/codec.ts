// Compact storage of stroke points: x and y quantised to 0.01 mm, pressure to
// 1/255, each delta-encoded from the previous point as a zigzag varint.
// A typical 60-point stroke takes a few hundred bytes instead of ~1.3 kB of JSON.
import type { Point } from './types';

export const XY_QUANTUM_MM = 0.01;
export const PRESSURE_STEPS = 255;
const VERSION = 1;

function pushVarint(out: number[], n: number) {
  // n is a non-negative integer below 2^31 here.
  while (n > 0x7f) {
    out.push((n & 0x7f) | 0x80);
    n >>>= 7;
  }
  out.push(n);
}

const zigzag = (n: number) => (n << 1) ^ (n >> 31);
const unzigzag = (n: number) => (n >>> 1) ^ -(n & 1);

export function quantise([x, y, p]: Point): [number, number, number] {
  return [Math.round(x / XY_QUANTUM_MM), Math.round(y / XY_QUANTUM_MM), Math.round(Math.min(1, Math.max(0, p)) * PRESSURE_STEPS)];
}

export function encodePoints(points: Point[]): Uint8Array {
  const out: number[] = [VERSION];
  pushVarint(out, points.length);
  let px = 0;
  let py = 0;
  let pp = 0;
  for (const pt of points) {
    const [qx, qy, qp] = quantise(pt);
    pushVarint(out, zigzag(qx - px) >>> 0);
    pushVarint(out, zigzag(qy - py) >>> 0);
    pushVarint(out, zigzag(qp - pp) >>> 0);
    px = qx;
    py = qy;
    pp = qp;
  }
  return Uint8Array.from(out);
}

export function decodePoints(bytes: Uint8Array): Point[] {
  let i = 0;
  const read = () => {
    let result = 0;
    let shift = 0;
    for (;;) {
      if (i >= bytes.length) throw new Error('Truncated stroke data.');
      const b = bytes[i++]!;
      result |= (b & 0x7f) << shift;
      if (b < 0x80) return result >>> 0;
      shift += 7;
    }
  };
  const version = bytes[i++];
  if (version !== VERSION) throw new Error(`Unknown stroke data version ${version}.`);
  const n = read();
  const points: Point[] = new Array(n);
  let x = 0;
  let y = 0;
  let p = 0;
  for (let k = 0; k < n; k++) {
    x += unzigzag(read());
    y += unzigzag(read());
    p += unzigzag(read());
    points[k] = [Math.round(x * XY_QUANTUM_MM * 100) / 100, Math.round(y * XY_QUANTUM_MM * 100) / 100, p / PRESSURE_STEPS];
  }
  return points;
}
