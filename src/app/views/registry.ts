import type { Component } from 'svelte';

/**
 * The views shown in the dock beside the Map. Each view is one component that reads the app
 * state from context (useApp) and shares the one selection; adding a view is one entry here.
 */
export interface ViewEntry {
  id: string;
  title: string;
  /** One line shown as the tab's tooltip. */
  hint: string;
  component: Component;
}

export const VIEWS: ViewEntry[] = [];
