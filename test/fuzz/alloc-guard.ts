// Refuses, in the fuzzing process, any single typed-array or ArrayBuffer allocation larger than a
// limit: a reader that sizes a buffer from an unchecked field of a small damaged file shows up as
// an AllocationRefused error (a finding) instead of taking the machine's memory.
import { AllocationRefused } from './allocation-refused';

const CONSTRUCTORS = ['ArrayBuffer', 'SharedArrayBuffer', 'Uint8Array', 'Int8Array', 'Uint8ClampedArray', 'Uint16Array', 'Int16Array', 'Uint32Array', 'Int32Array', 'Float32Array', 'Float64Array', 'BigInt64Array', 'BigUint64Array'] as const;

/** Bytes a constructor call asks for: a length argument times the element size (0 for views of existing buffers). */
function requested(name: string, args: unknown[], perElement: number): number {
  const first = args[0];
  if (typeof first === 'number') return first * (name.endsWith('Buffer') ? 1 : perElement);
  if (first !== null && typeof first === 'object' && !(first instanceof ArrayBuffer) && !(typeof SharedArrayBuffer !== 'undefined' && first instanceof SharedArrayBuffer)) {
    const length = (first as { length?: unknown }).length;
    if (typeof length === 'number') return length * perElement;
  }
  return 0;
}

/** Installs the guard; every larger request throws AllocationRefused. */
export function guardAllocations(limitBytes: number): void {
  const g = globalThis as unknown as Record<string, unknown>;
  for (const name of CONSTRUCTORS) {
    const original = g[name] as (new (...args: unknown[]) => unknown) & { BYTES_PER_ELEMENT?: number };
    if (typeof original !== 'function') continue;
    const perElement = original.BYTES_PER_ELEMENT ?? 1;
    g[name] = new Proxy(original, {
      construct(target, args, newTarget) {
        const bytes = requested(name, args, perElement);
        if (bytes > limitBytes) throw new AllocationRefused(bytes, limitBytes);
        return Reflect.construct(target, args, newTarget === g[name] ? target : newTarget);
      },
    });
  }
}
