import fs from 'node:fs';
import path from 'node:path';
import { execFileSync, type ChildProcess } from 'node:child_process';
import mariadb from 'mariadb';
import { freePort, waitFor, type Processes } from './processes';
import { galeraOptionFile } from './galera-options';

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

  async start(node: GaleraNode, bootstrap = false): Promise<void> {
    if (!fs.existsSync(`${node.dir}/data/mysql`)) installDataFolder(node);
    fs.rmSync(node.socket, { force: true });
    fs.writeFileSync(`${node.dir}/my.cnf`, galeraOptionFile(node, this.nodes));
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

/**
 * A new node's data folder from mariadb-install-db. It failed once, unexplained, in a run with both cores kept busy
 * (the folder and its log were removed with the run): a failure now prints the end of the tool's log, and the
 * install is tried once more from an empty folder before the run gives up.
 */
function installDataFolder(node: GaleraNode): void {
  const logFile = `${node.dir}/install.log`;
  const install = () =>
    execFileSync(
      'mariadb-install-db',
      ['--user=root', `--datadir=${node.dir}/data`, '--auth-root-authentication-method=normal', '--skip-test-db'],
      { stdio: ['ignore', fs.openSync(logFile, 'a'), fs.openSync(logFile, 'a')] },
    );
  const logEnd = () => fs.readFileSync(logFile, 'utf8').split('\n').slice(-25).join('\n');
  try {
    install();
  } catch (error) {
    console.error(`mariadb-install-db failed for ${node.name} (${String(error)}); its log ends:\n${logEnd()}`);
    fs.rmSync(`${node.dir}/data`, { recursive: true, force: true });
    try {
      install();
    } catch (again) {
      throw new Error(`mariadb-install-db failed twice for ${node.name}; its log ends:\n${logEnd()}`, { cause: again });
    }
    console.error(`mariadb-install-db for ${node.name} succeeded on the second try`);
  }
}
