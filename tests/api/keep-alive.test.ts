/**
 * Kept-alive connections: the server must keep an idle connection open longer than its
 * clients keep theirs, or a client reusing the socket at the moment the server drops it
 * gets ECONNRESET (a browser test's request failed that way once). Node's own client
 * agent keeps idle sockets 5 s (Node's http.globalAgent documentation); the server used
 * to drop them after 5 s too. Common practice: the server side outlives the client side.
 */
import http from 'node:http';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { listenOn } from '../../api/http/listen';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import { testApp } from '../support/test-app';

let t: TestDatabase;
let server: Server;
let port: number;
beforeAll(async () => {
  t = await freshDatabase();
  server = await listenOn(testApp(t.db), 0);
  port = (server.address() as AddressInfo).port;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await t.drop();
});

function get(agent: http.Agent): Promise<{ status: number; reused: boolean; socket: import('node:net').Socket }> {
  return new Promise((resolve, reject) => {
    const req = http.get({ host: '127.0.0.1', port, path: '/api/health', agent }, (res) => {
      res.resume();
      res.on('end', () => resolve({ status: res.statusCode ?? 0, reused: req.reusedSocket, socket: req.socket! }));
    });
    req.on('error', reject);
  });
}

it('keeps an idle connection open past the 5 s a Node client keeps it (Node 20 closed it at about 6 s), and the next request reuses it', async () => {
  // No client-side idle timeout here, so only the server could close the socket.
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  try {
    const first = await get(agent);
    expect(first.status).toBe(200);
    let closedByServer = false;
    first.socket.once('close', () => (closedByServer = true));
    await new Promise((r) => setTimeout(r, 7_000));
    expect(closedByServer).toBe(false);
    const second = await get(agent);
    expect(second.status).toBe(200);
    expect(second.reused).toBe(true);
    expect(second.socket).toBe(first.socket);
  } finally {
    agent.destroy();
  }
}, 20_000);

it('sets the header timeout above the keep-alive timeout', () => {
  // Node's http documentation asks for headersTimeout > keepAliveTimeout.
  expect(server.keepAliveTimeout).toBeGreaterThan(5_000);
  expect(server.headersTimeout).toBeGreaterThan(server.keepAliveTimeout);
});
