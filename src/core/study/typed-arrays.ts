/** The typed arrays a study may hold, by the dtype name written in study.json. */
export const DTYPES = {
  int8: Int8Array,
  uint8: Uint8Array,
  int16: Int16Array,
  uint16: Uint16Array,
  int32: Int32Array,
  uint32: Uint32Array,
  float32: Float32Array,
  float64: Float64Array,
} as const;

export type Dtype = keyof typeof DTYPES;
export type StudyArray = InstanceType<(typeof DTYPES)[Dtype]>;

const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

export function dtypeOf(value: unknown): Dtype | null {
  for (const [name, ctor] of Object.entries(DTYPES)) if (value instanceof ctor) return name as Dtype;
  return null;
}

/** The array's values as little-endian bytes (a copy). */
export function arrayBytes(a: StudyArray): Uint8Array {
  const bytes = new Uint8Array(a.buffer, a.byteOffset, a.byteLength).slice();
  if (!LITTLE_ENDIAN && a.BYTES_PER_ELEMENT > 1) swap(bytes, a.BYTES_PER_ELEMENT);
  return bytes;
}

/** An array of `dtype` from little-endian bytes; null when the byte count does not fit `length`. */
export function arrayFromBytes(dtype: Dtype, bytes: Uint8Array, length: number): StudyArray | null {
  const ctor = DTYPES[dtype];
  if (bytes.length !== length * ctor.BYTES_PER_ELEMENT) return null;
  const copy = bytes.slice();
  if (!LITTLE_ENDIAN && ctor.BYTES_PER_ELEMENT > 1) swap(copy, ctor.BYTES_PER_ELEMENT);
  return new ctor(copy.buffer, 0, length);
}

function swap(bytes: Uint8Array, width: number): void {
  for (let i = 0; i < bytes.length; i += width) bytes.subarray(i, i + width).reverse();
}
