import type { Run } from '../../core/run/run.types';

/** A figure a view can export: SVG text built from what it drew last, and its size in CSS pixels. */
export interface ViewFigure {
  title: string;
  width: number;
  height: number;
  svg: () => string;
}

/**
 * The figures the views drew last, by title ("Tree", "Mix"), each tied to the run it shows: a view
 * that was opened keeps its figure for the Export dialog after its tab is closed, until another run
 * is shown or the view draws again. Not reactive: only the Export dialog reads it, when it runs.
 */
export class ViewFigures {
  private readonly byTitle = new Map<string, { run: Run; figure: ViewFigure }>();

  /** Records (or replaces) a view's figure of `run`. */
  set(run: Run, figure: ViewFigure): void {
    this.byTitle.set(figure.title, { run, figure });
  }

  /** Forgets a view's figure (the view has nothing to show, e.g. a run without a tree). */
  clear(title: string): void {
    this.byTitle.delete(title);
  }

  /** The figures of `run`, in the order the views first drew them. */
  of(run: Run | null): ViewFigure[] {
    if (!run) return [];
    return [...this.byTitle.values()].filter((e) => e.run === run).map((e) => e.figure);
  }
}
