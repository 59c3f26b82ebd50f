/** Thrown by the allocation guard (alloc-guard.ts) instead of allocating. */
export class AllocationRefused extends Error {
  constructor(readonly bytes: number, readonly limit: number) {
    super(`an allocation of ${bytes} bytes (limit ${limit})`);
    this.name = 'AllocationRefused';
  }
}
