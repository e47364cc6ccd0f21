// The baseline for the published page: a bare Node `http` server in its own process (like the app) answering every
// request with the same status, headers and bytes, held in memory. The limit a Node server on this machine can reach.
// Usage: node bench/support/bare-server.mjs <port> <body file> <headers JSON file>; prints "listening" when ready.
import { readFileSync } from 'node:fs';
import http from 'node:http';

const [port, bodyFile, headersFile] = process.argv.slice(2);
const body = readFileSync(bodyFile);
const headers = JSON.parse(readFileSync(headersFile, 'utf8'));
http
  .createServer((req, res) => {
    res.writeHead(200, headers);
    res.end(req.method === 'HEAD' ? undefined : body);
  })
  .listen(Number(port), '127.0.0.1', () => console.log('listening'));
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => process.exit(0));
