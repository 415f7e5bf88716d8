import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import type { GaleraCluster, GaleraNode } from './galera';
import { freePort, waitFor, type Processes } from './processes';

export interface Endpoints {
  dbPort: number;
  webPort: number;
  statsPort: number;
}

// What a client sees when no app instance answered in time or one died mid-request: a clean
// 503 it may retry, in the API's own error shape, instead of HAProxy's HTML 502/504 page.
const RETRY_LATER = (status: string) =>
  [
    `HTTP/1.1 ${status}`,
    'Content-Type: application/json',
    'Retry-After: 2',
    'Cache-Control: no-store',
    'Connection: close',
    '',
    '{"code":"unavailable","message":"The service is switching over; try again in a moment."}',
    '',
  ].join('\r\n');

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

function config(
  cluster: GaleraCluster,
  checks: Map<GaleraNode, number>,
  apps: number[],
  ends: Endpoints,
  dir: string,
): string {
  const [writer, ...others] = cluster.nodes;
  const dbServer = (n: GaleraNode, backup: boolean) =>
    `  server ${n.name} 127.0.0.1:${n.port} check port ${checks.get(n)}${backup ? ' backup' : ''}`;
  return `global
  maxconn 4000
  log stdout format raw local0
defaults
  log global
  timeout connect 2s
  timeout queue 5s
  timeout check 3s
listen galera
  mode tcp
  bind 127.0.0.1:${ends.dbPort}
  timeout client 120s
  timeout server 120s
  option httpchk GET /
  http-check expect status 200
  default-server inter 500ms fall 3 rise 2 on-marked-down shutdown-sessions
  # One node takes every write; the others are hot standbys (no certification conflicts in normal running).
  # When the writer returns, sessions left on a standby are closed so writes go back to one node.
${dbServer(writer, false)} on-marked-up shutdown-backup-sessions
${others.map((n) => dbServer(n, true)).join('\n')}
listen web
  mode http
  # One line per request in haproxy.log, with how it ended (e.g. "SH--": the instance died mid-answer).
  option httplog
  bind 127.0.0.1:${ends.webPort}
  timeout client 30s
  # The longest a request waits for an app instance; beyond it the client gets the 503 below.
  timeout server 9s
  balance roundrobin
  option httpchk GET /api/health
  http-check expect status 200
  default-server inter 500ms fall 2 rise 2
  # One request per connection, on both sides. When an instance dies mid-request, HAProxy answers a request
  # that was not the first on its client connection by closing that connection without a word (the keep-alive
  # convention that lets a browser resend); with one request per connection it sends the 503 below instead.
  option httpclose
  # Only a connection that never reached an instance is sent elsewhere: nothing ran, so it is safe.
  retries 3
  retry-on conn-failure
  option redispatch
${apps.map((p, i) => `  server app${i + 1} 127.0.0.1:${p} check`).join('\n')}
  errorfile 502 ${dir}/503.http
  errorfile 503 ${dir}/503.http
  errorfile 504 ${dir}/503.http
listen stats
  mode http
  timeout client 10s
  timeout server 10s
  bind 127.0.0.1:${ends.statsPort}
  stats enable
  stats uri /
`;
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
    fs.writeFileSync(path.join(dir, 'haproxy.cfg'), config(cluster, checks, apps, ends, dir));
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
