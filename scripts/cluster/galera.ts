import fs from 'node:fs';
import path from 'node:path';
import { execFileSync, type ChildProcess } from 'node:child_process';
import mariadb from 'mariadb';
import { freePort, waitFor, type Processes } from './processes';

export interface GaleraNode {
  name: string;
  dir: string;
  socket: string;
  port: number;
  gcommPort: number;
  istPort: number;
  sstPort: number;
  child?: ChildProcess;
}

// Peers suspect a silent member after 3 s and drop it after 6 s (defaults 5 s and 15 s): a killed
// node holds up replication for that long, so shorter bounds shorten the stall a failover causes.
const EVS =
  'evs.keepalive_period=PT1S;evs.inactive_check_period=PT1S;evs.suspect_timeout=PT3S;evs.inactive_timeout=PT6S';

/** A three-node MariaDB Galera cluster on loopback, each node with its own folder under `root`. */
export class GaleraCluster {
  private constructor(
    private readonly procs: Processes,
    readonly nodes: GaleraNode[],
  ) {}

  static async create(procs: Processes, root: string, count = 3): Promise<GaleraCluster> {
    const nodes: GaleraNode[] = [];
    for (let i = 1; i <= count; i++) {
      const dir = path.resolve(root, `db${i}`);
      fs.mkdirSync(dir, { recursive: true });
      nodes.push({
        name: `db${i}`,
        dir,
        socket: path.join(dir, 'mysqld.sock'),
        port: await freePort(),
        gcommPort: await freePort(),
        istPort: await freePort(),
        sstPort: await freePort(),
      });
    }
    return new GaleraCluster(procs, nodes);
  }

  /**
   * The node's settings as an option file. It is passed with --defaults-file rather than options on
   * the command line with --no-defaults, because the state-transfer script reads its own settings
   * with my_print_defaults: without a file of ours it would read Debian's /etc/mysql files (and
   * send its log to syslog, where nobody sees why a transfer failed).
   */
  private optionFile(node: GaleraNode): string {
    const peers = this.nodes.map((n) => `127.0.0.1:${n.gcommPort}`).join(',');
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

  async start(node: GaleraNode, bootstrap = false): Promise<void> {
    if (!fs.existsSync(`${node.dir}/data/mysql`)) {
      execFileSync(
        'mariadb-install-db',
        ['--user=root', `--datadir=${node.dir}/data`, '--auth-root-authentication-method=normal', '--skip-test-db'],
        { stdio: ['ignore', fs.openSync(`${node.dir}/install.log`, 'a'), fs.openSync(`${node.dir}/install.log`, 'a')] },
      );
    }
    fs.rmSync(node.socket, { force: true });
    fs.writeFileSync(`${node.dir}/my.cnf`, this.optionFile(node));
    const args = [`--defaults-file=${node.dir}/my.cnf`, ...(bootstrap ? ['--wsrep-new-cluster'] : [])];
    node.child = this.procs.start(node.name, '/usr/sbin/mariadbd', args, { log: `${node.dir}/stdout.log` });
  }

  /** wsrep_local_state_comment ("Synced", "Joining", "Donor/Desynced", ...), or undefined when unreachable. */
  async state(node: GaleraNode): Promise<string | undefined> {
    const rows = await this.query<{ Value: string }>(node, "SHOW STATUS LIKE 'wsrep_local_state_comment'").catch(
      () => undefined,
    );
    return rows?.[0]?.Value;
  }

  async waitSynced(node: GaleraNode, limitMs = 240_000): Promise<void> {
    const exited = () => node.child?.exitCode !== null && node.child?.exitCode !== undefined;
    await waitFor(
      `${node.name} to be Synced`,
      async () => {
        if (exited()) throw new Error(`${node.name} exited; see ${node.dir}/error.log`);
        return (await this.state(node)) === 'Synced';
      },
      limitMs,
    );
  }

  async kill(node: GaleraNode): Promise<void> {
    if (node.child) await this.procs.kill(node.child);
  }

  async query<T>(node: GaleraNode, sql: string, params: unknown[] = [], database?: string): Promise<T[]> {
    const conn = await mariadb.createConnection({
      socketPath: node.socket,
      user: 'root',
      database,
      connectTimeout: 3000,
    });
    try {
      // With a database named, reads wait until this node has applied everything the cluster committed.
      if (database) await conn.query('SET SESSION wsrep_sync_wait = 15');
      return (await conn.query(sql, params)) as T[];
    } finally {
      await conn.end().catch(() => undefined);
    }
  }
}
