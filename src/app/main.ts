import { mount } from 'svelte';
import { pickHost } from '../host';
import App from './App.svelte';
import { installTestHook } from './test-hook';
import { AppState } from './state/app.svelte';
import './theme.css';

const app = new AppState(pickHost());
// The end-to-end tests ask for the read-only test view before the page loads (test/e2e/harness.ts);
// an ordinary start never installs it.
if ((window as unknown as { __gleanerWantsTestHook?: boolean }).__gleanerWantsTestHook === true) installTestHook(app);
const host = app.host;
host.onMenuCommand?.((command) => {
  if (command === 'open') void app.openFromHost();
  else if (app.study.run) app.studyFile.exportOpen = true; // the one Export, with its choices
});
mount(App, { target: document.getElementById('app')!, props: { app } });
void app.studyFile.start();

if (new URLSearchParams(location.search).get('demo') === '1') void app.openDemo(true);
