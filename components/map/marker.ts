// Airfield markers for the Site map: a tag of Thawline's own design (identifier, tonight's low) with a
// stem to the field's position, drawn as a Leaflet divIcon so no marker images are needed. The tag's
// edge and glyph show the readiness of the field's aircraft once plans exist; without it the tag is neutral.
import type { TempUnit } from '@/components/airfields/format';
import { formatTempShort } from '@/components/airfields/format';

import { READINESS, READINESS_STYLE, type Readiness } from '@/lib/plans/state';
export { READINESS, READINESS_STYLE, type Readiness };

export interface MarkerContent {
  ident: string;
  /** The field's name, shown under its identifier (codes alone mean little to a visitor). */
  name?: string;
  lowC: number | null;
  unit: TempUnit;
  readiness?: Readiness;
  stale?: boolean;
  selected?: boolean;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** Band of the low for the value chip's shade: the colder, the deeper the ice. */
function coldBand(lowC: number | null): string {
  if (lowC === null) return 'none';
  if (lowC <= -20) return 'deep';
  if (lowC <= -10) return 'hard';
  if (lowC <= 0) return 'frost';
  return 'mild';
}

/** The marker's inner HTML (the divIcon's `html`). */
export function markerHtml(m: MarkerContent): string {
  const state = m.readiness ?? 'neutral';
  const glyph = m.readiness ? `<span class="tl-mk-glyph" aria-hidden="true">${READINESS_STYLE[m.readiness].glyph}</span>` : '';
  const low = escapeHtml(formatTempShort(m.lowC, m.unit));
  const classes = ['tl-mk', `tl-mk--${state}`, `tl-mk--${coldBand(m.lowC)}`, m.stale ? 'tl-mk--stale' : '', m.selected ? 'tl-mk--selected' : '']
    .filter(Boolean)
    .join(' ');
  return (
    `<div class="${classes}">` +
    `<div class="tl-mk-tag">${glyph}<span class="tl-mk-names"><span class="tl-mk-ident">${escapeHtml(m.ident)}</span>${m.name ? `<span class="tl-mk-name">${escapeHtml(m.name)}</span>` : ''}</span><span class="tl-mk-low">${low}</span></div>` +
    `<div class="tl-mk-stem"></div><div class="tl-mk-dot"></div>` +
    `</div>`
  );
}

/** Text for the marker's accessible name. */
export function markerTitle(name: string, m: MarkerContent): string {
  const low = m.lowC === null ? 'no forecast yet' : `tonight's low ${formatTempShort(m.lowC, m.unit)}${m.unit}`;
  const r = m.readiness ? `, ${READINESS_STYLE[m.readiness].label.toLowerCase()}` : '';
  return `${name} (${m.ident}): ${low}${r}${m.stale ? ', forecast out of date' : ''}`;
}
