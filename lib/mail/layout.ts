// One layout for every Thawline e-mail, rendered twice: HTML (table layout, inline styles, the
// slate/ice palette with the warm ember accent for heat, system fonts, no images or external
// resources) and plain text that reads on its own.

export interface EmailDoc {
  subject: string;
  /** The preview line mail programs show after the subject. */
  preheader: string;
  /** What kind of message this is ("Oil-too-cold warning"). */
  label: string;
  /** heat: about heaters and cold oil (ember accent); ice: notices and account mail. */
  tone: 'heat' | 'ice';
  title: string;
  intro: string[];
  facts?: { label: string; value: string; strong?: boolean }[];
  sections?: { heading: string; items: string[]; tone?: 'heat' | 'ice' }[];
  /** A cell may hold two lines ("Q-KAPA\nKettle Lake"): the second is shown smaller. */
  table?: { caption: string; columns: string[]; rows: string[][]; footer?: string[] };
  action: { label: string; url: string };
  /** A quieter second link under the button. */
  secondary?: { label: string; url: string };
  afterAction?: string[];
  /** Safety lines (docs/product.md, Safety); at least the estimates line. */
  cautions: string[];
  /** Why the recipient gets this message. */
  reason: string;
  preferencesUrl?: string;
  unsubscribe?: { url: string; label: string };
}

const C = {
  page: '#f1f8fb',
  card: '#ffffff',
  border: '#dceef6',
  head: '#132837',
  headText: '#ffffff',
  headSub: '#93cbe2',
  title: '#0f172a',
  body: '#334155',
  muted: '#64748b',
  ice: '#255f7e',
  iceSoft: '#f1f8fb',
  iceLine: '#3b93b8',
  heat: '#bc3209',
  heatSoft: '#fff6ed',
  heatLine: '#f25f12',
  heatBorder: '#ffd0a8',
  cautionBg: '#fffbeb',
  cautionBorder: '#fcd34d',
  cautionText: '#451a03',
};
const FONT = "-apple-system, BlinkMacSystemFont, 'Segoe UI', Roboto, Helvetica, Arial, sans-serif";

export function escapeHtml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

function p(text: string, style = '') {
  return `<p style="margin:0 0 12px 0;font-size:15px;line-height:22px;color:${C.body};${style}">${escapeHtml(text)}</p>`;
}

/** A table cell: its second line, if any, smaller and muted. */
function cell(v: string): string {
  const [first, ...rest] = v.split('\n');
  return rest.length ? `${escapeHtml(first)}<br><span style="font-size:12px;font-weight:400;color:${C.muted}">${escapeHtml(rest.join(' '))}</span>` : escapeHtml(first);
}

function button(label: string, url: string) {
  return `<table role="presentation" cellpadding="0" cellspacing="0" border="0" style="margin:8px 0 16px 0"><tr><td style="border-radius:12px;background:${C.ice}"><a href="${escapeHtml(url)}" style="display:inline-block;padding:13px 22px;font-family:${FONT};font-size:15px;font-weight:600;line-height:20px;color:#ffffff;text-decoration:none;border-radius:12px">${escapeHtml(label)}</a></td></tr></table>`;
}

