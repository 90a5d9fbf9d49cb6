// npm start: builds the add-in for development and serves dist/ over HTTPS on localhost:3000 (127.0.0.1
// and ::1) with a certificate generated here (.certs/). Nothing is installed into the system's trust
// store; the instructions printed say how to trust it by hand if you choose to.
import { execFileSync } from 'child_process';
import { X509Certificate } from 'crypto';
import { existsSync, mkdirSync, readFileSync, realpathSync, statSync, writeFileSync } from 'fs';
import { createServer } from 'https';
import type { IncomingMessage, Server, ServerResponse } from 'http';
import { extname, isAbsolute, join, relative, resolve } from 'path';
import * as selfsigned from 'selfsigned';

const PORT = 3000;
const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8', '.png': 'image/png',
  '.json': 'application/json; charset=utf-8', '.xml': 'application/xml; charset=utf-8', '.map': 'application/json; charset=utf-8',
};
const SERVER_AUTH_OID = '1.3.6.1.5.5.7.3.1';
const LIFETIME_DAYS = 30;
/** A certificate this close to its end is replaced rather than reused. */
const RENEW_BEFORE_MS = 24 * 3600 * 1000;

/**
 * Why an existing certificate must be replaced (empty when it is fine): expired or about to, not yet
 * valid, not for TLS servers (macOS refuses server certificates without extendedKeyUsage serverAuth),
 * a CA certificate, or not for localhost.
 */
export function certificateProblems(certPem: string, now: Date = new Date()): string[] {
  let x509: X509Certificate;
  try { x509 = new X509Certificate(certPem); } catch { return ['unreadable']; }
  const problems: string[] = [];
  if (new Date(x509.validTo).getTime() - now.getTime() < RENEW_BEFORE_MS) problems.push(`expires ${x509.validTo}`);
  if (new Date(x509.validFrom).getTime() > now.getTime()) problems.push(`not valid before ${x509.validFrom}`);
  if (!(x509.keyUsage ?? []).includes(SERVER_AUTH_OID)) problems.push('no extendedKeyUsage serverAuth');
  if (x509.ca) problems.push('is a CA certificate');
  if (!x509.checkHost('localhost')) problems.push('not for localhost');
  return problems;
}

/** The dev certificate in `dir`: reused while valid, otherwise (re)generated for 30 days. */
export async function certificate(dir: string, now: Date = new Date()): Promise<{ key: string; cert: string; certPath: string; generated: boolean }> {
  const keyPath = join(dir, 'localhost.key'), certPath = join(dir, 'localhost.crt');
  if (existsSync(keyPath) && existsSync(certPath)) {
    const cert = readFileSync(certPath, 'utf8');
    if (certificateProblems(cert, now).length === 0) return { key: readFileSync(keyPath, 'utf8'), cert, certPath, generated: false };
  }
  const notAfter = new Date(now.getTime() + LIFETIME_DAYS * 24 * 3600 * 1000);
  const pems = await selfsigned.generate([{ name: 'commonName', value: 'localhost' }], {
    keySize: 2048, algorithm: 'sha256', notBeforeDate: new Date(now.getTime() - 60 * 1000), notAfterDate: notAfter,
    extensions: [
      { name: 'basicConstraints', cA: false, critical: true },
      { name: 'keyUsage', digitalSignature: true, keyEncipherment: true, critical: true },
      { name: 'extKeyUsage', serverAuth: true },
      { name: 'subjectAltName', altNames: [{ type: 2, value: 'localhost' }, { type: 7, ip: '127.0.0.1' }, { type: 7, ip: '::1' }] },
    ],
  });
  mkdirSync(dir, { recursive: true });
  writeFileSync(keyPath, pems.private, { mode: 0o600 });
  writeFileSync(certPath, pems.cert);
  return { key: pems.private, cert: pems.cert, certPath, generated: true };
}

/** The commands a user may run to trust the certificate, per system. Printed, never run. */
export function trustInstructions(certPath: string): string[] {
  return [
    'The certificate is self-signed and was not added to any trust store. To trust it yourself:',
    `  Windows (current user's root store):  certutil -user -addstore Root "${certPath}"`,
    `    remove later with:                  certutil -user -delstore Root localhost`,
    `  macOS (login keychain, Always Trust): security add-trusted-cert -r trustRoot -p ssl -k ~/Library/Keychains/login.keychain-db "${certPath}"`,
    `    or open it in Keychain Access, then Get Info > Trust > "When using this certificate: Always Trust";`,
    `    remove later with:                  security delete-certificate -c localhost ~/Library/Keychains/login.keychain-db`,
    '  Linux browsers: import it under Settings > Privacy and security > Certificates > Authorities.',
  ];
}

