// npm start: builds the add-in for development and serves dist/ over HTTPS on localhost:3000
// with a certificate generated here (.certs/). Nothing is installed into the system's trust
// store; the instructions below say how to trust it by hand if you choose to.
import { execFileSync } from 'child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'fs';
import { createServer } from 'https';
import { extname, join, resolve } from 'path';
import * as selfsigned from 'selfsigned';

const PORT = 3000;
const DIST = resolve('dist');
const CERTS = resolve('.certs');
const TYPES: Record<string, string> = { '.html': 'text/html; charset=utf-8', '.js': 'text/javascript', '.css': 'text/css', '.png': 'image/png', '.json': 'application/json', '.xml': 'application/xml', '.md': 'text/markdown; charset=utf-8' };

async function certificate(): Promise<{ key: string; cert: string }> {
  const keyPath = join(CERTS, 'localhost.key'), certPath = join(CERTS, 'localhost.crt');
  if (existsSync(keyPath) && existsSync(certPath)) return { key: readFileSync(keyPath, 'utf8'), cert: readFileSync(certPath, 'utf8') };
  const notAfter = new Date();
  notAfter.setDate(notAfter.getDate() + 30);
  const pems = await selfsigned.generate([{ name: 'commonName', value: 'localhost' }], {
    keySize: 2048, algorithm: 'sha256', notAfterDate: notAfter,
    extensions: [{ name: 'subjectAltName', altNames: [{ type: 2, value: 'localhost' }, { type: 7, ip: '127.0.0.1' }] }],
  });
  mkdirSync(CERTS, { recursive: true });
  writeFileSync(keyPath, pems.private, { mode: 0o600 });
  writeFileSync(certPath, pems.cert);
  return { key: pems.private, cert: pems.cert };
}

async function main(): Promise<void> {
  execFileSync(process.execPath, [require.resolve('webpack-cli/bin/cli.js'), '--mode', 'development'], { stdio: 'inherit' });
  const { key, cert } = await certificate();
  createServer({ key, cert }, (req, res) => {
    const file = resolve(DIST, decodeURIComponent((req.url ?? '/').split('?')[0]).replace(/^\/+/, '') || 'taskpane.html');
    if (!file.startsWith(DIST) || !existsSync(file)) { res.writeHead(404); res.end('not found'); return; }
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream', 'access-control-allow-origin': 'https://localhost:3000' });
    res.end(readFileSync(file));
  }).listen(PORT, '127.0.0.1', () => {
    process.stdout.write([
      '',
      `Protic is served at https://localhost:${PORT}/ (certificate: ${join(CERTS, 'localhost.crt')}).`,
      'The certificate is self-signed and was not added to any trust store. To trust it, import that file',
      'into your system or browser certificate store yourself (and remove it when done).',
      '',
      'Load the add-in:',
      `  Excel on the web: Home > Add-ins > More add-ins > Upload My Add-in, and choose ${join(DIST, 'manifest.xml')}.`,
      '  Excel on Windows: put manifest.xml in a shared folder, add the folder under File > Options > Trust Center >',
      '    Trust Center Settings > Trusted Add-in Catalogs, restart Excel, then Home > Add-ins > Shared Folder.',
      '  Excel on Mac: copy manifest.xml to ~/Library/Containers/com.microsoft.Excel/Data/Documents/wef/ and restart Excel.',
      'Then type =PROTIC.PHMIX( in a cell, or open Home > pH & Buffers. Ctrl+C stops the server.',
      '',
    ].join('\n'));
  });
}

void main();
