/**
 * A loopback TCP relay in front of a test server, so an end-to-end spec can play a weak signal at an exact
 * moment (refuse a sync push, cut a push's answer after the server committed) instead of at a time.
 * A spec subclasses it: `fromClient` / `fromServer` see each chunk of one connection with that connection's
 * own state (`newConnection`) and answer 'forward' or 'close' (both sides of that connection are closed, as
 * a dropped signal would).
 */
import { connect, createServer, type AddressInfo, type Server, type Socket } from 'node:net';

/** What a relay hook does with a chunk. */
export type RelayVerdict = 'forward' | 'close';

/** Whether a chunk from the phone starts a sync push. */
export function startsSyncPush(chunk: Buffer): boolean {
  return chunk.toString('latin1').startsWith('POST /api/sync/push');
}

/** Forwards TCP from `port` to the server's current port (read at each connection: the server may restart). */
export abstract class TcpRelay<C> {
  private listener: Server | null = null;
  private readonly sockets = new Set<Socket>();
  port = 0;

  constructor(private readonly targetPort: () => number) {}

  /** The state a new connection starts with. */
  protected abstract newConnection(): C;

  /** What to do with a chunk from the phone (forwarded unless a subclass says otherwise). */
  protected fromClient(_chunk: Buffer, _connection: C): RelayVerdict {
    return 'forward';
  }

  /** What to do with a chunk from the server (forwarded unless a subclass says otherwise). */
  protected fromServer(_chunk: Buffer, _connection: C): RelayVerdict {
    return 'forward';
  }

  async start(): Promise<void> {
    this.listener = createServer((client) => this.relay(client));
    // Port 0: the system picks a free port at the moment of listening, so nothing can take it in between.
    await new Promise<void>((done) => this.listener!.listen(0, '127.0.0.1', done));
    this.port = (this.listener.address() as AddressInfo).port;
  }

  async stop(): Promise<void> {
    for (const socket of this.sockets) socket.destroy();
    await new Promise<void>((done) => this.listener?.close(() => done()) ?? done());
  }

  private relay(client: Socket): void {
    const upstream = connect(this.targetPort(), '127.0.0.1');
    this.sockets.add(client).add(upstream);
    const state = this.newConnection();
    const closeBoth = (): void => {
      client.destroy();
      upstream.destroy();
    };
    client.on('data', (chunk: Buffer) => {
      if (this.fromClient(chunk, state) === 'close') closeBoth();
      else upstream.write(chunk);
    });
    upstream.on('data', (chunk: Buffer) => {
      if (this.fromServer(chunk, state) === 'close') closeBoth();
      else client.write(chunk);
    });
    for (const socket of [client, upstream]) {
      socket.on('error', closeBoth);
      socket.on('close', () => {
        this.sockets.delete(socket);
        closeBoth();
      });
    }
  }
}
