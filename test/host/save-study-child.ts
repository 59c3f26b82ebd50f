// A child process for test/host/study-save-crash.test.ts: saves a study to argv[2] as the desktop
// app's main process does (electron/atomic-write.ts), with notes of argv[3] bytes, and writes
// slowly (an empty temporary file for 150 ms, then 16 KiB every 10 ms) so that the test can kill
// it mid-write. Prints "saved" when done.
import { open } from 'node:fs/promises';
import { writeFileAtomic } from '../../electron/atomic-write.ts';
import { encodeStudy } from '../../src/core/study/encode';
import { smallStudy } from '../core/study/fixture';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const probe = await open(process.execPath, 'r');
const proto = Object.getPrototypeOf(probe) as { writeFile: (data: Uint8Array) => Promise<void>; write: (b: Uint8Array, o: number, n: number) => Promise<{ bytesWritten: number }> };
await probe.close();
proto.writeFile = async function slowWriteFile(this: typeof proto, data: Uint8Array) {
  await sleep(150);
  for (let at = 0; at < data.length;) {
    at += (await this.write(data, at, Math.min(16 * 1024, data.length - at))).bytesWritten;
    await sleep(10);
  }
};

const [target, noteBytes] = process.argv.slice(2);
await writeFileAtomic(target, encodeStudy({ ...smallStudy(), notes: 'second save '.padEnd(Number(noteBytes), 'x') }));
console.log('saved');
