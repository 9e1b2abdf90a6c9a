import express from 'express';
import { createPool } from 'mysql2/promise';
import { benchStack } from './bench-stack.ts';
import { connection } from './generate-large-firm.ts';

// The floor the API is measured against: the same machine, Express 5 and mysql2, one row by primary key,
// no session, no middleware. The API's reads are reported as a share of what this manages.
const pool = createPool({ ...connection(), connectionLimit: 10 });
const app = express();
app.disable('x-powered-by');
app.get('/firm/:id', async (req, res) => {
  const [rows] = await pool.query('SELECT id, name, time_zone FROM firms WHERE id = ?', [Number(req.params.id)]);
  const firm = (rows as { id: number; name: string; time_zone: string }[])[0];
  if (!firm) {
    res.status(404).json({ message: 'No such firm.' });
    return;
  }
  res.json({ firm });
});

const server = app.listen(benchStack.baselinePort, '127.0.0.1');
const stop = () => server.close(() => void pool.end().finally(() => process.exit(0)));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
