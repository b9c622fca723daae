import cluster from 'node:cluster';
import { createServer } from 'node:http';

/**
 * The production HTTP server: Next's request handler behind a plain Node server, so that the
 * client address the app sees comes from the socket and not from a header anyone can send.
 * (Next itself keeps a client-supplied X-Forwarded-For.) Set TRUST_PROXY=1 only behind a
 * reverse proxy you run, which then owns that header.
 *
 * APP_WORKERS=N (default 1) runs N such servers on the one port (node:cluster; the app keeps
 * no state of its own beyond the per-process ingest rate limit, see lib/ingest/rate-limit.ts).
 * A worker that dies is started again; SIGTERM stops them all.
 */
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';
const trustProxy = process.env.TRUST_PROXY === '1';

// Next and the routes are loaded in the serving process only, so a supervisor stays small.
async function startServer() {
  // The ingest route first: it keeps the Date constructor from before Next wraps it (see
  // lib/ingest/fast-reading.ts).
  const { isFastRoute, serveFastRoute } = await import('./fast-routes');
  const { default: next } = await import('next');
  const app = next({ dev: false, hostname: host, port, dir: process.cwd() });
  const handle = app.getRequestHandler();

  app.prepare().then(() => {
    const server = createServer((req, res) => {
      if (!trustProxy) {
        req.headers['x-forwarded-for'] = req.socket.remoteAddress ?? 'unknown';
        delete req.headers['x-real-ip'];
      }
      // Internal header of Next's; a client must never be able to send it.
      delete req.headers['x-middleware-subrequest'];
      if (isFastRoute(req)) {
        serveFastRoute(req, res).catch(() => { if (!res.headersSent) res.writeHead(500); res.end(); });
        return;
      }
      handle(req, res);
    });
    server.keepAliveTimeout = 65_000;
    server.listen(port, host, () => console.log(`duskwatch app on http://${host}:${port}`));
    const stop = () => server.close(() => process.exit(0));
    process.on('SIGTERM', stop);
    process.on('SIGINT', stop);
  });
}

function superviseWorkers(count: number) {
  let stopping = false;
  for (let i = 0; i < count; i++) cluster.fork();
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    console.error(`[app] worker ${worker.process.pid} ended (${signal ?? code}); starting another`);
    setTimeout(() => cluster.fork(), 1000);
  });
  const stop = () => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM');
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

const workers = Math.max(1, Math.floor(Number(process.env.APP_WORKERS ?? 1)) || 1);
if (workers > 1 && cluster.isPrimary) superviseWorkers(workers);
else {
  if (cluster.isWorker) process.on('disconnect', () => process.exit(0)); // the supervisor is gone
  startServer().catch((e) => {
    console.error(e);
    process.exit(1);
  });
}
