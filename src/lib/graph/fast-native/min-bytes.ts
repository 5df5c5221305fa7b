/**
 * Below this size the full reader is as fast or faster, and the command line does not try the
 * fast path (nor load its code): JSON.parse is native code from the first byte, while the
 * scanner is JavaScript that the JIT must first compile, about 0.1 s of CPU per process.
 * Measured whole `causeway dsep` processes, alternating (bench/cli-diagram.ts files, shared
 * 2-core machine at load 13–17): 1.1 MiB (10,000 variables) 0.46 s full reader vs 0.54 s fast;
 * 2.3 MiB 0.70 vs 0.60; 3.6 MiB 0.66 vs 0.59; 11.5 MiB 1.1 vs 0.55.
 */
export const FAST_READ_MIN_BYTES = 2 * 1024 * 1024;
