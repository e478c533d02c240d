// A closed-loop HTTP load generator for the read benchmarks: `users` clients, each with its own
// keep-alive connection (an http.Agent with one socket), each sending its next request as soon as the
// last answer arrived. Latency is request written → answer read in full. No dependency beyond Node.
import { Agent, request } from 'node:http';
import { performance } from 'node:perf_hooks';

export interface LoadClient {
  /** Extra headers (the session cookie). */
  headers: Record<string, string>;
  /** The path of this client's n-th request. */
  path(n: number): string;
}

export interface LoadResult {
  requests: number;
  errors: number;
  seconds: number;
  latencies: number[];
  /** Latencies by label (the path with numbers replaced by `:id`). */
  byLabel: Map<string, number[]>;
  firstError: string | null;
}

export const label = (path: string) => path.replace(/\/\d+/g, '/:id').replace(/\?.*$/, '');

function get(agent: Agent, host: string, port: number, path: string, headers: Record<string, string>): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = request({ host, port, path, agent, headers }, (res) => {
      res.on('data', () => undefined);
      res.on('end', () => resolve(res.statusCode ?? 0));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end();
  });
}

/** Runs every client for `seconds` against base (http://host:port); results of that window only. */
export async function runLoad(base: string, clients: LoadClient[], seconds: number): Promise<LoadResult> {
  const { hostname: host, port } = new URL(base);
  const result: LoadResult = { requests: 0, errors: 0, seconds, latencies: [], byLabel: new Map(), firstError: null };
  const start = performance.now();
  const end = start + seconds * 1000;
  const agents: Agent[] = [];
  await Promise.all(
    clients.map(async (client) => {
      const agent = new Agent({ keepAlive: true, maxSockets: 1 });
      agents.push(agent);
      for (let n = 0; performance.now() < end; n++) {
        const path = client.path(n);
        const t0 = performance.now();
        let ok = false;
        try {
          const status = await get(agent, host, Number(port), path, client.headers);
          ok = status >= 200 && status < 300;
          if (!ok) result.firstError ??= `${status} on ${path}`;
        } catch (err) {
          result.firstError ??= `${(err as Error).message} on ${path}`;
        }
        const t1 = performance.now();
        if (t1 > end) break; // answered after the window: not counted
        result.requests++;
        if (!ok) result.errors++;
        result.latencies.push(t1 - t0);
        const key = label(path);
        let list = result.byLabel.get(key);
        if (!list) result.byLabel.set(key, (list = []));
        list.push(t1 - t0);
      }
    }),
  );
  for (const a of agents) a.destroy();
  return result;
}

export const percentile = (xs: number[], p: number) => {
  if (!xs.length) return NaN;
  const sorted = xs.slice().sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
};
