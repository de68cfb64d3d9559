// Compact storage of a logged series: one deflated buffer of little-endian arrays
// (header, Float64 epoch-ms times, Float32 °C values), so 200,000 rows fit in one database value.
import { deflateSync, inflateSync } from 'node:zlib';
import type { LogSeries } from './types';

const MAGIC = 0x544c4731; // "TLG1"

export function packSeries(s: LogSeries): Buffer {
  const n = s.t.length;
  const flags = (s.ambient ? 1 : 0) | (s.heater ? 2 : 0);
  // Times as deltas from the first (exact in Float64), then values as Float32 (±1e-5 K at 100 °C).
  const bytes = 12 + 8 * n + 4 * n * (1 + (s.ambient ? 1 : 0)) + (s.heater ? n : 0);
  const buf = new ArrayBuffer(bytes);
  const view = new DataView(buf);
  view.setUint32(0, MAGIC, true);
  view.setUint32(4, n, true);
  view.setUint32(8, flags, true);
  let o = 12;
  const t0 = n ? s.t[0] : 0;
  for (let i = 0; i < n; i++, o += 8) view.setFloat64(o, i === 0 ? t0 : s.t[i] - s.t[i - 1], true);
  for (let i = 0; i < n; i++, o += 4) view.setFloat32(o, s.oil[i], true);
  if (s.ambient) for (let i = 0; i < n; i++, o += 4) view.setFloat32(o, s.ambient[i], true);
  if (s.heater) for (let i = 0; i < n; i++, o += 1) view.setUint8(o, s.heater[i]);
  return deflateSync(new Uint8Array(buf), { level: 6 });
}

export function unpackSeries(packed: Uint8Array): LogSeries {
  const raw = inflateSync(packed);
  const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
  if (view.getUint32(0, true) !== MAGIC) throw new Error('not a packed log series');
  const n = view.getUint32(4, true);
  const flags = view.getUint32(8, true);
  let o = 12;
  const t = new Float64Array(n);
  for (let i = 0; i < n; i++, o += 8) t[i] = (i === 0 ? 0 : t[i - 1]) + view.getFloat64(o, true);
  const oil = new Float64Array(n);
  for (let i = 0; i < n; i++, o += 4) oil[i] = view.getFloat32(o, true);
  let ambient: Float64Array | null = null;
  if (flags & 1) {
    ambient = new Float64Array(n);
    for (let i = 0; i < n; i++, o += 4) ambient[i] = view.getFloat32(o, true);
  }
  let heater: Uint8Array | null = null;
  if (flags & 2) {
    heater = new Uint8Array(n);
    for (let i = 0; i < n; i++, o += 1) heater[i] = view.getUint8(o);
  }
  return { t, oil, ambient, heater };
}
