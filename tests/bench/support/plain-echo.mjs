// The floor's echo on Node's own http server, with no framework: POST answers one outcome per pushed
// op, GET an empty page of changes. It listens on a free loopback port and prints it.
import http from 'node:http';

const server = http.createServer((req, res) => {
  const chunks = [];
  req.on('data', (chunk) => chunks.push(chunk));
  req.on('end', () => {
    const body =
      req.method === 'POST'
        ? { results: JSON.parse(Buffer.concat(chunks).toString('utf8')).ops.map((op) => ({ opId: op.opId, status: 'applied' })) }
        : { changes: [], cursor: 0 };
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  });
});
server.listen(0, '127.0.0.1', () => process.stdout.write(`${server.address().port}\n`));