/**
 * Serves the files under `root` and nothing else: GET and HEAD only; `/` is taskpane.html; a path that
 * does not decode, leaves `root` (checked with path.relative, after resolving links) or names a
 * directory is refused. `access-control-allow-origin: *` because Excel on the web fetches
 * functions.json from its own origin; no cache-control, which makes Office replace icons.
 */
export function staticHandler(root: string): (req: IncomingMessage, res: ServerResponse) => void {
  const realRoot = realpathSync(root);
  const refuse = (res: ServerResponse, status: number, text: string): void => {
    res.writeHead(status, { 'content-type': 'text/plain; charset=utf-8', 'x-content-type-options': 'nosniff' });
    res.end(text);
  };
  return (req, res) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') { res.setHeader('allow', 'GET, HEAD'); refuse(res, 405, 'method not allowed'); return; }
    let path: string;
    try { path = decodeURIComponent((req.url ?? '/').split(/[?#]/)[0]); } catch { refuse(res, 400, 'bad request'); return; }
    if (path.includes('\0')) { refuse(res, 400, 'bad request'); return; }
    const wanted = path === '/' ? 'taskpane.html' : path.replace(/^[/\\]+/, '');
    let file: string;
    try { file = realpathSync(resolve(realRoot, wanted)); } catch { refuse(res, 404, 'not found'); return; }
    const rel = relative(realRoot, file);
    if (rel === '' || rel.startsWith('..') || isAbsolute(rel)) { refuse(res, 404, 'not found'); return; }
    let isFile = false;
    try { isFile = statSync(file).isFile(); } catch { /* vanished: not found */ }
    if (!isFile) { refuse(res, 404, 'not found'); return; }
    let body: Buffer;
    try { body = readFileSync(file); } catch { refuse(res, 404, 'not found'); return; }
    res.writeHead(200, {
      'content-type': TYPES[extname(file).toLowerCase()] ?? 'application/octet-stream',
      'content-length': body.length,
      'access-control-allow-origin': '*',
      'x-content-type-options': 'nosniff',
    });
    res.end(req.method === 'HEAD' ? undefined : body);
  };
}

/**
 * Listens on 127.0.0.1 and ::1 (loopback only) at `port` (0: a free one, the same on both). A machine
 * without IPv6 keeps the IPv4 listener. Resolves with the servers and the port.
 */
export async function listenLoopback(make: () => Server, port: number): Promise<{ servers: Server[]; port: number }> {
  const listen = (server: Server, host: string, at: number): Promise<number> => new Promise((done, failed) => {
    server.once('error', failed);
    server.listen(at, host, () => { server.off('error', failed); const a = server.address(); done(typeof a === 'object' && a ? a.port : at); });
  });
  const v4 = make();
  const bound = await listen(v4, '127.0.0.1', port);
  const v6 = make();
  try {
    await listen(v6, '::1', bound);
    return { servers: [v4, v6], port: bound };
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EADDRNOTAVAIL' || code === 'EAFNOSUPPORT') return { servers: [v4], port: bound };
    v4.close();
    throw error;
  }
}

async function main(): Promise<void> {
  const dist = resolve('dist');
  execFileSync(process.execPath, [require.resolve('webpack-cli/bin/cli.js'), '--mode', 'development'], { stdio: 'inherit' });
  const { key, cert, certPath, generated } = await certificate(resolve('.certs'));
  const handler = staticHandler(dist);
  const { servers } = await listenLoopback(() => createServer({ key, cert }, handler), PORT);
  process.stdout.write([
    '',
    `Protic is served at https://localhost:${PORT}/ on ${servers.length === 2 ? '127.0.0.1 and ::1' : '127.0.0.1'} (certificate: ${certPath}${generated ? ', new' : ''}).`,
    ...trustInstructions(certPath),
    '',
    'Load the add-in:',
    `  Excel on the web: Home > Add-ins > More add-ins > Upload My Add-in, and choose ${join(dist, 'manifest.xml')}.`,
    '  Excel on Windows: put manifest.xml in a shared folder, add the folder under File > Options > Trust Center >',
    '    Trust Center Settings > Trusted Add-in Catalogs, restart Excel, then Home > Add-ins > Shared Folder.',
    '  Excel on Mac: copy manifest.xml to ~/Library/Containers/com.microsoft.Excel/Data/Documents/wef/ and restart Excel.',
    'Then type =PROTIC.PHMIX( in a cell, or open Home > pH & Buffers. Ctrl+C stops the server.',
    '',
  ].join('\n'));
}

if (require.main === module) void main();
