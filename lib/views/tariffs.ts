// Tariffs as the data layer returns them and client components show them. Type-only: no I/O.
import type { TariffShape } from '@/lib/validation/tariffs';

export interface TariffRecord extends TariffShape {
  airfieldId: number;
  airfieldName: string;
  /** The airfield's zone: the schedule's hours are local hours there. */
  timeZone: string;
  source: 'stored' | 'default';
  updatedAt: string | null;
}

export interface PricedInterval {
  fromMs: number;
  toMs: number;
  pricePerKWh: number;
  /** The period's name ("Night", "Peak" …). */
  period: string;
}
