import { loadConfig } from '../../backend/src/config';
import { startServer } from '../../backend/src/server';

/**
 * The API for the ingest benchmark, in its own process so its memory is measured alone. Samples RSS every
 * 20 ms and answers the parent's `{ cmd: 'rss' }` with the baseline and the peak since the last `reset`, and
 * `{ cmd: 'cpu' }` with the CPU time it has used (the API benchmark's per-request cost).
 */
const server = await startServer(loadConfig(), { dbAttempts: 5 });
let peak = process.memoryUsage().rss;
let baseline = peak;
const timer = setInterval(() => {
  peak = Math.max(peak, process.memoryUsage().rss);
}, 20);
process.on('message', async (message: { cmd: string }) => {
  if (message.cmd === 'reset') {
    global.gc?.();
    baseline = process.memoryUsage().rss;
    peak = baseline;
    process.send!({ baseline });
  } else if (message.cmd === 'rss') {
    process.send!({ baseline, peak });
  } else if (message.cmd === 'cpu') {
    const { user, system } = process.cpuUsage();
    process.send!({ cpuMs: (user + system) / 1000 });
  } else if (message.cmd === 'stop') {
    clearInterval(timer);
    await server.stop();
    process.exit(0);
  }
});
process.send!({ url: server.url });
