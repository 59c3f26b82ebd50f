import { cluster, hierarchy } from 'd3-hierarchy';
import type { SummaryNode } from './summary';

export type Orientation = 'vertical' | 'horizontal';

/** One drawn node: where it sits along the leaf axis (pixels) and its merge height. */
export interface PlacedNode {
  node: SummaryNode;
  along: number;
  height: number;
  /** Height of the parent (the root: its own height). */
  parentHeight: number;
  /** Along-positions of its first and last child (internal drawn nodes). */
  childFrom: number;
  childTo: number;
  /** Along-positions of its first and last terminal (the band a hover lights up). */
  spanFrom: number;
  spanTo: number;
}

export interface TreeLayout {
  nodes: PlacedNode[];
  /** Height of the root (the top of the height axis). */
  top: number;
  orientation: Orientation;
  /** The drawing box: the leaf axis spans `length` pixels, the height axis `depth` pixels. */
  box: { left: number; top: number; width: number; height: number };
}

/**
 * Places the summarised tree: d3-hierarchy's cluster() spreads the terminals evenly along the leaf
 * axis in dendrogram order (children left first) and centres each parent over its children; the
 * other axis is the merge height (0 at the leaves), not the depth, so the cut line reads as a height.
 */
export function layoutTree(root: SummaryNode, orientation: Orientation, box: TreeLayout['box']): TreeLayout {
  const length = orientation === 'vertical' ? box.width : box.height;
  const h = hierarchy(root, (d) => d.children);
  cluster<SummaryNode>().size([length, 1]).separation(() => 1)(h);
  const nodes: PlacedNode[] = [];
  h.each((d) => {
    const kids = d.children ?? [];
    const terminals = d.leaves();
    nodes.push({
      node: d.data,
      along: d.x ?? 0,
      height: d.data.height,
      parentHeight: d.parent ? d.parent.data.height : d.data.height,
      childFrom: kids.length ? (kids[0].x ?? 0) : d.x ?? 0,
      childTo: kids.length ? (kids[kids.length - 1].x ?? 0) : d.x ?? 0,
      spanFrom: terminals[0].x ?? 0,
      spanTo: terminals[terminals.length - 1].x ?? 0,
    });
  });
  return { nodes, top: root.height || 1, orientation, box };
}

/** Screen position of (along, height) in the layout's box: leaves at the bottom (vertical) or right (horizontal). */
export function toScreen(layout: TreeLayout, along: number, height: number): [number, number] {
  const { box, top, orientation } = layout;
  const f = Math.max(0, Math.min(1, height / top));
  if (orientation === 'vertical') return [box.left + along, box.top + (1 - f) * box.height];
  return [box.left + (1 - f) * box.width, box.top + along];
}

/** The height at a screen position (for dragging the cut line). */
export function heightAt(layout: TreeLayout, x: number, y: number): number {
  const { box, top, orientation } = layout;
  const f = orientation === 'vertical' ? 1 - (y - box.top) / box.height : 1 - (x - box.left) / box.width;
  return Math.max(0, Math.min(1, f)) * top;
}
