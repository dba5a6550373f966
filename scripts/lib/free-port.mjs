import { createServer } from 'node:net';

/** Asks the OS for a free loopback port, so test runs never collide with `npm start`. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}
