// Imported first by child.ts, before any reader or library: libraries that keep their own alias
// of a typed-array constructor (`const u8 = Uint8Array`) take it when they load, so the guard must
// be in place by then. The limit is child.ts's fifth argument.
import { guardAllocations } from './alloc-guard';

guardAllocations(Number(process.argv[6]));
