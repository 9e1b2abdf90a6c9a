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

/** The functions with the most self time (idle and the garbage collector's own entry kept), as `name url:line`. */
export function topFunctions(profile: { nodes: (ProfileNode & { callFrame: { lineNumber?: number } })[] }, n: number) {
  const hits = new Map<string, number>();
  let total = 0;
  for (const node of profile.nodes) {
    const { functionName, url, lineNumber } = node.callFrame;
    if (functionName === '(idle)' || functionName === '(program)') continue;
    const where =
      url === '' ? '' : ` ${url.replace(/^.*?\/(node_modules|apps|packages)\//, '$1/')}:${(lineNumber ?? 0) + 1}`;
    const name = `${functionName || '(anonymous)'}${where}`;
    hits.set(name, (hits.get(name) ?? 0) + (node.hitCount ?? 0));
    total += node.hitCount ?? 0;
  }
  return [...hits.entries()]
    .map(([name, h]) => ({ name, percent: Math.round((1000 * h) / (total || 1)) / 10 }))
    .sort((a, b) => b.percent - a.percent)
    .slice(0, n);
}

/**
 * The project's own functions (apps/, packages/) by total time: their own and everything they called
 * (a recursive call counted once), as a share of the busy CPU: where a slow read spends its time.
 */
export function ownFunctionsInclusive(
  profile: { nodes: (ProfileNode & { children?: number[]; callFrame: { lineNumber?: number } })[] },
  n: number,
) {
  const byId = new Map(profile.nodes.map((node) => [node.id, node]));
  const keyOf = (node: ProfileNode & { callFrame: { lineNumber?: number } }) => {
    const { functionName, url, lineNumber } = node.callFrame;
    const own = /\/((?:apps|packages)\/.*)$/.exec(url);
    return own && !url.includes('node_modules')
      ? `${functionName || '(anonymous)'} ${own[1]}:${(lineNumber ?? 0) + 1}`
      : null;
  };
  const totals = new Map<string, number>();
  let busy = 0;
  const walk = (id: number, open: Set<string>): number => {
    const node = byId.get(id)!;
    const idle = node.callFrame.functionName === '(idle)' || node.callFrame.functionName === '(program)';
    let sum = idle ? 0 : (node.hitCount ?? 0);
    if (!idle) busy += node.hitCount ?? 0;
    const key = keyOf(node);
    const opened = key !== null && !open.has(key);
    if (opened) open.add(key);
    for (const child of node.children ?? []) sum += walk(child, open);
    if (opened) {
      open.delete(key);
      totals.set(key, (totals.get(key) ?? 0) + sum);
    }
    return sum;
  };
  const root = profile.nodes[0];
  if (root) walk(root.id, new Set());
  return [...totals.entries()]
    .map(([name, h]) => ({ name, percent: Math.round((1000 * h) / (busy || 1)) / 10 }))
    .sort((a, b) => b.percent - a.percent)
    .slice(0, n);
}
