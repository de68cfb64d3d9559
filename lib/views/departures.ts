// Departure types shared by the data layer and client components. Type-only: no I/O.
import type { AircraftRecord } from './aircraft';

export interface DepartureRecord {
  id: number;
  /** ISO instant. */
  departAt: string;
  departAtMs: number;
  /** The airfield's zone (UTC when the aircraft has no home shelter). */
  timeZone: string;
  /** Local date of the departure at the airfield, YYYY-MM-DD. */
  localDate: string;
  readyC: number;
  floorC: number | null;
  /** Start window, minutes: ready from departAt through it; the heater stays on until just before start. */
  holdMinutes: number;
  /** The engine class's ready temperature (the lowest allowed without lowering). */
  classReadyC: number;
  /** The lowest an operator may lower it to: the aircraft's figure (the maker's minimum oil for start), or null. */
  lowestReadyC: number | null;
  /** The ready temperature was lowered below the class's: who and when (follow the manual). */
  readyLowered: { by: string; at: string } | null;
  notes: string;
  cancelled: boolean;
  cancelledAt: string | null;
  pilot: { id: number; name: string };
  bookedBy: { id: number; name: string };
  aircraft: AircraftRecord;
  createdAt: string;
  updatedAt: string;
}
