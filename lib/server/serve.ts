import { createServer } from 'node:http';
import next from 'next';
import { isFastRoute, serveFastRoute } from './fast-routes';

/**
 * The production HTTP server: Next's request handler behind a plain Node server, so that the
 * client address the app sees comes from the socket and not from a header anyone can send.
 * (Next itself keeps a client-supplied X-Forwarded-For.) Set TRUST_PROXY=1 only behind a
 * reverse proxy you run, which then owns that header.
 */
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';
const trustProxy = process.env.TRUST_PROXY === '1';
const origin = `http://${host}:${port}`;

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
      serveFastRoute(req, res, origin).catch(() => { if (!res.headersSent) res.writeHead(500); res.end(); });
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
