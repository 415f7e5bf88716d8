import type { GaleraNode } from './galera';

// Peers suspect a silent member after 3 s and drop it after 6 s (defaults 5 s and 15 s): a killed
// node holds up replication for that long, so shorter bounds shorten the stall a failover causes.
const EVS =
  'evs.keepalive_period=PT1S;evs.inactive_check_period=PT1S;evs.suspect_timeout=PT3S;evs.inactive_timeout=PT6S';

/**
 * A node's settings as an option file. It is passed with --defaults-file rather than options on
 * the command line with --no-defaults, because the state-transfer script reads its own settings
 * with my_print_defaults: without a file of ours it would read Debian's /etc/mysql files (and
 * send its log to syslog, where nobody sees why a transfer failed).
 */
export function galeraOptionFile(node: GaleraNode, nodes: GaleraNode[]): string {
  const peers = nodes.map((n) => `127.0.0.1:${n.gcommPort}`).join(',');
  return `[mysqld]
user = root
datadir = ${node.dir}/data
bind-address = 127.0.0.1
port = ${node.port}
socket = ${node.socket}
pid-file = ${node.dir}/mysqld.pid
log-error = ${node.dir}/error.log
innodb-buffer-pool-size = 128M
innodb-log-file-size = 48M
max-allowed-packet = 64M
skip-name-resolve
# Statements on a pool of threads, as README's "What a production operator sets" advises for every node.
thread-handling = pool-of-threads
character-set-server = utf8mb4
collation-server = utf8mb4_unicode_ci
# Galera's requirements: row-based replication and interleaved auto-increment locks.
binlog-format = ROW
innodb-autoinc-lock-mode = 2
# Durability comes from the other nodes holding each write set; a lock wait stays well under a request's 10 s.
innodb-flush-log-at-trx-commit = 2
innodb-lock-wait-timeout = 5
# Galera logs writes like a binary log, and MariaDB then lets only SUPER create triggers unless this
# is set; the migrations' append-only triggers on the audit table are created by the app's account.
log-bin-trust-function-creators = 1
wsrep-on = ON
wsrep-provider = /usr/lib/galera/libgalera_smm.so
wsrep-cluster-name = torquetrail-test
wsrep-cluster-address = gcomm://${peers}
wsrep-node-address = 127.0.0.1:${node.gcommPort}
wsrep-node-name = ${node.name}
wsrep-provider-options = "gmcast.listen_addr=tcp://127.0.0.1:${node.gcommPort};ist.recv_addr=127.0.0.1:${node.istPort};gcache.size=128M;${EVS}"
wsrep-sst-receive-address = 127.0.0.1:${node.sstPort}
# rsync's daemon drops to the nobody user and cannot write a root-owned datadir (TOOLCHAIN.md, trap 20).
wsrep-sst-method = mariabackup
wsrep-sst-auth = root:

[sst]
# The transfer logs go to files in the data folders, not syslog.
sst-syslog = -1
sst-log-archive = 0
`;
}
