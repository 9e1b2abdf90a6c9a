import { formatUkCalendarDate, type ReminderKind } from '@heatfleet/domain';

export interface DigestLine {
  kind: ReminderKind;
  summary: string;
}

export interface RenderedDigest {
  subject: string;
  text: string;
  html: string;
}

function escapeHtml(s: string): string {
  return s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );
}

const count = (n: number) => `${n} reminder${n === 1 ? '' : 's'}`;

const sectionTitles: { title: string; kinds: ReminderKind[] }[] = [
  { title: 'Kit due for inspection', kinds: ['inspection_due'] },
  { title: 'Van MOT and service', kinds: ['mot_due', 'service_due'] },
  { title: 'Vans below their minimum stock', kinds: ['van_below_minimum'] },
  { title: 'Depot stock to reorder', kinds: ['depot_reorder'] },
  { title: 'Batches expiring', kinds: ['batch_expiring'] },
  { title: 'Customers due their annual check', kinds: ['annual_check_due'] },
  { title: 'Invoices overdue (the customer was reminded)', kinds: ['invoice_overdue'] },
];

function sections(lines: DigestLine[]): { title: string; lines: string[] }[] {
  return sectionTitles
    .map((s) => ({ title: s.title, lines: lines.filter((l) => s.kinds.includes(l.kind)).map((l) => l.summary) }))
    .filter((s) => s.lines.length > 0);
}

/** "kit", "vans" and "stock", as far as the digest covers them, for the office subject line. */
function topics(lines: DigestLine[]): string {
  const has = (kinds: ReminderKind[]) => lines.some((l) => kinds.includes(l.kind));
  const words = [
    ...(has(['inspection_due']) ? ['kit'] : []),
    ...(has(['mot_due', 'service_due']) ? ['vans'] : []),
    ...(has(['van_below_minimum', 'depot_reorder', 'batch_expiring']) ? ['stock'] : []),
    ...(has(['annual_check_due']) ? ['annual checks'] : []),
    ...(has(['invoice_overdue']) ? ['overdue invoices'] : []),
  ];
  return words.length > 1
    ? `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`
    : (words[0] ?? 'kit and vans');
}

/** One e-mail listing the reminders new in this scan, for the office or for one engineer's van. */
export function reminderDigestEmail(p: {
  firmName: string;
  audience: { kind: 'office' } | { kind: 'engineer'; name: string };
  lines: DigestLine[];
  link: string;
}): RenderedDigest {
  const intro =
    p.audience.kind === 'office'
      ? `Heatfleet found ${count(p.lines.length)} for ${p.firmName} today.`
      : `Hello ${p.audience.name}, Heatfleet found ${count(p.lines.length)} for your van at ${p.firmName} today.`;
  const parts = sections(p.lines);
  const text = [
    intro,
    ...parts.map((s) => `${s.title}:\n${s.lines.map((l) => `- ${l}`).join('\n')}`),
    `You get each reminder once for each time it falls due. All of them are in Heatfleet: ${p.link}`,
  ].join('\n\n');
  const html = `<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">
<p>${escapeHtml(intro)}</p>
${parts.map((s) => `<h3>${escapeHtml(s.title)}</h3>\n<ul>${s.lines.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul>`).join('\n')}
<p>You get each reminder once for each time it falls due. <a href="${escapeHtml(p.link)}">All of them are in Heatfleet</a></p>
<p style="color:#555">Heatfleet</p></body></html>`;
  const subject =
    p.audience.kind === 'office'
      ? `${p.firmName}: ${count(p.lines.length)} for ${topics(p.lines)}`
      : `Your van: ${count(p.lines.length)} from ${p.firmName}`;
  return { subject, text: `${text}\n`, html };
}

/**
 * To a customer whose site falls due its yearly inhibitor check, when the firm has turned this on. It offers a paid
 * visit, so it is direct marketing: it names the sender and ends with a free, one-step way to refuse more
 * (Privacy and Electronic Communications (EC Directive) Regulations 2003, regulations 22 and 23).
 */
export function annualCheckCustomerEmail(p: {
  firmName: string;
  customerName: string;
  address: string;
  dueOn: string;
  unsubscribeLink: string;
}): RenderedDigest {
  const due = formatUkCalendarDate(p.dueOn);
  const paragraphs = [
    `Dear ${p.customerName},`,
    `The heating system at ${p.address} is due its yearly inhibitor check on ${due}. The check tests that the protective inhibitor in the system water is still at the right strength, so the radiators and boiler stay free of sludge and scale.`,
    `Please contact ${p.firmName} to arrange a visit.`,
    p.firmName,
  ];
  const why = `You get this because ${p.firmName} looks after the heating at ${p.address}.`;
  const optOut = `${why} To stop these e-mails from ${p.firmName}, open this link (no sign-in needed):`;
  const html = `<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5">
${paragraphs.map((line) => `<p>${escapeHtml(line)}</p>`).join('\n')}
<p style="color:#555; font-size: 0.9em">${escapeHtml(why)} <a href="${escapeHtml(p.unsubscribeLink)}">Stop these e-mails from ${escapeHtml(p.firmName)}</a> (one click on the page that opens, no sign-in needed).</p>
</body></html>`;
  return {
    subject: `${p.firmName}: your heating system's yearly check is due`,
    text: `${paragraphs.join('\n\n')}\n\n${optOut}\n${p.unsubscribeLink}\n`,
    html,
  };
}
