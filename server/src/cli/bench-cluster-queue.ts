/** The queue bench:cluster's parent fills and its worker processes drain (never the application's). */
export const BENCH_QUEUE = 'morrowline-bench-refits';
