// The HAProxy set-up of the cluster run: the configuration text and the 503 answer it gives instead of its own pages.
import type { GaleraCluster, GaleraNode } from './galera';

export interface Endpoints {
  dbPort: number;
  webPort: number;
  statsPort: number;
}

// What a client sees when no app instance answered in time or one died mid-request: a clean
// 503 it may retry, in the API's own error shape, instead of HAProxy's HTML 502/504 page.
export const RETRY_LATER = (status: string) =>
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

/** haproxy.cfg: the Galera listener (one writer, hot standbys), the app listener and the statistics page. */
export function haproxyConfig(
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
  # The whole request body is taken before an instance is chosen (uploads here fit the buffer): an instance dying
  # mid-request then meets a client that has finished sending and reads the 503, instead of one still writing its
  # upload into a closed connection (EPIPE, no answer at all).
  option http-buffer-request
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
