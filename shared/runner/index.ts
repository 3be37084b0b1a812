// The sweep runner: worker-thread pool, batching, and the run/resume orchestration.
export {
  prepareStudy,
  runStudy,
  resumeRun,
  runStudyFile,
  type PreparedStudy,
  type RunOptions,
  type ResumeOptions,
  type RunFileOptions,
  type RunOutcome,
  type RunProgress,
} from './run-study.js';
export { BatchSizer, TARGET_BATCH_MS, MIN_BATCH, MAX_BATCH_RESULTS, maxBatchPoints } from './batches.js';
export { defaultWorkers, gitCommit, hostName, processAlive } from './environment.js';
export { workerFile } from './pool.js';
export { captureInterrupts, type InterruptHandle } from './interrupts.js';
