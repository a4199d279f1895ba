import type { Benchmark } from './harness.js';

/** Benchmarks of this layer (none yet). Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [];
