import { createConnection, createServer, type Server, type Socket } from 'node:net';

/**
 * A TCP relay between the application and the test MariaDB, so a test can take the database
 * away mid-session (every open connection cut, new ones refused) and bring it back, without
 * touching the database server the other test files share.
 */
export class DatabaseProxy {
  private server: Server | null = null;
  private readonly sockets = new Set<Socket>();
  port = 0;

  constructor(
    private readonly targetPort: number,
    private readonly targetHost = '127.0.0.1',
  ) {}

  /** Starts relaying (on the same port as before, after a `cut`). */
  async open(): Promise<number> {
    const server = createServer((client) => {
      const upstream = createConnection(this.targetPort, this.targetHost);
      for (const socket of [client, upstream]) {
        this.sockets.add(socket);
        socket.on('close', () => this.sockets.delete(socket));
        socket.on('error', () => undefined);
      }
      client.pipe(upstream);
      upstream.pipe(client);
      client.on('close', () => upstream.destroy());
      upstream.on('close', () => client.destroy());
    });
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(this.port, '127.0.0.1', () => resolve());
    });
    this.server = server;
    this.port = (server.address() as { port: number }).port;
    return this.port;
  }

  /** The database is gone: open connections are cut and new ones refused. */
  async cut(): Promise<void> {
    const server = this.server;
    this.server = null;
    for (const socket of this.sockets) socket.destroy();
    this.sockets.clear();
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}
