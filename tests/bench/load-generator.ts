import { spawn, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';

/**
 * Drives load from a process of its own, so the generator's CPU is counted apart from the
 * server's (both share this machine's cores): wrk when it is installed, else autocannon.
 * The time each used is taken from bash's `time` around the generator.
 */
export interface LoadResult {
  tool: string;
  perSecond: number;
  p50ms: number;
  p99ms: number;
  non2xx: number;
  /** CPU seconds the load generator used. */
  generatorCpu: number;
  /** CPU seconds the server's processes used meanwhile. */
  serverCpu: number;
}

export interface LoadOptions {
  seconds: number;
  connections: number;
  headers?: Record<string, string>;
  /** Process ids whose CPU is the server's (the primary and its workers). */
  serverPids: number[];
}

const HAS_WRK = spawnSync('sh', ['-c', 'command -v wrk'], { encoding: 'utf8' }).status === 0;
export const LOAD_TOOL = process.env.BENCH_TOOL ?? (HAS_WRK ? 'wrk' : 'autocannon');

const TICKS_PER_SECOND = 100;
/** User + system CPU ticks of these processes so far. */
export function cpuTicks(pids: number[]): number {
  let total = 0;
  for (const pid of pids) {
    try {
      const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
      total += Number(fields[11]) + Number(fields[12]);
    } catch {
      // gone
    }
  }
  return total;
}

const quote = (s: string) => `'${s.replace(/'/g, `'\\''`)}'`;

function wrkCommand(url: string, o: LoadOptions): string {
  const headers = Object.entries(o.headers ?? {}).map(([k, v]) => `-H ${quote(`${k}: ${v}`)}`);
  return ['wrk', '-t2', `-c${o.connections}`, `-d${o.seconds}s`, '--latency', ...headers, quote(url)].join(' ');
}

function autocannonCommand(url: string, o: LoadOptions): string {
  const headers = Object.entries(o.headers ?? {}).map(([k, v]) => `-H ${quote(`${k}=${v}`)}`);
  return [quote(process.execPath), 'node_modules/autocannon/autocannon.js', '-j', '-c', String(o.connections), '-d', String(o.seconds), ...headers, quote(url)].join(' ');
}

const ms = (value: string, unit: string) => Number(value) * ({ us: 0.001, ms: 1, s: 1000 } as Record<string, number>)[unit];

function parseWrk(out: string) {
  const latency = (q: string) => {
    const m = out.match(new RegExp(`^\\s*${q}%\\s+([\\d.]+)(us|ms|s)`, 'm'));
    return m ? ms(m[1], m[2]) : NaN;
  };
  const non2xx = Number(out.match(/Non-2xx or 3xx responses:\s+(\d+)/)?.[1] ?? 0);
  return { perSecond: Number(out.match(/Requests\/sec:\s+([\d.]+)/)?.[1] ?? NaN), p50ms: latency('50'), p99ms: latency('99'), non2xx };
}

function parseAutocannon(out: string) {
  const r = JSON.parse(out.slice(out.indexOf('{'))) as { requests: { average: number }; latency: { p50: number; p99: number }; non2xx: number; errors: number };
  return { perSecond: r.requests.average, p50ms: r.latency.p50, p99ms: r.latency.p99, non2xx: r.non2xx + r.errors };
}

export async function runLoad(url: string, o: LoadOptions): Promise<LoadResult> {
  const command = LOAD_TOOL === 'wrk' ? wrkCommand(url, o) : autocannonCommand(url, o);
  const before = cpuTicks(o.serverPids);
  const { stdout, stderr, code } = await new Promise<{ stdout: string; stderr: string; code: number | null }>((resolve) => {
    // bash's `time` reports the generator's own user + system seconds on the last stderr line.
    const child = spawn('bash', ['-c', `TIMEFORMAT='CPU %U %S'; time ${command}`], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    child.on('exit', (c) => resolve({ stdout: out, stderr: err, code: c }));
  });
  const serverCpu = (cpuTicks(o.serverPids) - before) / TICKS_PER_SECOND;
  if (code !== 0) throw new Error(`${LOAD_TOOL} failed (${code}):\n${stderr}`);
  const cpu = stderr.match(/CPU ([\d.]+) ([\d.]+)\s*$/);
  const parsed = LOAD_TOOL === 'wrk' ? parseWrk(stdout) : parseAutocannon(stdout);
  return { tool: LOAD_TOOL, ...parsed, generatorCpu: cpu ? Number(cpu[1]) + Number(cpu[2]) : NaN, serverCpu };
}
