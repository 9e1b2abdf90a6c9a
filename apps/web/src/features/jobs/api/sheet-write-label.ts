const stepWords = (step: string) => step.replace(/_/g, ' ');

/** A visit write in the engineer's words, for the status line and "needs your attention": "Radiator 3: before reading". */
export function sheetWriteLabel(path: string, address?: string): string {
  const at = address ? ` (job at ${address})` : '';
  const radiator = /^\/radiators\/(\d+)\/(readings\/(before|after)|agitation|flushed)$/.exec(path);
  if (radiator) {
    const n = Number(radiator[1]) + 1;
    const what = radiator[3] ? `${radiator[3]} reading` : radiator[2] === 'agitation' ? 'agitation' : 'flushed';
    return `Radiator ${n}: ${what}${at}`;
  }
  const step = /^\/steps\/([a-z_]+)$/.exec(path);
  if (step) return `Step: ${stepWords(step[1]!)}${at}`;
  const words: Record<string, string> = {
    '/water-tests': 'Water tests',
    '/notes': 'Notes',
    '/kit': 'Kit used',
    '/photos': 'Photo',
    '/signatures': 'Customer signature',
    '/flush-order': 'Flush order',
    '/complete': 'Completion',
    '': 'Changes to the booking',
  };
  return `${words[path] ?? 'Job sheet'}${at}`;
}
