import net from 'node:net';

// A TCP relay in front of the real MariaDB, so the test can take "the database" away and bring it back.
export function relay(targetPort: number) {
  const sockets = new Set<net.Socket>();
  const server = net.createServer((client) => {
    const upstream = net.connect(targetPort, '127.0.0.1');
    sockets.add(client).add(upstream);
    client.pipe(upstream).pipe(client);
    const drop = () => {
      client.destroy();
      upstream.destroy();
    };
    client.on('error', drop).on('close', drop);
    upstream.on('error', drop).on('close', drop);
  });
  return {
    listen: (port = 0) => new Promise<number>((resolve) => server.listen(port, '127.0.0.1', () => resolve((server.address() as net.AddressInfo).port))),
    close: () =>
      new Promise<void>((resolve) => {
        sockets.forEach((socket) => socket.destroy());
        server.close(() => resolve());
      }),
  };
}
