// Airfields and shelters as the data layer returns them and client components show them. Type-only: no I/O.
import type { ShelterValues } from '@/lib/validation/airfields';

export interface ShelterRow extends ShelterValues {
  id: number;
  airfieldId: number;
  archived: boolean;
  /** Aircraft (not archived) whose home is this shelter. */
  aircraftCount: number;
  /** C/G of the shelter air, hours; null for a tie-down. */
  timeConstantH: number | null;
}

export interface AirfieldRow {
  id: number;
  name: string;
  ident: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  timeZone: string;
  archived: boolean;
  shelters: ShelterRow[];
  aircraftCount: number;
}

export type RemoveResult = { result: 'deleted' } | { result: 'archived'; aircraftCount: number };
