import type { Table } from '../../core/table/table';
import type { FileToWrite } from '../../host/host';
import { CAUTIONS } from '../../core/cautions';
import { studyExports } from '../../core/export/study-exports';
import { studyReportHtml, type ReportCluster, type ReportFigure } from '../../core/export/study-report';
import { clusterInWords, embedInWords, reportFacts, reportMetrics, thousands } from '../../core/export/report-facts';
import type { Recipe } from '../../core/recipe/recipe.types';
import type { StudyRun } from '../../core/study/study.types';

/** Feature columns the run used. */
function featureCount(run: StudyRun): number {
  return run.roles.filter((r) => r.role === 'feature').length;
}
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
  /** The silhouette the cluster list shows (the run's, or measured on the curated clusters). */
  silhouette: { value: number; sampleSize: number; curated: boolean } | null;
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
  const input = doc.inputs[run.input];
  const base = baseName(input.fileName);
  const map = mapSvg(args.map);
  const figures: ReportFigure[] = [{
    title: 'Map',
    svg: map.svg,
    caption: `${embedInWords(run.result.embed)}. Coloured by cluster (numbers and names as in the cluster table); seed ${String(run.params.seed)}; `
      + (map.shown < map.total ? `a sample of ${thousands(map.shown)} of ${thousands(map.total)} windows drawn.` : `all ${thousands(map.total)} windows drawn.`),
  }];
  const viewCaption = (title: string) => `${title}, drawn from the shown run (${clusterInWords(run.result.cluster)}; seed ${String(run.params.seed)}) with the curation applied.`;
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
    others.push({ title: f.title, svg, caption: viewCaption(f.title) });
  }
  for (const f of onScreen) {
    files.push({ name: `${base}-${slug(f.title)}.svg`, data: f.svg });
    others.push({ ...f, caption: viewCaption(f.title) });
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
        metrics: reportMetrics({
          windows: run.result.labels.length,
          clusters: args.clusters.length,
          setAside: args.clusters.filter((c) => c.setAside).length,
          silhouette: args.silhouette,
          embed: run.result.embed,
        }),
        figures: [...figures, ...others],
        cautions: CAUTIONS,
        facts: reportFacts({
          input: { fileName: input.fileName, sha256: input.sha256, rows: run.result.labels.length, features: featureCount(run) },
          recipe: (run.params as { recipe?: Recipe }).recipe,
          result: run.result,
          seed: Number(run.params.seed),
          appVersion: args.appVersion,
          createdAt: args.createdAt,
        }),
        provenance,
        notes: doc.notes,
      }),
    });
  }
  return files;
}
