import { X509Certificate } from 'crypto';
import { mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'fs';
import { createServer, request } from 'https';
import type { Server } from 'http';
import { networkInterfaces, tmpdir } from 'os';
import { join } from 'path';
import * as selfsigned from 'selfsigned';
import { certificate, certificateProblems, listenLoopback, staticHandler, trustInstructions } from '../scripts/start';

// The dev server (scripts/start.ts) on a free loopback port, with its own certificate, against
// hostile paths. Every request has a timeout so nothing here can hang.

const base = mkdtempSync(join(tmpdir(), 'protic-devserver-'));
const dist = join(base, 'dist');
mkdirSync(join(dist, 'sub'), { recursive: true });
mkdirSync(join(base, 'dist-old'));
writeFileSync(join(dist, 'taskpane.html'), '<!doctype html><title>pane</title>');
writeFileSync(join(dist, 'functions.json'), '{"functions":[]}');
writeFileSync(join(dist, 'sub', 'inner.txt'), 'inner');
writeFileSync(join(base, 'dist-old', 'secret.txt'), 'secret');
writeFileSync(join(base, 'outside.txt'), 'outside');
symlinkSync(join(base, 'outside.txt'), join(dist, 'link.txt'));

let servers: Server[] = [];
let port = 0;
let cert = '';

beforeAll(async () => {
  const pems = await certificate(join(base, 'certs'));
  cert = pems.cert;
  ({ servers, port } = await listenLoopback(() => createServer({ key: pems.key, cert: pems.cert }, staticHandler(dist)), 0));
}, 30000);

afterAll(async () => {
  await Promise.all(servers.filter((s) => s.listening).map((s) => new Promise((done) => s.close(done))));
});

function get(path: string, host = '127.0.0.1', method = 'GET'): Promise<{ status: number; headers: Record<string, unknown>; body: string }> {
  return new Promise((done, failed) => {
    // the server's own certificate is the only trust anchor: this also checks it verifies for "localhost"
    const req = request({ host, port, path, method, ca: cert, servername: 'localhost', timeout: 5000, headers: { origin: 'https://excel.officeapps.live.com' } }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c) => (body += c));
      res.on('end', () => done({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on('timeout', () => req.destroy(new Error(`timeout on ${path}`)));
    req.on('error', failed);
    req.end();
  });
}

describe('the dev server', () => {
  test('serves the add-in with access-control-allow-origin: * and no cache-control', async () => {
    const r = await get('/functions.json');
    expect(r.status).toBe(200);
    expect(r.body).toBe('{"functions":[]}');
    expect(r.headers['access-control-allow-origin']).toBe('*');
    expect(r.headers['content-type']).toMatch(/^application\/json/);
    expect(r.headers['cache-control']).toBeUndefined();
    expect((await get('/')).body).toMatch(/<title>pane<\/title>/);
    expect((await get('/sub/inner.txt')).status).toBe(200);
  });

  test('survives a path that does not decode (%E0%A4%A) and a directory (/.), and keeps serving', async () => {
    expect((await get('/%E0%A4%A')).status).toBe(400);
    expect((await get('/.')).status).toBe(404);
    expect((await get('/sub')).status).toBe(404);
    expect((await get('/sub/')).status).toBe(404);
    expect((await get('/%00taskpane.html')).status).toBe(400);
    expect((await get('/functions.json')).status).toBe(200);
  });

  test('never leaves its folder: encoded dot segments, a sibling folder sharing the prefix, a link out', async () => {
    for (const path of ['/%2e%2e/dist-old/secret.txt', '/../dist-old/secret.txt', '/%2e%2e%2fdist-old%2fsecret.txt', '/..%5cdist-old%5csecret.txt', '/link.txt', '/%2e%2e/outside.txt']) {
      const r = await get(path);
      expect([path, r.status]).toEqual([path, 404]);
      expect(r.body).not.toMatch(/secret|outside/);
    }
  });

  test('answers only GET and HEAD', async () => {
    expect((await get('/functions.json', '127.0.0.1', 'POST')).status).toBe(405);
    const head = await get('/functions.json', '127.0.0.1', 'HEAD');
    expect(head.status).toBe(200);
    expect(head.body).toBe('');
  });

  test('listens on loopback only: 127.0.0.1 and, where the machine has it, ::1', async () => {
    const addresses = servers.map((s) => (s.address() as { address: string }).address);
    expect(addresses[0]).toBe('127.0.0.1');
    const hasIpv6Loopback = Object.values(networkInterfaces()).flat().some((i) => i?.address === '::1');
    if (hasIpv6Loopback) {
      expect(addresses).toEqual(['127.0.0.1', '::1']);
      expect((await get('/functions.json', '::1')).status).toBe(200);
    } else {
      expect(addresses).toEqual(['127.0.0.1']);
    }
  });
});

/** The keyUsage bits of a certificate, read from its DER by hand (independent of the code under test). */
function keyUsageBits(pem: string): { digitalSignature: boolean; keyEncipherment: boolean } | null {
  const der = new X509Certificate(pem).raw;
  const oid = Buffer.from([0x06, 0x03, 0x55, 0x1d, 0x0f]); // 2.5.29.15 keyUsage
  let at = der.indexOf(oid);
  if (at < 0) return null;
  at += oid.length;
  if (der[at] === 0x01) at += 3; // critical BOOLEAN
  if (der[at] !== 0x04) return null; // OCTET STRING holding a BIT STRING
  const bits = der[at + 2] === 0x03 ? der[at + 5] : 0;
  return { digitalSignature: (bits & 0x80) !== 0, keyEncipherment: (bits & 0x20) !== 0 };
}

describe('the dev certificate', () => {
  test('is a TLS server certificate for localhost: serverAuth, digitalSignature and keyEncipherment, not a CA', () => {
    const x509 = new X509Certificate(cert);
    expect(x509.keyUsage).toContain('1.3.6.1.5.5.7.3.1');
    expect(x509.ca).toBe(false);
    expect(x509.subjectAltName).toMatch(/DNS:localhost/);
    expect(x509.subjectAltName).toMatch(/IP Address:127\.0\.0\.1/);
    expect(keyUsageBits(cert)).toEqual({ digitalSignature: true, keyEncipherment: true });
    expect(certificateProblems(cert)).toEqual([]);
  });

  test('is reused while valid and regenerated once expired', async () => {
    const dir = join(base, 'certs-expiry');
    const now = new Date();
    const first = await certificate(dir, now);
    expect(first.generated).toBe(true);
    const nextWeek = await certificate(dir, new Date(now.getTime() + 7 * 86400e3));
    expect(nextWeek.generated).toBe(false);
    expect(nextWeek.cert).toBe(first.cert);
    const later = new Date(now.getTime() + 31 * 86400e3);
    expect(certificateProblems(first.cert, later).join()).toMatch(/expires/);
    const renewed = await certificate(dir, later);
    expect(renewed.generated).toBe(true);
    expect(readFileSync(renewed.certPath, 'utf8')).not.toBe(first.cert);
    expect(certificateProblems(renewed.cert, later)).toEqual([]);
  }, 30000);

  test('an old certificate with only a subjectAltName is replaced', async () => {
    const dir = join(base, 'certs-old');
    mkdirSync(dir);
    const old = await selfsigned.generate([{ name: 'commonName', value: 'localhost' }], {
      keySize: 2048, algorithm: 'sha256', extensions: [{ name: 'subjectAltName', altNames: [{ type: 2, value: 'localhost' }] }],
    });
    writeFileSync(join(dir, 'localhost.key'), old.private);
    writeFileSync(join(dir, 'localhost.crt'), old.cert);
    expect(certificateProblems(old.cert)).toContain('no extendedKeyUsage serverAuth');
    expect((await certificate(dir)).generated).toBe(true);
  }, 30000);

  test('the trust commands are printed per system, and scripts/start.ts runs none of them', () => {
    const lines = trustInstructions('/x/localhost.crt').join('\n');
    expect(lines).toMatch(/certutil -user -addstore Root "\/x\/localhost.crt"/);
    expect(lines).toMatch(/security add-trusted-cert .*login\.keychain-db "\/x\/localhost.crt"/);
    expect(lines).toMatch(/Always Trust/);
    const source = readFileSync('scripts/start.ts', 'utf8');
    expect(source.match(/exec(File)?(Sync)?\(/g)).toEqual(['execFileSync(']);
    expect(source).toMatch(/execFileSync\(process\.execPath, \[require\.resolve\('webpack-cli/);
  });
});
