import { connect } from 'node:net';

export interface RawAnswer {
  status: number;
  headers: Record<string, string>;
  body: Buffer;
}

/**
 * Sends one HTTP/1.1 request exactly as written (request target and headers untouched, unlike
 * fetch or http.request, which normalise paths and set Host themselves) and reads the answer to
 * the end of the connection. `headers` is a list of "Name: value" lines; "Connection: close" is added.
 */
export function rawRequest(port: number, method: string, target: string, headers: string[]): Promise<RawAnswer> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    const chunks: Buffer[] = [];
    socket.setTimeout(10_000, () => socket.destroy(new Error(`no answer to ${method} ${target} within 10 s`)));
    socket.on('data', (c) => chunks.push(c));
    socket.on('error', reject);
    socket.on('end', () => {
      const all = Buffer.concat(chunks);
      const split = all.indexOf('\r\n\r\n');
      if (split < 0) return reject(new Error(`no complete answer to ${method} ${target}: ${JSON.stringify(all.toString('latin1'))}`));
      const [statusLine, ...lines] = all.subarray(0, split).toString('latin1').split('\r\n');
      const out: Record<string, string> = {};
      for (const line of lines) {
        const colon = line.indexOf(':');
        out[line.slice(0, colon).trim().toLowerCase()] = line.slice(colon + 1).trim();
      }
      resolve({ status: Number(statusLine.split(' ')[1]), headers: out, body: all.subarray(split + 4) });
    });
    socket.write([`${method} ${target} HTTP/1.1`, ...headers, 'Connection: close', '', ''].join('\r\n'));
  });
}
