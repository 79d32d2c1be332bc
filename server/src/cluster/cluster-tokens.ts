/** Injection tokens of the cluster module (values exist only when REDIS_URL is set). */
export const CLUSTER_CONFIG = Symbol('CLUSTER_CONFIG');
export const REFIT_QUEUE = Symbol('REFIT_QUEUE');
