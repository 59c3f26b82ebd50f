import { crc32 as nodeCrc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { crc32 } from '../../../src/core/study/crc32';
import { readZip, writeZip } from '../../../src/core/study/zip';

describe('crc32(bytes)', () => {
  it('gives the CRC-32 check value for "123456789"', () => {
    // 0xCBF43926: the check value of CRC-32 (ISO-HDLC, the ZIP CRC) in the CRC RevEng catalogue (from memory).
    expect(crc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926);
  });

  it('agrees with Node zlib.crc32 (Node 20) on random bytes', () => {
    const bytes = Uint8Array.from({ length: 5000 }, (_, i) => (i * 7919 + 13) & 0xff);
    expect(crc32(bytes)).toBe(nodeCrc32(bytes));
    expect(crc32(new Uint8Array(0))).toBe(0);
  });
});

describe('writeZip(entries) / readZip(bytes)', () => {
  const entries = [
    { name: 'study.json', data: new TextEncoder().encode('{"a":1}\n') },
    { name: 'arrays/run-1/result.labels.bin', data: Uint8Array.from([1, 0, 0, 0, 2, 0, 0, 0]) },
    { name: 'ünïcode.txt', data: new Uint8Array(0) },
  ];

  it('lays out local headers, central directory and end record as PKWARE APPNOTE 6.3 §4.3 describes', () => {
    const zip = writeZip(entries);
    const view = new DataView(zip.buffer);
    // APPNOTE §4.3.7: local file header signature 0x04034b50; §4.3.12 central 0x02014b50; §4.3.16 end 0x06054b50.
    expect(view.getUint32(0, true)).toBe(0x04034b50);
    expect(view.getUint16(8, true)).toBe(0); // compression method 0 = stored (§4.4.5)
    expect(view.getUint32(14, true)).toBe(nodeCrc32(entries[0].data));
    expect(view.getUint16(6, true) & 0x0800).toBe(0x0800); // bit 11: UTF-8 names (§4.4.4)
    const end = zip.length - 22;
    expect(view.getUint32(end, true)).toBe(0x06054b50);
    expect(view.getUint16(end + 10, true)).toBe(3);
    const cd = view.getUint32(end + 16, true);
    expect(view.getUint32(cd, true)).toBe(0x02014b50);
    expect(cd + view.getUint32(end + 12, true)).toBe(end);
  });

  it('reads back the same names and bytes, and the same entries always give the same archive', () => {
    const zip = writeZip(entries);
    expect(readZip(zip)).toEqual(entries);
    expect(writeZip(entries)).toEqual(zip);
  });

  it('rejects a damaged entry by its CRC and a cut archive', () => {
    const zip = writeZip(entries);
    const bad = zip.slice();
    bad[30 + 'study.json'.length] ^= 0xff;
    expect(() => readZip(bad)).toThrow(/entry "study.json" to match its CRC-32/);
    expect(() => readZip(zip.slice(0, 40))).toThrow(/no end-of-central-directory/);
  });
});
