import type { CrewMailReport } from '@swardwise/domain';

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * What confirming the week did, in one message: the orders assigned, the e-mails sent and,
 * when fewer went out than crews got work, why (mail off, crews with no crew-lead account,
 * e-mails the mail server refused). `warning` when a crew lead was not told by e-mail.
 */
export function confirmText(assigned: number, mail: CrewMailReport): { text: string; warning: boolean } {
  const head = `${plural(assigned, 'work order')} assigned`;
  if (mail.crews === 0) return { text: `${head}.`, warning: false };
  if (mail.mailOff) {
    return { text: `${head}; no e-mail sent: e-mail is not set up on this server. Tell the crew leads yourself; they see the work on Today.`, warning: true };
  }
  const why: string[] = [];
  if (mail.crewsWithoutLead.length) why.push(`${mail.crewsWithoutLead.join(', ')} ${mail.crewsWithoutLead.length === 1 ? 'has' : 'have'} no crew-lead account to write to`);
  if (mail.failed) why.push(`the mail server did not take ${plural(mail.failed, 'e-mail')}`);
  const sent = `${plural(mail.sent, 'e-mail')} sent to crew leads`;
  return why.length ? { text: `${head}; ${sent} (${why.join('; ')}).`, warning: true } : { text: `${head}; ${sent}.`, warning: false };
}
