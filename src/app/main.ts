import { mount } from 'svelte';
import { pickHost } from '../host';
import App from './App.svelte';
import { installTestHook } from './test-hook';
import { AppState } from './state/app.svelte';
import './theme.css';

const app = new AppState(pickHost());
installTestHook(app);
const host = app.host;
host.onMenuCommand?.((command) => void (command === 'open' ? app.openFromHost() : app.exportLabels()));
mount(App, { target: document.getElementById('app')!, props: { app } });
void app.studyFile.start();

if (new URLSearchParams(location.search).get('demo') === '1') void app.openDemo(true);
