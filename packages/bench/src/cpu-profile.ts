// Reduces a V8 .cpuprofile (node --cpu-prof) to each package's share of the busy CPU (self time; idle left out),
// so the fixed cost of a request can be split between express-session, knex, mysql2, helmet, pino and the rest.
interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string };
  hitCount?: number;
}

export interface CpuShare {
  name: string;
  percent: number;
}

function owner(node: ProfileNode): string {
  const { url, functionName } = node.callFrame;
  if (url === '') return functionName.startsWith('(') ? functionName : '(native)';
  const inModules = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (inModules) return inModules[1]!;
  if (url.startsWith('node:')) return 'node internals';
  const own = /\/(apps\/[^/]+|packages\/[^/]+)\//.exec(url);
  return own ? own[1]! : url;
}

export function cpuShares(profile: { nodes: ProfileNode[] }): CpuShare[] {
  const hits = new Map<string, number>();
  for (const node of profile.nodes) {
    const name = owner(node);
    if (name === '(idle)') continue;
    hits.set(name, (hits.get(name) ?? 0) + (node.hitCount ?? 0));
  }
  const total = [...hits.values()].reduce((a, b) => a + b, 0) || 1;
  return [...hits.entries()]
    .map(([name, n]) => ({ name, percent: Math.round((1000 * n) / total) / 10 }))
    .sort((a, b) => b.percent - a.percent);
}
