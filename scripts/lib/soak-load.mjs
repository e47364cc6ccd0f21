// The visitors of `npm run soak`, in a worker thread of their own so the front port (in the main thread) keeps its
// event loop: autocannon with the given connections and duration; each failed request (connection error, timeout or
// an answer outside 2xx) is reported with its time, so the soak can tell errors before, during and after a fault.
import { parentPort, workerData } from 'node:worker_threads';
import autocannon from 'autocannon';

const { url, headers, connections, duration } = workerData;
const failedAt = [];
const statuses = {};
const opts = { url, headers, connections, duration, timeout: 10 };
const instance = autocannon(opts, (err, raw) => {
  if (err) {
    parentPort.postMessage({ error: err.message });
    return;
  }
  // Outside the main thread autocannon leaves its histograms encoded: its own aggregateResult() reads them.
  const result = autocannon.aggregateResult([raw], opts);
  parentPort.postMessage({
    requests: result.requests.total,
    rps: result.requests.total / result.duration,
    p99: result.latency.p99,
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
    statuses,
    failedAt,
  });
});
instance.on('response', (_client, status) => {
  statuses[status] = (statuses[status] ?? 0) + 1;
  if (status < 200 || status > 299) failedAt.push(Date.now());
});
instance.on('reqError', () => failedAt.push(Date.now()));
