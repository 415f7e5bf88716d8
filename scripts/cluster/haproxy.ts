import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import type { GaleraCluster, GaleraNode } from './galera';
import { RETRY_LATER, haproxyConfig, type Endpoints } from './haproxy-config';
import { freePort, waitFor, type Processes } from './processes';

/**
 * One small HTTP check per database node for HAProxy, like the usual Galera "clustercheck":
 * 200 only while the node is Synced, so a joining or donor node gets no clients.
 */
export async function startNodeChecks(
  cluster: GaleraCluster,
): Promise<{ ports: Map<GaleraNode, number>; close: () => void }> {
  const ports = new Map<GaleraNode, number>();
  const servers: http.Server[] = [];
  for (const node of cluster.nodes) {
    const port = await freePort();
    const server = http.createServer((_req, res) => {
      void cluster.state(node).then((state) => {
        res
          .writeHead(state === 'Synced' ? 200 : 503, { 'Content-Type': 'text/plain' })
          .end(`${state ?? 'unreachable'}\n`);
      });
    });
    await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
    servers.push(server);
    ports.set(node, port);
  }
  return { ports, close: () => servers.forEach((s) => s.close()) };
}

export async function startHaproxy(
  procs: Processes,
  cluster: GaleraCluster,
  checks: Map<GaleraNode, number>,
  apps: number[],
  dir: string,
): Promise<Endpoints> {
  fs.writeFileSync(path.join(dir, '503.http'), RETRY_LATER('503 Service Unavailable'));
  // A port found free can be taken by another process before HAProxy binds it (the machine is shared):
  // then HAProxy exits at once, and a new set of ports is tried.
  for (let attempt = 1; ; attempt++) {
    const ends = { dbPort: await freePort(), webPort: await freePort(), statsPort: await freePort() };
    fs.writeFileSync(path.join(dir, 'haproxy.cfg'), haproxyConfig(cluster, checks, apps, ends, dir));
    const args = ['-db', '-f', path.join(dir, 'haproxy.cfg')];
    const child = procs.start('haproxy', '/usr/sbin/haproxy', args, { log: path.join(dir, 'haproxy.log') });
    let exited = false;
    await waitFor(
      'HAProxy to accept connections or exit',
      async () => {
        exited = child.exitCode !== null;
        return exited || (await fetch(`http://127.0.0.1:${ends.statsPort}/;csv`)).ok;
      },
      30_000,
    );
    if (!exited) return ends;
    const portTaken = fs.readFileSync(path.join(dir, 'haproxy.log'), 'utf8').includes('Address already in use');
    if (!portTaken || attempt === 3) throw new Error(`haproxy exited; see ${dir}/haproxy.log`);
  }
}

/** HAProxy's own view of each server ("UP", "DOWN", ...), from its statistics page. */
export async function serverStates(ends: Endpoints): Promise<Record<string, string>> {
  const csv = await (await fetch(`http://127.0.0.1:${ends.statsPort}/;csv`)).text();
  const out: Record<string, string> = {};
  for (const line of csv.split('\n').slice(1)) {
    const f = line.split(',');
    if (f[1] && f[1] !== 'FRONTEND' && f[1] !== 'BACKEND') out[`${f[0]}/${f[1]}`] = f[17];
  }
  return out;
}
