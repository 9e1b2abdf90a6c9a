const levelNames: Record<number, string> = {
  10: 'TRACE',
  20: 'DEBUG',
  30: 'INFO',
  40: 'WARN',
  50: 'ERROR',
  60: 'FATAL',
};

function text(value: unknown): string | null {
  return typeof value === 'string' || typeof value === 'number' ? String(value) : null;
}

function field(record: unknown, key: string): unknown {
  return typeof record === 'object' && record !== null ? (record as Record<string, unknown>)[key] : undefined;
}

/**
 * One pino JSON line as a short line for a person at a terminal (the log file keeps the JSON).
 * Anything that is not a pino record comes back as it was.
 */
export function formatLogLine(line: string): string {
  if (!line.startsWith('{')) return line;
  let record: unknown;
  try {
    record = JSON.parse(line);
  } catch {
    return line;
  }
  const level = field(record, 'level');
  const msg = text(field(record, 'msg'));
  if (typeof level !== 'number' || msg === null) return line;
  const time = field(record, 'time');
  const clock = typeof time === 'number' ? new Date(time).toISOString().slice(11, 19) : '';
  const parts = [clock, (levelNames[level] ?? String(level)).padEnd(5), msg];
  const req = field(record, 'req');
  const method = text(field(req, 'method'));
  const url = text(field(req, 'url'));
  if (method !== null && url !== null) parts.push(`${method} ${url}`);
  const status = text(field(field(record, 'res'), 'statusCode'));
  const took = text(field(record, 'responseTime'));
  if (status !== null) parts.push(`-> ${status}${took !== null ? ` in ${took} ms` : ''}`);
  const err = field(record, 'err');
  const errMessage = text(field(err, 'message'));
  if (errMessage !== null) parts.push(`(${text(field(err, 'type')) ?? 'Error'}: ${errMessage})`);
  return parts.filter((part) => part !== '').join(' ');
}
