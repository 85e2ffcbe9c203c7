/**
 * Serves the built app (what `next start` does) behind one step of our own: the client's address is
 * worked out from the socket and EVENLOAD_TRUSTED_PROXIES (lib/http/client-address.ts) and handed to the
 * app in the x-evenload-client-address header, replacing any such header the client sent; the
 * X-Forwarded-For header is replaced by that one address, so nothing downstream believes a forged one.
 *
 *   npx tsx scripts/serve.ts [-H 127.0.0.1] [-p 3000]
 */
import { createServer } from 'node:http';
import path from 'node:path';
import next from 'next';
import { CLIENT_ADDRESS_HEADER, parseTrustedProxies, resolveClientAddress } from '../lib/http/client-address';

function option(flag: string, fallback: string): string {
  const index = process.argv.indexOf(flag);
  return index > 0 && process.argv[index + 1] ? process.argv[index + 1]! : fallback;
}

async function main() {
  // What `next start` sets: the production build's behaviour.
  Object.assign(process.env, { NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' });
  const hostname = option('-H', '127.0.0.1');
  const port = Number(option('-p', process.env.PORT ?? '3000'));
  const trusted = parseTrustedProxies(process.env.EVENLOAD_TRUSTED_PROXIES);
  const app = next({ dev: false, dir: path.resolve(__dirname, '..'), hostname, port });
  const handle = app.getRequestHandler();
  await app.prepare();
  const server = createServer((request, response) => {
    const address = resolveClientAddress(request.socket.remoteAddress, request.headers['x-forwarded-for'], trusted);
    request.headers[CLIENT_ADDRESS_HEADER] = address;
    request.headers['x-forwarded-for'] = address;
    void handle(request, response);
  });
  server.listen(port, hostname, () => console.log(`evenload: ready on http://${hostname}:${port}`));
  // Ends with process.exit (so `node --cpu-prof` writes its profile): idle keep-alive sockets are closed
  // at once, and requests still running get 3 s.
  const stop = () => {
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    setTimeout(() => process.exit(0), 3000).unref();
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
