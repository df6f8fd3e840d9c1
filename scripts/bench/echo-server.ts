// A bare Express JSON echo, the yardstick for the scan endpoint's latency: same Express, same
// JSON body parser, no session, no database. Started by scripts/bench/scans.ts.
import express from 'express';

const port = Number(process.env.PORT ?? 0);
const app = express();
app.disable('x-powered-by');
app.post('/echo', express.json({ limit: '1mb' }), (req, res) => {
  res.json(req.body);
});
const server = app.listen(port, '127.0.0.1', () => {
  const address = server.address();
  process.stdout.write(`listening ${typeof address === 'object' && address ? address.port : port}\n`);
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));
