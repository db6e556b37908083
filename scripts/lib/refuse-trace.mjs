// Preloaded into `next start` (node --import): TRACE and TRACK answer 405 before Next sees them. Next
// builds a fetch Request for every call, and fetch forbids these methods, so they would otherwise end in
// a bare 500. Nothing else is touched.
import http from 'node:http';

const emit = http.Server.prototype.emit;
http.Server.prototype.emit = function emitRefusingTrace(event, req, res) {
  if (event === 'request' && (req.method === 'TRACE' || req.method === 'TRACK')) {
    res.writeHead(405, { Allow: 'GET, HEAD, POST, PUT, PATCH, DELETE, OPTIONS', 'Content-Type': 'application/json', 'Cache-Control': 'no-store' });
    res.end(JSON.stringify({ error: { code: 'method_not_allowed', message: `${req.method} is not allowed here.` } }));
    return true;
  }
  return emit.apply(this, arguments);
};
