/** Form strings to numbers: "" and null mean "not given"; a decimal comma and a typographic minus are read. */
export function toNumberInput(v: unknown): unknown {
  if (v === null || v === undefined) return undefined;
  if (typeof v === 'string') {
    const s = v.trim().replace(/\u2212/g, '-').replace(',', '.');
    if (s === '') return undefined;
    const n = Number(s);
    return Number.isNaN(n) ? v : n;
  }
  return v;
}
