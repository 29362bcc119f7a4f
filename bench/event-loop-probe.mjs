// Loaded into the server process by the health benchmark (node --import): on SIGUSR2 the main thread
// prints how long its event loop was held up since the last signal, then starts counting again.
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { isMainThread } from 'node:worker_threads';

if (isMainThread) {
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  process.on('SIGUSR2', () => {
    console.error(`[event-loop] max ${(h.max / 1e6).toFixed(0)} p99 ${(h.percentile(99) / 1e6).toFixed(0)}`);
    h.reset();
  });
}
