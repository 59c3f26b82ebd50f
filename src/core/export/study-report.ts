import { thousands } from './csv';
export interface ReportCluster {
  /** The cluster's number (index + 1), as on screen and in every export. */
  id: number;
  name: string;
  className: string;
  size: number;
  /** "#rrggbb" swatch ('' = none). */
  colour: string;
  setAside: boolean;
  /** Composition flags with their reasons, e.g. "subject-bound: …; subject S07 holds 91% of its 240 windows". */
  flags: string[];
  description?: string;
}

export interface ReportFigure {
  title: string;
  /** An inline SVG document ("<svg ...>...</svg>") drawn by the caller. */
  svg: string;
  caption?: string;
}

/** One figure of the run, rounded for reading, with what it means. */
export interface ReportMetric {
  name: string;
  /** The value as the reader should see it (rounded, with thousands separators). */
  value: string;
  /** What the number says, in a few words ("−1 to 1; higher = clusters further apart"). */
  meaning: string;
}

/** One line of the provenance table: what the export was made from and how. */
export interface ReportFact {
  name: string;
  value: string;
}

export interface StudyReportInput {
  title: string;
  appVersion: string;
  /** ISO 8601 time, from the caller's clock. */
  createdAt: string;
  clusters: ReportCluster[];
  metrics: ReportMetric[];
  figures: ReportFigure[];
  cautions: readonly string[];
  /** Provenance in words: input, recipe, map, clustering, seed, version. */
  facts: ReportFact[];
  /** The full provenance document (buildProvenance), attached folded at the end. */
  provenance: unknown;
  notes?: string;
}

/** HTML-escapes text for element content and quoted attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/**
 * An SVG is inlined only when it is a plain <svg> element with nothing that can run or load
 * (no script, foreignObject, event handler attributes, external or javascript: references);
 * otherwise the figure is replaced by a note.
 */
export function safeSvg(svg: string): string | null {
  const s = svg.trim();
  if (!/^<svg[\s>]/i.test(s) || !/<\/svg>$/i.test(s)) return null;
  if (/<\s*(script|foreignObject|iframe|object|embed|image|use)\b/i.test(s)) return null;
  if (/\son[a-z]+\s*=/i.test(s) || /javascript:/i.test(s) || /(href|src)\s*=\s*["']?\s*(https?:|\/\/|data:)/i.test(s)) return null;
  return s;
}

const COLOUR = /^#[0-9a-f]{6}$/i;

/**
 * A self-contained HTML study report: title, cautions, the run's figures rounded with their
 * meaning, the cluster table (number, name, class, size, colour, composition flags), the caller's
 * captioned SVG figures, the provenance as a table and the full provenance JSON folded at the end.
 * Everything from the study is escaped; no scripts, no external resources.
 */
export function studyReportHtml(r: StudyReportInput): string {
  const e = escapeHtml;
  const metricRows = r.metrics.map((m) => `<tr><th scope="row">${e(m.name)}</th><td class="num">${e(m.value)}</td><td class="meaning">${e(m.meaning)}</td></tr>`);
  const factRows = r.facts.map((f) => `<tr><th scope="row">${e(f.name)}</th><td>${e(f.value)}</td></tr>`);
  const clusterRows = r.clusters.map((c) => {
    const swatch = COLOUR.test(c.colour) ? `<span class="swatch" style="background:${c.colour}"></span>` : '';
    return `<tr><td>${c.id}</td><td>${swatch}${e(c.name)}</td><td>${e(c.className || (c.setAside ? 'set aside' : 'candidate'))}</td>`
      + `<td class="num">${thousands(c.size)}</td><td>${e(c.flags.join('; '))}</td><td>${e(c.description ?? '')}</td></tr>`;
  });
  const figures = r.figures.map((f) => {
    const svg = safeSvg(f.svg);
    return `<figure><figcaption>${e(f.title)}</figcaption>${svg ?? '<p class="note">(figure left out: not a plain SVG)</p>'}${f.caption ? `<p class="caption">${e(f.caption)}</p>` : ''}</figure>`;
  });
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>${e(r.title)}</title>
<style>
body{font-family:system-ui,sans-serif;margin:2rem auto;max-width:60rem;padding:0 1rem;color:#222}
table{border-collapse:collapse;margin:1rem 0}th,td{border:1px solid #ccc;padding:.25rem .5rem;text-align:left}
td.num{text-align:right}.swatch{display:inline-block;width:.8em;height:.8em;margin-right:.4em;border:1px solid #888}
.cautions{border-left:4px solid #e69f00;padding:.5rem 1rem;background:#fff8e6}pre{white-space:pre-wrap;font-size:.85em}
figure{margin:1rem 0}figcaption{font-weight:600}.caption,.meaning{color:#555;font-size:.9em}details{margin:1rem 0}
</style>
</head>
<body>
<h1>${e(r.title)}</h1>
<p>Gleaner ${e(r.appVersion)}, ${e(r.createdAt)}</p>
<section class="cautions"><h2>Cautions</h2><ul>${r.cautions.map((c) => `<li>${e(c)}</li>`).join('')}</ul></section>
${r.notes ? `<section><h2>Notes</h2><p>${e(r.notes)}</p></section>\n` : ''}<section><h2>Run</h2><table><thead><tr><th>Figure</th><th>Value</th><th>What it says</th></tr></thead><tbody>${metricRows.join('')}</tbody></table></section>
<section><h2>Clusters</h2><table><thead><tr><th>#</th><th>Name</th><th>Class</th><th>Windows</th><th>Flags</th><th>Description</th></tr></thead><tbody>${clusterRows.join('')}</tbody></table></section>
<section><h2>Figures</h2>${figures.join('\n')}</section>
<section><h2>Provenance</h2><table>${factRows.join('')}</table>
<details><summary>The full provenance record (JSON, as in the exported provenance file)</summary><pre>${e(JSON.stringify(r.provenance, null, 2))}</pre></details></section>
</body>
</html>
`;
}
