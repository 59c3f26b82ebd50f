import { Worker } from 'node:worker_threads';

/**
 * Starts a worker thread on one of the CLI's thread entries (a module next to this one). From
 * the built CLI (dist-cli/*.js) the thread runs `<name>.js` directly. From source (`node --import
 * tsx`), Node 20 does not apply the parent's module hooks to a worker's entry file, so the thread
 * first registers tsx itself and then imports `<name>.ts`.
 */
export function spawnThread(name: 'thread-entry' | 'csv-part-thread', workerData?: unknown): Worker {
  const fromSource = import.meta.url.endsWith('.ts');
  const entry = new URL(fromSource ? `./${name}.ts` : `./${name}.js`, import.meta.url);
  if (!fromSource) return new Worker(entry, { workerData });
  const tsx = import.meta.resolve('tsx/esm/api');
  const boot = `import(${JSON.stringify(tsx)}).then((m) => { m.register(); return import(${JSON.stringify(entry.href)}); })`;
  return new Worker(boot, { eval: true, workerData });
}
