// A tiny static file server for the built site (target/site, scripts/site.mjs) on 127.0.0.1 with
// an explicit MIME map.
// Usage: node scripts/serve.mjs [--port N] [--root DIR]   (PORT in the environment also works)
import { createServer } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import { extname, join, normalize, resolve } from 'node:path';

const MIME = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8',
  '.wasm': 'application/wasm', '.json': 'application/json', '.svg': 'image/svg+xml',
  '.png': 'image/png', '.webmanifest': 'application/manifest+json', '.txt': 'text/plain; charset=utf-8',
};

export function startServer({ root, port = 8080, host = '127.0.0.1' }) {
  const base = resolve(root);
  const server = createServer(async (req, res) => {
    try {
      const url = new URL(req.url, 'http://localhost');
      let path = normalize(decodeURIComponent(url.pathname));
      if (path.endsWith('/')) path += 'index.html';
      const file = join(base, path);
      if (!file.startsWith(base)) throw new Error('outside root');
      const info = await stat(file);
      if (!info.isFile()) throw new Error('not a file');
      const body = await readFile(file);
      res.writeHead(200, {
        'Content-Type': MIME[extname(file)] ?? 'application/octet-stream',
        'Cache-Control': 'no-cache',
      });
      res.end(body);
    } catch {
      res.writeHead(404, { 'Content-Type': 'text/plain; charset=utf-8' });
      res.end('not found');
    }
  });
  return new Promise((ok, fail) => {
    server.once('error', fail);
    server.listen(port, host, () => ok(server));
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const args = process.argv.slice(2);
  const flag = (name) => { const i = args.indexOf(name); return i >= 0 ? args[i + 1] : undefined; };
  const port = Number(flag('--port') ?? process.env.PORT ?? 8080);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error(`serve: port must be a whole number from 0 to 65535, got ${flag('--port') ?? process.env.PORT}`);
    process.exit(2);
  }
  const root = flag('--root') ?? new URL('../target/site', import.meta.url).pathname;
  try {
    await stat(join(root, 'index.html'));
  } catch {
    console.error(`serve: no page at ${root}: build it first (scripts/build makes target/site)`);
    process.exit(2);
  }
  const server = await startServer({ root, port });
  console.log(`framewise is served at http://127.0.0.1:${server.address().port}/  (Ctrl-C stops it)`);
  const stop = () => server.close(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
