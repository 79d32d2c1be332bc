// Imported first by ../worker.ts: the process is a worker before the cluster module reads its
// configuration (cluster-config.ts), whatever the environment says.
process.env.MORROWLINE_ROLE = 'worker';
