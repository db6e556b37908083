// The bare-framework floor for the benches: an empty App Router page and an empty sync-shaped route
// handler, built with the same Next.js in a throwaway folder under .data/ that reuses the installed
// node_modules through a symlink.
import { existsSync, mkdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { root } from './env.mjs';
import { log, nodeBin, run } from './proc.mjs';

export const floorDir = path.join(root, '.data', 'bench-floor');

const FILES = {
  'package.json': '{ "name": "fallbook-bench-floor", "private": true }\n',
  // Same bundler root as the app, so the symlinked node_modules stays inside it.
  // The app's own response headers (CSP, COOP and the rest), built the same way: COOP alone makes the
  // browser start a fresh page process for each navigation, which is the deployment's cost, not the
  // app's code, so the floor pays it too.
  'next.config.mjs':
    `import { securityHeaders } from ${JSON.stringify(path.join(root, 'lib', 'config', 'security-headers.mjs'))};\n` +
    'const headers = securityHeaders({ nodeEnv: process.env.NODE_ENV, nextAuthUrl: process.env.NEXTAUTH_URL ?? "", tileUrl: process.env.NEXT_PUBLIC_TILE_URL ?? "" });\n' +
    `export default { poweredByHeader: false, turbopack: { root: ${JSON.stringify(root)} }, async headers() { return [{ source: '/:path*', headers }]; } };\n`,
  'app/layout.jsx':
    'export const metadata = { title: "Empty" };\n' +
    'export default function RootLayout({ children }) {\n  return <html lang="en"><body>{children}</body></html>;\n}\n',
  'app/page.jsx': 'export default function Page() {\n  return <main><h1>Empty page</h1></main>;\n}\n',
  // The bare framework's sync: a route handler that reads the pushed JSON and answers one outcome
  // per op (POST), or an empty page of changes (GET), with no session, database or validation.
  'app/api/echo/route.js':
    'export const dynamic = "force-dynamic";\n' +
    'export async function POST(request) {\n  const { ops } = await request.json();\n' +
    '  return Response.json({ results: ops.map((op) => ({ opId: op.opId, status: "applied" })) });\n}\n' +
    'export function GET() {\n  return Response.json({ changes: [], cursor: 0 });\n}\n',
  // The same answers from the framework's other kind of endpoint (a Pages Router API route): the sync
  // bench reports what each kind costs a request, beside Node's own http server.
  'pages/api/echo-pages.js':
    'export const config = { api: { bodyParser: { sizeLimit: "4mb" } } };\n' +
    'export default function handler(req, res) {\n' +
    '  if (req.method === "POST") return res.json({ results: req.body.ops.map((op) => ({ opId: op.opId, status: "applied" })) });\n' +
    '  return res.json({ changes: [], cursor: 0 });\n}\n',
};

function nextVersion() {
  return JSON.parse(readFileSync(nodeBin('next/package.json'), 'utf8')).version;
}

/** Builds the empty app unless a build with this Next.js version is already there. */
export function ensureFloorBuild() {
  const stamp = path.join(floorDir, '.next', 'floor-stamp');
  const want = `${nextVersion()}\n${JSON.stringify(FILES)}\n${readFileSync(path.join(root, 'lib', 'config', 'security-headers.mjs'), 'utf8')}`;
  if (existsSync(stamp) && readFileSync(stamp, 'utf8') === want) {
    log('empty floor app is up to date');
    return;
  }
  log('building the empty App Router app (the framework floor)…');
  rmSync(floorDir, { recursive: true, force: true });
  for (const [file, text] of Object.entries(FILES)) {
    mkdirSync(path.dirname(path.join(floorDir, file)), { recursive: true });
    writeFileSync(path.join(floorDir, file), text);
  }
  symlinkSync(path.join(root, 'node_modules'), path.join(floorDir, 'node_modules'), 'dir');
  const env = { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' };
  run(process.execPath, [nodeBin('next/dist/bin/next'), 'build'], { cwd: floorDir, env });
  writeFileSync(stamp, want);
}
