// The machine's floor for the list benchmark (npm run bench): node:http and the MariaDB driver's own pool, no
// framework, no session, no ORM. Each request sends one `SELECT 1` and answers a few hundred bytes of JSON, as the
// smallest signed-in answer does (`/no-db`: the same answer without the statement). Started by scripts/bench-lists.ts
// as a child process; tells its port over IPC.
import { createServer, type ServerResponse } from 'node:http';
import mariadb from 'mariadb';

const pool = mariadb.createPool({
  host: process.env.DB_HOST ?? '127.0.0.1',
  port: Number(process.env.DB_PORT ?? 3306),
  user: process.env.DB_USER,
  password: process.env.DB_PASSWORD,
  database: process.env.DB_NAME,
  connectionLimit: Number(process.env.DB_POOL_MAX ?? 10),
});
const padding = 'x'.repeat(240);

const answer = (res: ServerResponse, one: number) => {
  res.writeHead(200, { 'content-type': 'application/json', 'cache-control': 'private, no-store' });
  res.end(JSON.stringify({ one, padding }));
};

// `/no-db` answers at once: the load generator's and node:http's share of the floor alone.
const server = createServer((req, res) => {
  if (req.url === '/no-db') return answer(res, 1);
  pool.query('SELECT 1 AS one').then(
    ([row]: { one: number }[]) => answer(res, row.one),
    () => {
      res.writeHead(503).end();
    },
  );
});
server.listen(0, '127.0.0.1', () => {
  const address = server.address();
  process.send?.({ ready: true, port: typeof address === 'object' && address ? address.port : 0 });
});
process.on('SIGTERM', () => {
  server.close();
  void pool.end();
});
