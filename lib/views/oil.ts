// The Oil log as the data layer returns it and client components show it. Type-only: no I/O.
import type { ConsumptionSummary, OilChangeDue } from '@/lib/oil';

export interface OilCheckRecord {
  id: number;
  checkedAt: string;
  levelL: number;
  correctedL: number;
  oilTempC: number;
  outsideTempC: number;
  bladesTurned: number | null;
  engineHours: number | null;
  addedL: number;
  notes: string;
  author: { id: number; name: string } | null;
  oilAgeHours: number | null;
  oilAgeDays: number | null;
  sincePreviousLPerH: number | null;
}

export interface OilChangeRecord {
  id: number;
  changedAt: string;
  engineHours: number;
  oilGrade: string;
  quantityL: number | null;
  notes: string;
  author: { id: number; name: string } | null;
}

export interface OilLog {
  aircraft: {
    id: number;
    registration: string;
    typeLabel: string;
    engineClass: string;
    engineClassLabel: string;
    oilQuantityL: number;
    oilChangeIntervalHours: number | null;
    oilChangeIntervalMonths: number | null;
    drySump: boolean;
    timeZone: string;
  };
  checks: OilCheckRecord[];
  changes: OilChangeRecord[];
  consumption: ConsumptionSummary;
  due: OilChangeDue;
  currentHours: number | null;
}

export interface OilAircraftChoice {
  id: number;
  registration: string;
  typeLabel: string;
  airfield: string | null;
}
