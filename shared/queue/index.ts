// Distributed runs through a BullMQ queue on Redis: `run --queue` puts a run's batches on
// the queue (producer.ts), `filmsweep worker` processes take, compute and store them
// (consumer.ts); the store's idempotent batch writer stores a batch computed twice once.
export { parseQueueUrl, QUEUE_NAME, DEFAULT_PREFIX, type QueueTarget } from './target.js';
export { batchJobId, jobIdPrefix, planBatches, pointsIn, parseBatchJob, BATCH_JOB, type BatchJobData, type BatchJobResult } from './jobs.js';
export { runOnQueue, resumeOnQueue, queueBatchSize, JOB_ATTEMPTS, type QueueRunOptions, type QueueResumeOptions } from './producer.js';
export { startQueueWorker, type QueueWorkerOptions, type QueueWorkerHandle } from './consumer.js';
export { DEFAULT_LOCK_DURATION_MS, DEFAULT_STALLED_INTERVAL_MS, DEFAULT_MAX_STALLED } from './defaults.js';
