/**
 * Starts an HTTP server for the app with connection timeouts that do not race its clients.
 *
 * A client that keeps connections alive reuses an idle socket for its next request. Node's
 * own client agent drops idle sockets after 5 s, and Node's server closed them after 5 s as
 * well: a request written at that moment met a socket the server was closing and failed
 * with ECONNRESET. The server now keeps idle connections longer than its clients do
 * (common practice: the server side outlives the client side, so the client always closes
 * first), and allows headers a little longer than that, as Node asks.
 */
import type { Server } from 'node:http';

/** How long an idle kept-alive connection stays open on the server. */
export const KEEP_ALIVE_MS = 65_000;
/** Must exceed KEEP_ALIVE_MS (Node's documented pairing of the two timeouts). */
export const HEADERS_TIMEOUT_MS = 66_000;

interface Listens {
  listen(port: number, host: string, callback: () => void): Server;
}

/** Tunes a server's connection timeouts (see above). */
export function tuneConnections(server: Server): Server {
  server.keepAliveTimeout = KEEP_ALIVE_MS;
  server.headersTimeout = HEADERS_TIMEOUT_MS;
  return server;
}

/** Listens on `host:port` (0 for any free port) with tuned connection timeouts. */
export function listenOn(app: Listens, port: number, host = '127.0.0.1'): Promise<Server> {
  return new Promise<Server>((resolve, reject) => {
    const s = app.listen(port, host, () => resolve(tuneConnections(s)));
    s.once('error', reject);
  });
}
