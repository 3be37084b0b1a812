// Ctrl-C and SIGTERM during a run: the first asks the runner to stop scheduling and
// commit the batches in flight (the run ends `interrupted`, resumable); a second one
// drops the batches in flight as well.
export interface InterruptHandle {
  /** Aborted by the first SIGINT/SIGTERM. */
  stop: AbortSignal;
  /** Aborted by the second. */
  cancel: AbortSignal;
  /** Which signal arrived first, if any. */
  readonly received: NodeJS.Signals | undefined;
  /** Restores the default signal behaviour. */
  dispose(): void;
}

export function captureInterrupts(notify: (message: string) => void = () => {}): InterruptHandle {
  const stop = new AbortController();
  const cancel = new AbortController();
  let received: NodeJS.Signals | undefined;
  const onSignal = (signal: NodeJS.Signals) => {
    if (!stop.signal.aborted) {
      received = signal;
      notify(`${signal}: stopping after the batches in flight (again to drop them)`);
      stop.abort();
    } else if (!cancel.signal.aborted) {
      notify(`${signal}: dropping the batches in flight`);
      cancel.abort();
    }
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  return {
    stop: stop.signal,
    cancel: cancel.signal,
    get received() {
      return received;
    },
    dispose() {
      process.off('SIGINT', onSignal);
      process.off('SIGTERM', onSignal);
    },
  };
}
