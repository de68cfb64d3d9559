// The safety lines (docs/product.md, Safety) carried by alerts and e-mails.
export const SAFETY = {
  estimates:
    "Thawline gives estimates. Follow the engine and aircraft manufacturer's cold-weather instructions, your operator's procedures and local regulations; they override anything Thawline shows.",
  heaters:
    'Preheaters can start fires: no open flame, never leave a combustion heater unattended, keep heaters and cords away from fuel and fabric. Combustion heaters bring carbon-monoxide risk.',
  propeller:
    'Before turning a propeller by hand: magnetos and ignition off, treat the propeller as live, turn it only in the direction the manufacturer allows, chocks in.',
  start: 'Remove covers and plugs before start. No take-off with frost, ice or snow on wings, tail or propeller.',
} as const;

export const CAUTIONS = {
  'oil-too-cold': [SAFETY.estimates, SAFETY.heaters, SAFETY.propeller, SAFETY.start],
  'switch-on': [SAFETY.estimates, SAFETY.heaters, SAFETY.start],
  'cold-night': [SAFETY.estimates, SAFETY.heaters, SAFETY.start],
  account: [SAFETY.estimates],
} as const;
