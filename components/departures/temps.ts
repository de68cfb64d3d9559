import { fromDisplayTemp, type TempUnit } from '@/lib/units';

/** A number as people type it: a comma for the point, a typographic minus. */
export const typedNumber = (s: string) => Number(s.trim().replace(/\u2212/g, '-').replace(',', '.'));

/**
 * A temperature typed in the user's unit → °C (2 decimals); empty → null; unreadable text goes as typed
 * so the server names the field.
 */
export function typedTempC(s: string, unit: TempUnit): number | string | null {
  if (s.trim() === '') return null;
  const n = typedNumber(s);
  return Number.isFinite(n) ? Math.round(fromDisplayTemp(n, unit) * 100) / 100 : s;
}
