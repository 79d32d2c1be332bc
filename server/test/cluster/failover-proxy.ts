import { connect, createServer, type Server, type Socket } from 'node:net';

/**
 * The load balancer in front of the test cluster, at its simplest: a TCP proxy that sends each new
 * connection to the first node that accepts it (node A while it lives, then node B). The desks use
 * the WebSocket transport only, so one connection is one whole socket.io session and no sticky
 * routing is needed (README, "Load balancer").
 */
export class FailoverProxy {
  private server: Server | null = null;
  private readonly open = new Set<Socket>();

  constructor(private readonly ports: number[]) {}

  async listen(port: number): Promise<void> {
    this.server = createServer((client) => this.route(client, 0));
    await new Promise<void>((resolve, reject) => {
      this.server!.once('error', reject);
      this.server!.listen(port, '127.0.0.1', () => resolve());
    });
  }

  private route(client: Socket, index: number): void {
    if (index >= this.ports.length) {
      client.destroy();
      return;
    }
    client.pause();
    const upstream = connect(this.ports[index], '127.0.0.1');
    let connected = false;
    upstream.once('error', () => {
      // refused: that node is down, try the next; after connecting, the close handler ends both
      if (!connected) this.route(client, index + 1);
    });
    upstream.once('connect', () => {
      connected = true;
      this.open.add(client).add(upstream);
      client.pipe(upstream).pipe(client);
      client.resume();
      const close = () => {
        client.destroy();
        upstream.destroy();
        this.open.delete(client);
        this.open.delete(upstream);
      };
      client.once('close', close).once('error', close);
      upstream.once('close', close).once('error', close);
    });
  }

  async close(): Promise<void> {
    for (const socket of this.open) socket.destroy();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
