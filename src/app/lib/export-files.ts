import type { Table } from '../../core/table/table';
import type { FileToWrite } from '../../host/host';
import { CAUTIONS } from '../../core/cautions';
import { studyExports } from '../../core/export/study-exports';
import { studyReportHtml, type ReportCluster, type ReportFigure } from '../../core/export/study-report';
import type { Study } from '../../core/study/study.types';
import type { ViewFigure } from './figures';
import { mapPng, mapSvg, type MapFigureInput } from './map-figure';
import { svgToPng } from './svg-png';

/** The file name without its last extension ("windows.csv" → "windows"). */
export function baseName(fileName: string): string {
  const dot = fileName.lastIndexOf('.');
  return dot > 0 ? fileName.slice(0, dot) : fileName;
}

/** What the Export dialog writes: the study exports of the shown run, the report and the figures. */
export interface ExportChoice {
  events: boolean;
  report: boolean;
  mapSvg: boolean;
  mapPng: boolean;
  /** Figures of the views opened on this run (Tree, Mix: SVG and PNG) and of on-screen <svg data-figure>. */
  viewFigures: boolean;
}

/** The figures other views offer: each view marks its <svg> with data-figure="<title>". */
export function viewFigures(root: ParentNode = document): ReportFigure[] {
  return [...root.querySelectorAll('svg[data-figure]')].map((el) => {
    const svg = el.cloneNode(true) as SVGElement;
    svg.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
    return { title: el.getAttribute('data-figure') ?? 'figure', svg: svg.outerHTML };
  });
}

/** A plain file name from a figure title ("Mix: subject" → "mix-subject"). */
function slug(title: string): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'figure';
}

export async function exportDialogFiles(args: {
  doc: Study;
  table: Table;
  choice: ExportChoice;
  map: MapFigureInput;
  clusters: ReportCluster[];
  /** Figures the views drew for this run (app.figures). */
  figures?: ViewFigure[];
  appVersion: string;
  createdAt: string;
}): Promise<FileToWrite[]> {
  const { doc, choice } = args;
  const run = doc.runs[doc.activeRun];
  if (!run) throw new Error('there is no run to export: press Run first');
  const files: FileToWrite[] = studyExports({
    study: doc, run: doc.activeRun, table: args.table, appVersion: args.appVersion, createdAt: args.createdAt, events: choice.events,
  });
  const base = baseName(doc.inputs[run.input].fileName);
  const map = mapSvg(args.map);
  const figures: ReportFigure[] = [{
    title: 'Map',
    svg: map.svg,
    caption: map.shown < map.total ? `Sampled: ${map.shown} of ${map.total} windows drawn.` : `${map.total} windows.`,
  }];
  const drawn = choice.viewFigures ? (args.figures ?? []) : [];
  const titles = new Set(drawn.map((f) => f.title));
  const onScreen = choice.viewFigures ? viewFigures().filter((f) => !titles.has(f.title)) : [];
  if (choice.mapSvg) files.push({ name: `${base}-map.svg`, data: map.svg });
  if (choice.mapPng) files.push({ name: `${base}-map.png`, data: await mapPng(args.map) });
  const others: ReportFigure[] = [];
  for (const f of drawn) {
    const svg = f.svg();
    files.push({ name: `${base}-${slug(f.title)}.svg`, data: svg });
    files.push({ name: `${base}-${slug(f.title)}.png`, data: await svgToPng(svg, f.width, f.height) });
    others.push({ title: f.title, svg });
  }
  for (const f of onScreen) {
    files.push({ name: `${base}-${slug(f.title)}.svg`, data: f.svg });
    others.push(f);
  }
  if (choice.report) {
    const provenanceFile = files.find((f) => f.name.endsWith('-provenance.json'));
    const provenance: unknown = provenanceFile ? JSON.parse(String(provenanceFile.data)) : {};
    files.push({
      name: `${base}-report.html`,
      data: studyReportHtml({
        title: `Gleaner study of ${doc.inputs[run.input].fileName}`,
        appVersion: args.appVersion,
        createdAt: args.createdAt,
        clusters: args.clusters,
        metrics: { windows: args.table.nRows, k: run.result.cluster.k, 'mean silhouette': run.result.metrics.silhouette, seed: Number(run.params.seed) },
        figures: [...figures, ...others],
        cautions: CAUTIONS,
        provenance,
        notes: doc.notes,
      }),
    });
  }
  return files;
}
