import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

/** Debian's Chromium, driven by playwright-core; never a downloaded browser. */
export const CHROMIUM = '/usr/bin/chromium';
/** Headless, and nothing that talks to the network on its own. */
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

/** The failure of a browser test when Chromium is missing: such tests fail, never skip. */
export function chromiumMissing(what: string): string {
  return `${CHROMIUM} is missing: install Debian's chromium (apt-get install chromium) to run ${what}`;
}

/** Serves fixed files (path -> [content type, body]) on 127.0.0.1; 404 for anything else. */
export async function serveFiles(files: Record<string, [string, string | Buffer]>): Promise<{ origin: string; close: () => Promise<void> }> {
  const server: Server = createServer((req, res) => {
    const file = files[req.url ?? ''];
    if (file === undefined) {
      res.writeHead(404, { 'content-type': 'text/plain' });
      res.end('not here');
      return;
    }
    res.writeHead(200, { 'content-type': file[0] });
    res.end(file[1]);
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  return {
    origin: `http://127.0.0.1:${String((server.address() as AddressInfo).port)}`,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
