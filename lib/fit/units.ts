// Temperature units in logger files: stated in a header ("Oil (°F)", "oil_degC", "OAT F"), in the cells
// ("85.2 °C"), or chosen on the form.
import type { TempUnit } from '@/lib/units';

/** The unit a header names, or null. */
export function unitFromHeader(header: string): TempUnit | null {
  const h = header
    .toLowerCase()
    .replace(/\u2109/g, ' degf ')
    .replace(/\u2103/g, ' degc ')
    .replace(/[°º]\s*/g, ' deg')
    .trim();
  if (/fahrenheit|(?<![a-z])deg\s*f(?![a-z])|\(\s*f\s*\)|\[\s*f\s*\]|(?<![a-z])f$/.test(h)) return 'F';
  if (/celsius|centigrade|(?<![a-z])deg\s*c(?![a-z])|\(\s*c\s*\)|\[\s*c\s*\]|(?<![a-z])c$/.test(h)) return 'C';
  return null;
}

const CELL = /^([+-−]?\d+(?:[.,]\d+)?(?:e[+-]?\d+)?)\s*(?:[°º]?\s*([cf])|\u2103|\u2109)?$/i;

/**
 * A temperature cell: the number and the unit it carries, if any. With `decimalComma` a comma is the
 * decimal separator ("12,5"). Null if the cell is not a number.
 */
export function parseTempCell(raw: string, decimalComma: boolean): { value: number; unit: TempUnit | null } | null {
  const s = raw.trim();
  const m = CELL.exec(s);
  if (!m) return null;
  let num = m[1].replace('−', '-');
  if (num.includes(',')) {
    if (!decimalComma) return null;
    num = num.replace(',', '.');
  }
  const value = Number(num);
  if (!Number.isFinite(value)) return null;
  const u = m[2] ? (m[2].toUpperCase() as TempUnit) : s.includes('\u2103') ? 'C' : s.includes('\u2109') ? 'F' : null;
  return { value, unit: u };
}
