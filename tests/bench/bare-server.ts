import { createServer } from 'node:http';

// Baseline for the ingest benchmark: a bare Node HTTP server answering a fixed JSON reply.
const reply = JSON.stringify({ accepted: 1, duplicates: 0, state: 'steady', next_report_s: 600 });
const port = Number(process.argv[2] ?? 3199);
createServer((req, res) => {
  req.resume();
  req.on('end', () => {
    res.writeHead(200, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(reply) });
    res.end(reply);
  });
}).listen(port, '127.0.0.1', () => console.log(`bare server on ${port}`));
