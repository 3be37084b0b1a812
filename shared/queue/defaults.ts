// The worker's timing defaults, apart from consumer.ts so that `--help` need not load BullMQ.

/** BullMQ's own defaults; a dead worker's batch is taken over within about their sum. */
export const DEFAULT_LOCK_DURATION_MS = 30_000;
export const DEFAULT_STALLED_INTERVAL_MS = 30_000;
/**
 * How often one job may be taken back from a dead worker before it counts as failed
 * (BullMQ's default is 1). A batch is not a poison pill because its worker was killed.
 */
export const DEFAULT_MAX_STALLED = 10;
