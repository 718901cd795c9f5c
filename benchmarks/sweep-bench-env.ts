/** The sweep benchmark's database, set before any server module reads the environment (import this first). */
export const BENCH_DATABASE = 'osmolane_bench_sweep';
process.env['PGDATABASE'] = BENCH_DATABASE;
process.env['PGPORT'] ??= '55432';
process.env['PGHOST'] ??= '127.0.0.1';
process.env['LOG_REQUESTS'] = '0';
