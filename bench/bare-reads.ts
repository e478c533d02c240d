// The reference for bench/reads.ts: a bare Express + mysql2 endpoint doing one indexed SELECT (an
// account by primary key) on the same MariaDB — no session, permission check, logging or headers.
// Run as its own process with DATABASE_URL; prints "READY <port>".
import express from 'express';
import mysql from 'mysql2/promise';

const pool = mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 10 });
const app = express();
app.get('/users/:id', async (req, res) => {
  const [rows] = await pool.query('SELECT id, email, display_name FROM users WHERE id = ?', [Number(req.params.id)]);
  res.json((rows as unknown[])[0] ?? null);
});
const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  process.stdout.write(`READY ${typeof address === 'object' && address ? address.port : 0}\n`);
});
process.once('SIGTERM', () => server.close(() => void pool.end().then(() => process.exit(0))));
