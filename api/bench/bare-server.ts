/**
 * The floors the request-path benchmark compares the API with: a bare node:http server that
 * answers a fixed JSON body, and one that reads a rating-card row by primary key through a
 * `mariadb` pool. Started as its own process by request-path.bench.ts; prints READY <port>.
 */
import { createServer } from 'node:http';
import { createPool } from 'mariadb';

const pool = createPool({
  host: '127.0.0.1',
  port: Number(process.env.DB_PORT),
  user: process.env.DB_USER,
  password: process.env.DB_PASSWORD,
  database: process.env.DB_NAME,
  connectionLimit: 10,
});

const server = createServer((req, res) => {
  const url = req.url ?? '/';
  if (url === '/json') {
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end('{"status":"ok"}');
    return;
  }
  const m = /^\/card\/(\d+)$/.exec(url);
  if (!m) {
    res.writeHead(404);
    res.end();
    return;
  }
  pool
    .query('SELECT vendor_part_id AS vendorPartId, version, fields, note, updated_at AS updatedAt FROM rating_cards WHERE vendor_part_id = ?', [Number(m[1])])
    .then((rows: Array<Record<string, unknown>>) => {
      res.writeHead(rows.length ? 200 : 404, { 'content-type': 'application/json' });
      res.end(JSON.stringify(rows[0] ?? null));
    })
    .catch((error: Error) => {
      res.writeHead(500);
      res.end(error.message);
    });
});

server.listen(Number(process.env.BARE_PORT), '127.0.0.1', () => console.log(`READY ${process.env.BARE_PORT}`));
process.on('SIGTERM', () => {
  server.close();
  void pool.end().then(() => process.exit(0));
});
