import { getContext, setContext } from 'svelte';
import type { AppState } from './app.svelte';

const KEY = Symbol('gleaner-app');

export function provideApp(app: AppState): void {
  setContext(KEY, app);
}

/** The app state, provided once by App.svelte. */
export function useApp(): AppState {
  return getContext<AppState>(KEY);
}
