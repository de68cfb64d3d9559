// How a preheater is switched: pure constants shared by models, schemas and client forms
// (kept out of models/ so client bundles never pull in the ORM).
export const HEATER_CONTROLS = ['timer', 'relay', 'manual'] as const;
export type HeaterControl = (typeof HEATER_CONTROLS)[number];
