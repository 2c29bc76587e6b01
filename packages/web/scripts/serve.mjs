#!/usr/bin/env node
// `pnpm web`: serves the built page (packages/web/dist, built by `pnpm run build`) on 127.0.0.1 and
// prints its address. PORT=<n> picks the port (default 5178; a free one when that is taken).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { startStaticServer } from './staticServer.mjs';

const dist = fileURLToPath(new URL('../dist/', import.meta.url));
if (!existsSync(new URL('../dist/index.html', import.meta.url))) {
  console.error('loopwise web: packages/web/dist/index.html is missing; build first (pnpm web builds, then serves)');
  process.exit(1);
}
const wanted = process.env.PORT === undefined ? 5178 : Number(process.env.PORT);
if (!Number.isInteger(wanted) || wanted < 0 || wanted > 65535) {
  console.error(`loopwise web: PORT must be a port number, got "${process.env.PORT}"`);
  process.exit(2);
}
let server;
try {
  server = await startStaticServer(dist, { port: wanted });
} catch (error) {
  if (error.code !== 'EADDRINUSE' || process.env.PORT !== undefined) throw error;
  server = await startStaticServer(dist, { port: 0 });
}
console.log(`loopwise page at ${server.url} (the built folder ${dist}; Ctrl+C stops the server)`);
