// The Oil log's arithmetic: corrected dipstick levels, oil used per engine hour, the next oil change.
// Pure: plain numbers in (litres, °C, engine hours, epoch ms), plain objects out.
export * from './level';
export * from './consumption';
export * from './due';

/** A healthy dry-sump installation returns the oil in about 2–10 blade turns (common practice). */
export const USUAL_MAX_BLADE_TURNS = 10;