export function renderHtml(doc: EmailDoc): string {
  const heat = doc.tone === 'heat';
  const pill = heat
    ? `background:${C.heatSoft};color:${C.heat};border:1px solid ${C.heatBorder}`
    : `background:${C.border};color:#223f53;border:1px solid #bfe0ee`;
  const facts = doc.facts?.length
    ? `<table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="margin:4px 0 16px 0;border-top:1px solid ${C.border}">${doc.facts
        .map(
          (f) =>
            `<tr><td style="padding:9px 12px 9px 0;border-bottom:1px solid ${C.border};font-size:13px;line-height:18px;color:${C.muted};width:40%;vertical-align:top">${escapeHtml(f.label)}</td><td style="padding:9px 0;border-bottom:1px solid ${C.border};font-size:15px;line-height:20px;color:${f.strong ? (heat ? C.heat : C.title) : C.title};font-weight:${f.strong ? 700 : 500};vertical-align:top">${escapeHtml(f.value)}</td></tr>`,
        )
        .join('')}</table>`
    : '';
  const sections = (doc.sections ?? [])
    .map((s) => {
      const t = s.tone ?? doc.tone;
      const line = t === 'heat' ? C.heatLine : C.iceLine;
      const bg = t === 'heat' ? C.heatSoft : C.iceSoft;
      return `<table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="margin:0 0 16px 0"><tr><td style="background:${bg};border-left:4px solid ${line};border-radius:8px;padding:12px 14px"><p style="margin:0 0 6px 0;font-size:14px;font-weight:700;color:${C.title}">${escapeHtml(s.heading)}</p>${s.items
        .map((i) => `<p style="margin:0 0 4px 0;font-size:14px;line-height:20px;color:${C.body}">&#8226;&nbsp;${escapeHtml(i)}</p>`)
        .join('')}</td></tr></table>`;
    })
    .join('');
  const table = doc.table
    ? `<p style="margin:4px 0 6px 0;font-size:14px;font-weight:700;color:${C.title}">${escapeHtml(doc.table.caption)}</p><table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="margin:0 0 16px 0;border:1px solid ${C.border};border-radius:8px;border-collapse:separate"><tr>${doc.table.columns
        .map((c) => `<td style="padding:8px 8px;background:${C.iceSoft};font-size:12px;font-weight:700;letter-spacing:0.03em;text-transform:uppercase;color:${C.muted}">${escapeHtml(c)}</td>`)
        .join('')}</tr>${doc.table.rows
        .map((r) => `<tr>${r.map((v, i) => `<td style="padding:8px 8px;border-top:1px solid ${C.border};font-size:14px;line-height:19px;color:${C.title};font-weight:${i === 0 ? 600 : 400};vertical-align:top">${cell(v)}</td>`).join('')}</tr>`)
        .join('')}${
        doc.table.footer
          ? `<tr>${doc.table.footer.map((v) => `<td style="padding:8px 10px;border-top:2px solid ${C.border};font-size:14px;font-weight:700;color:${heat ? C.heat : C.title}">${escapeHtml(v)}</td>`).join('')}</tr>`
          : ''
      }</table>`
    : '';
  const cautions = `<table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="margin:8px 0 0 0"><tr><td style="background:${C.cautionBg};border:1px solid ${C.cautionBorder};border-radius:10px;padding:12px 14px"><p style="margin:0 0 4px 0;font-size:13px;font-weight:700;color:${C.cautionText}">Safety</p>${doc.cautions
    .map((c) => `<p style="margin:0 0 4px 0;font-size:13px;line-height:19px;color:${C.cautionText}">${escapeHtml(c)}</p>`)
    .join('')}</td></tr></table>`;
  const footerLinks = [
    doc.preferencesUrl ? `<a href="${escapeHtml(doc.preferencesUrl)}" style="color:${C.ice}">Alert preferences</a>` : '',
    doc.unsubscribe ? `<a href="${escapeHtml(doc.unsubscribe.url)}" style="color:${C.ice}">${escapeHtml(doc.unsubscribe.label)}</a>` : '',
  ]
    .filter(Boolean)
    .join(' &nbsp;&middot;&nbsp; ');
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><meta name="color-scheme" content="light"><meta name="supported-color-schemes" content="light"><title>${escapeHtml(doc.subject)}</title></head>
<body style="margin:0;padding:0;background:${C.page};font-family:${FONT}">
<div style="display:none;max-height:0;overflow:hidden;opacity:0">${escapeHtml(doc.preheader)}</div>
<table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="background:${C.page}"><tr><td align="center" style="padding:24px 12px">
<table role="presentation" cellpadding="0" cellspacing="0" border="0" width="100%" style="max-width:600px;font-family:${FONT}">
<tr><td style="background:${C.head};border-radius:16px 16px 0 0;padding:18px 24px">
<span style="font-size:20px;font-weight:700;letter-spacing:-0.01em;color:${C.headText}">Thaw<span style="color:${C.headSub}">line</span></span>
<span style="display:block;margin-top:2px;font-size:12px;color:${C.headSub}">Oil-temperature forecasts and heat plans</span>
</td></tr>
<tr><td style="height:4px;line-height:4px;font-size:0;background:${heat ? C.heatLine : C.iceLine}">&nbsp;</td></tr>
<tr><td style="background:${C.card};border:1px solid ${C.border};border-top:0;border-radius:0 0 16px 16px;padding:24px">
<span style="display:inline-block;padding:3px 10px;border-radius:999px;font-size:12px;font-weight:700;letter-spacing:0.02em;${pill}">${escapeHtml(doc.label)}</span>
<h1 style="margin:12px 0 12px 0;font-size:22px;line-height:28px;font-weight:700;color:${C.title}">${escapeHtml(doc.title)}</h1>
${doc.intro.map((t) => p(t)).join('')}
${facts}${sections}${table}
${button(doc.action.label, doc.action.url)}
${doc.secondary ? `<p style="margin:0 0 12px 0;font-size:14px;line-height:20px"><a href="${escapeHtml(doc.secondary.url)}" style="color:${C.ice};font-weight:600">${escapeHtml(doc.secondary.label)}</a></p>` : ''}
${(doc.afterAction ?? []).map((t) => p(t, `font-size:13px;line-height:19px;color:${C.muted}`)).join('')}
${cautions}
</td></tr>
<tr><td style="padding:16px 24px 0 24px;font-size:12px;line-height:18px;color:${C.muted}">
<p style="margin:0 0 6px 0">${escapeHtml(doc.reason)}</p>
${footerLinks ? `<p style="margin:0">${footerLinks}</p>` : ''}
</td></tr>
</table></td></tr></table>
</body></html>`;
}

function wrap(text: string, width = 76, indent = ''): string {
  const words = text.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let line = '';
  for (const w of words) {
    if (line && (indent + line + ' ' + w).length > width) {
      lines.push(indent + line);
      line = w;
    } else line = line ? `${line} ${w}` : w;
  }
  if (line) lines.push(indent + line);
  return lines.join('\n');
}

function bullet(text: string): string {
  return wrap(text, 76, '   ').replace(/^ {3}/, ' - ');
}

export function renderText(doc: EmailDoc): string {
  const out: string[] = [];
  out.push(`THAWLINE · ${doc.label.toUpperCase()}`, '');
  out.push(wrap(doc.title), '='.repeat(Math.min(76, doc.title.length)), '');
  for (const t of doc.intro) out.push(wrap(t), '');
  if (doc.facts?.length) {
    const w = Math.min(30, Math.max(...doc.facts.map((f) => f.label.length)) + 1);
    for (const f of doc.facts) out.push(`  ${(f.label + ':').padEnd(w)} ${f.value}`);
    out.push('');
  }
  for (const s of doc.sections ?? []) {
    out.push(s.heading);
    for (const i of s.items) out.push(bullet(i));
    out.push('');
  }
  if (doc.table) {
    out.push(doc.table.caption);
    const flat = (r: string[]) => r.map((v) => v.replace(/\n/g, ' · '));
    const body = doc.table.rows.map(flat);
    const rows = [doc.table.columns, ...body, ...(doc.table.footer ? [doc.table.footer] : [])];
    const widths = doc.table.columns.map((_, i) => Math.max(...rows.map((r) => (r[i] ?? '').length)));
    const fmt = (r: string[]) => '  ' + r.map((v, i) => (v ?? '').padEnd(widths[i])).join('  ').trimEnd();
    out.push(fmt(doc.table.columns), '  ' + widths.map((w) => '-'.repeat(w)).join('  '));
    for (const r of body) out.push(fmt(r));
    if (doc.table.footer) out.push('  ' + widths.map((w) => '-'.repeat(w)).join('  '), fmt(doc.table.footer));
    out.push('');
  }
  out.push(`${doc.action.label}:`, `  ${doc.action.url}`, '');
  if (doc.secondary) out.push(`${doc.secondary.label}:`, `  ${doc.secondary.url}`, '');
  for (const t of doc.afterAction ?? []) out.push(wrap(t), '');
  out.push('Safety');
  for (const c of doc.cautions) out.push(bullet(c));
  out.push('', '-- ', wrap(doc.reason));
  if (doc.preferencesUrl) out.push(`Alert preferences: ${doc.preferencesUrl}`);
  if (doc.unsubscribe) out.push(`${doc.unsubscribe.label}: ${doc.unsubscribe.url}`);
  return out.join('\n') + '\n';
}
