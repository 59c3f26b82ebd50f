// Preloaded into a CLI child by the crash tests (`node --import ./test/cli/slow-writes.mjs ...`):
// a temporary file (name ending in ".tmp") stays empty for 150 ms after it is opened, then its data
// go out in 16 KiB pieces with a 10 ms pause after each, so that a test can kill the process while
// an output is being written. Nothing else
// changes: the CLI's own code runs as it is.
import fs from 'node:fs';
import { syncBuiltinESMExports } from 'node:module';

const PIECE = 16 * 1024;
const PAUSE_MS = 10;
const OPEN_PAUSE_MS = 150;
const pause = new Int32Array(new SharedArrayBuffer(4));
const tempFds = new Set();
const { openSync, writeSync, closeSync } = fs;

fs.openSync = function (path, ...rest) {
  const fd = openSync.call(this, path, ...rest);
  if (String(path).endsWith('.tmp')) {
    tempFds.add(fd);
    Atomics.wait(pause, 0, 0, OPEN_PAUSE_MS);
  }
  return fd;
};
fs.writeSync = function (fd, buffer, offset, length, ...rest) {
  if (!tempFds.has(fd) || typeof buffer === 'string') return writeSync.call(this, fd, buffer, offset, length, ...rest);
  const n = Math.min(length ?? buffer.length - (offset ?? 0), PIECE);
  const written = writeSync.call(this, fd, buffer, offset, n, ...rest);
  Atomics.wait(pause, 0, 0, PAUSE_MS);
  return written;
};
fs.closeSync = function (fd) {
  tempFds.delete(fd);
  return closeSync.call(this, fd);
};
// ES modules that import { writeSync } from 'node:fs' see the replacements too.
syncBuiltinESMExports();
