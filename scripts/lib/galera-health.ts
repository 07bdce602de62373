// Each node's health answer for the balancers: 200 only while the node is Synced and ready for
// applications (wsrep_local_state 4, wsrep_ready ON), 503 otherwise. A node that is up but
// joining, a donor, or cut off from the majority (non-primary) must not be given connections:
// it would refuse them with "WSREP has not yet prepared node for application use".
// The pattern is Galera's usual "clustercheck" (an HTTP answer the proxy's httpchk reads).
import { createServer, type Server } from 'node:http';
import mysql, { type Connection } from 'mysql2/promise';
import type { Instance } from './mariadb';

export interface HealthServer {
  close(): Promise<void>;
}

async function synced(instance: Instance, held: { connection: Connection | null }): Promise<boolean> {
  try {
    held.connection ??= await mysql.createConnection({ socketPath: instance.socket, user: 'root', connectTimeout: 1000 });
    const [rows] = (await held.connection.query("SHOW GLOBAL STATUS WHERE Variable_name IN ('wsrep_local_state', 'wsrep_ready')")) as unknown as [
      { Variable_name: string; Value: string }[],
    ];
    const value = (name: string) => rows.find((r) => r.Variable_name === name)?.Value;
    return value('wsrep_local_state') === '4' && value('wsrep_ready') === 'ON';
  } catch {
    held.connection?.destroy();
    held.connection = null;
    return false;
  }
}

export async function startHealthServer(instance: Instance, port: number): Promise<HealthServer> {
  const held: { connection: Connection | null } = { connection: null };
  const server: Server = createServer((_req, res) => {
    void synced(instance, held).then((ok) => {
      res.writeHead(ok ? 200 : 503, { 'Content-Type': 'text/plain' });
      res.end(ok ? 'synced\n' : 'not synced\n');
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  return {
    async close() {
      held.connection?.destroy();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
