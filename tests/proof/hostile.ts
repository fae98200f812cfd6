import { DEMO } from '../helpers/paths';
import { signIn } from '../helpers/session';

export interface HostileResult {
  requests: number;
  status5xx: number;
  acceptedHostile: number;
  cases: string[];
}

const docOf = (content: unknown[]) => ({ type: 'doc', content });
const link = (href: string) => docOf([{ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'link', attrs: { href } }] }] }]);
const deep = (n: number): unknown => (n === 0 ? { type: 'text', text: 'x' } : { type: 'blockquote', content: [deep(n - 1)] });

/**
 * Hostile input at every door: paths, queries, JSON, documents, names, headers, multipart. No
 * answer may be a 5xx, and nothing hostile that should be refused may be accepted.
 */
export async function hostileSweep(url: string, venue: string, page: string): Promise<HostileResult> {
  const engineer = await signIn(url, DEMO.engineer);
  const admin = await signIn(url, DEMO.admin);
  let requests = 0;
  let status5xx = 0;
  const accepted: string[] = [];
  const probe = async (label: string, res: Promise<Response>, mustRefuse: boolean) => {
    const r = await res;
    await r.arrayBuffer();
    requests++;
    if (r.status >= 500) {
      status5xx++;
      accepted.push(`${label}: ${r.status}`);
    } else if (mustRefuse && r.status < 400) accepted.push(`${label}: accepted (${r.status})`);
  };
  const base = async () => ((await (await engineer.fetch(`/api/venues/${venue}/pages/${page}`)).json()) as { page: { currentRevision: number } }).page.currentRevision;
  const paths = ['/api/venues/%zz', '/api/venues/%ED%A0%80/pages', '/api/venues/..%2F..%2Fetc', `/api/venues/${venue}/pages/%00`, `/api/venues/${venue}/pages/${'a'.repeat(5000)}`, '/files/../../etc/passwd', '/files/%2e%2e%2fpackage.json', `/api/venues/${venue}/pages/${page}/revisions/99999999999`, `/api/venues/${venue}/pages/${page}/revisions/-1`, '/venues/%zz', '/%ED%A0%80'];
  for (const p of paths) await probe(`GET ${p}`, engineer.fetch(p), false);
  const queries = ['a%00b', '%00', '%22', 'NEAR(a b)', '*', '"', `${'x'.repeat(300)}`, '%F0%9F%98%80', '\u202Eabc', 'a%zzb'];
  for (const q of queries) await probe(`search ${q}`, engineer.fetch(`/api/search?q=${q}`), false);
  const bodies: [string, string, string][] = [
    ['not json', 'application/json', '{"doc":'],
    ['proto', 'application/json', '{"__proto__":{"x":1},"doc":{},"baseRevision":1}'],
    ['array', 'application/json', '[]'],
    ['text/plain', 'text/plain', '{}'],
    ['huge number', 'application/json', '{"baseRevision":1e400,"doc":{}}'],
    ['deep json', 'application/json', '['.repeat(100_000) + ']'.repeat(100_000)],
  ];
  for (const [label, type, body] of bodies) await probe(`PUT ${label}`, engineer.fetch(`/api/venues/${venue}/pages/${page}`, { method: 'PUT', headers: { 'content-type': type }, body }), true);
  const docs: [string, unknown][] = [
    ['javascript: link', link('javascript:alert(1)')],
    ['/\\ link', link('/\\evil.example')],
    ['\\\\ link', link('\\\\evil.example')],
    ['\\/ link', link('\\/evil.example')],
    ['data: link', link('data:text/html,<script>')],
    ['image elsewhere', docOf([{ type: 'image', attrs: { src: 'https://evil.example/x.png' } }])],
    ['heading 99', docOf([{ type: 'heading', attrs: { level: 99 }, content: [{ type: 'text', text: 'x' }] }])],
    ['unknown node', docOf([{ type: 'script', content: [] }])],
    ['deep doc', docOf([deep(200)])],
    ['empty text node', docOf([{ type: 'paragraph', content: [{ type: 'text', text: '' }] }])],
  ];
  for (const [label, doc] of docs) await probe(`save ${label}`, engineer.sendJson('PUT', `/api/venues/${venue}/pages/${page}`, { baseRevision: await base(), doc }), true);
  const names = ['Rack\u202Egnp.exe', 'a\u0000b', 'x\u2066y', '   ', 'a'.repeat(500)];
  for (const n of names) {
    await probe(`title ${JSON.stringify(n)}`, engineer.sendJson('POST', `/api/venues/${venue}/pages`, { title: n, section: 'stage', doc: docOf([]) }), true);
    await probe(`venue ${JSON.stringify(n)}`, admin.sendJson('POST', '/api/venues', { name: n }), true);
    await probe(`section ${JSON.stringify(n)}`, engineer.sendJson('POST', `/api/venues/${venue}/sections`, { title: n }), true);
    // A blank summary is simply no summary; every other name here must be refused.
    if (n.trim()) await probe(`summary ${JSON.stringify(n)}`, engineer.sendJson('PUT', `/api/venues/${venue}/pages/${page}`, { baseRevision: await base(), doc: docOf([]), summary: n }), true);
  }
  const upload = (label: string, body: BodyInit, headers: Record<string, string> = {}) => probe(`upload ${label}`, engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body, headers }), true);
  await upload('no boundary', 'x', { 'content-type': 'multipart/form-data' });
  await upload('garbage multipart', '--b\r\nnonsense', { 'content-type': 'multipart/form-data; boundary=b' });
  await upload('html as pdf', (() => { const f = new FormData(); f.append('file', new Blob(['<html><script>x</script>']), 'x.pdf'); return f; })());
  await upload('svg', (() => { const f = new FormData(); f.append('file', new Blob(['<svg xmlns="http://www.w3.org/2000/svg"><script>x</script></svg>'], { type: 'image/svg+xml' }), 'x.svg'); return f; })());
  await upload('empty', (() => { const f = new FormData(); f.append('file', new Blob([]), 'x.pdf'); return f; })());
  await upload('foreign origin', (() => { const f = new FormData(); f.append('file', new Blob(['%PDF-1.4\n%%EOF']), 'x.pdf'); return f; })(), { origin: 'http://evil.example' });
  await probe('idempotency key garbage', engineer.fetch(`/api/venues/${venue}/pages/${page}`, { method: 'PUT', headers: { 'content-type': 'application/json', 'idempotency-key': '<script>' }, body: JSON.stringify({ baseRevision: await base(), doc: docOf([]) }) }), true);
  await probe('history before=abc', engineer.fetch(`/api/venues/${venue}/pages/${page}/revisions?before=abc`), true);
  return { requests, status5xx, acceptedHostile: accepted.length - status5xx, cases: accepted };
}
