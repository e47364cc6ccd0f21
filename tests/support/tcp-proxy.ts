// A loopback TCP proxy a test can cut and restore, to take the database away from one server process only.
import net from 'node:net';

export interface TcpProxy {
  port: number;
  /** Drop every connection and refuse new ones, as a database that went away. */
  cut(): Promise<void>;
  /** Accept connections again on the same port. */
  restore(): Promise<void>;
  close(): Promise<void>;
}

export async function startTcpProxy(target: { host: string; port: number }): Promise<TcpProxy> {
  const sockets = new Set<net.Socket>();
  let server: net.Server | null = null;
  let port = 0;
  const listen = () =>
    new Promise<void>((resolve, reject) => {
      server = net.createServer((client) => {
        const upstream = net.connect(target.port, target.host);
        for (const s of [client, upstream]) {
          sockets.add(s);
          s.on('close', () => sockets.delete(s));
          s.on('error', () => s.destroy());
        }
        client.pipe(upstream).pipe(client);
        client.on('close', () => upstream.destroy());
        upstream.on('close', () => client.destroy());
      });
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => {
        port = (server!.address() as net.AddressInfo).port;
        resolve();
      });
    });
  const cut = async () => {
    const closing = server ? new Promise<void>((resolve) => server!.close(() => resolve())) : Promise.resolve();
    server = null;
    for (const s of sockets) s.destroy();
    await closing;
  };
  await listen();
  return { port, cut, restore: listen, close: cut };
}
