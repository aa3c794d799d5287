/** The texts of the e-mails Swardwise sends. Plain text: it reads on every phone. */
import type { OutgoingMail } from './mailer.ts';
import { WORK_TASK_LABELS, type WorkTask } from '@swardwise/domain';

export function invitationMail(to: string, name: string, role: string, url: string): OutgoingMail {
  return {
    to,
    subject: 'Your Swardwise account is ready',
    text: [
      `Hello ${name},`,
      '',
      `An administrator has given you a Swardwise account as ${role}.`,
      'Choose your password here (the link works once, for 7 days):',
      '',
      url,
      '',
      'If you did not expect this, you can ignore this message.',
    ].join('\n'),
  };
}

export function passwordResetMail(to: string, name: string, url: string): OutgoingMail {
  return {
    to,
    subject: 'Reset your Swardwise password',
    text: [
      `Hello ${name},`,
      '',
      'Someone asked to reset the password of your Swardwise account.',
      'Choose a new password here (the link works once, for one hour):',
      '',
      url,
      '',
      'If it was not you, ignore this message: your password stays as it is.',
    ].join('\n'),
  };
}

interface WorkLine {
  task: WorkTask;
  fieldName: string;
  siteName: string;
  plannedDate: string;
  plannedHours: number;
  fromDate?: string | null;
}

const when = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', month: 'short', day: 'numeric', timeZone: 'UTC' });

/** To a crew lead: work assigned to the crew, moved to another day, or taken off the crew. */
export function workMovedMail(to: string, name: string, crewName: string, notice: { kind: 'assigned' | 'moved' | 'removed'; orders: readonly WorkLine[] }, byName: string, portalUrl: string): OutgoingMail {
  const n = notice.orders.length;
  const jobs = n === 1 ? 'a job' : `${n} jobs`;
  const subject =
    notice.kind === 'assigned'
      ? `New work for ${crewName}: ${jobs}`
      : notice.kind === 'moved'
        ? `Work moved for ${crewName}: ${jobs}`
        : `Work taken off ${crewName}: ${jobs}`;
  const lines = [...notice.orders]
    .sort((a, b) => (a.plannedDate < b.plannedDate ? -1 : a.plannedDate > b.plannedDate ? 1 : 0))
    .map((o) => {
      const moved = o.fromDate && o.fromDate !== o.plannedDate ? ` (was ${when(o.fromDate)})` : '';
      return `- ${when(o.plannedDate)}${moved}: ${WORK_TASK_LABELS[o.task]}, ${o.fieldName ? `${o.fieldName} at ${o.siteName}` : `at ${o.siteName}`}, ${o.plannedHours.toFixed(1)} h planned`;
    });
  const intro =
    notice.kind === 'assigned'
      ? `${byName} assigned this work to ${crewName}:`
      : notice.kind === 'moved'
        ? `${byName} moved this work of ${crewName} to another day:`
        : `${byName} took this work off ${crewName}:`;
  return {
    to,
    subject,
    text: [`Hello ${name},`, '', intro, '', ...lines, '', `Your route for each day is on Today: ${portalUrl.replace(/\/$/, '')}/today`, '', 'Check slopes, wet ground and the weather before mowing; clear the field when thunder is heard.'].join('\n'),
  };
}

export interface ClosureNotice {
  fieldName: string;
  siteName: string;
  status: 'open' | 'restricted' | 'closed';
  /** The reason in plain words; null for a reopening. */
  reason: string | null;
  expectedReopenOn: string | null;
  caution: string | null;
}

/** To a partner of the site: a field closed, restricted or reopened. No internal note, no names. */
export function closureMail(to: string, name: string, notice: ClosureNotice, portalUrl: string): OutgoingMail {
  const where = `${notice.fieldName} at ${notice.siteName}`;
  const subject = notice.status === 'open' ? `Reopened: ${where}` : notice.status === 'closed' ? `Closed: ${where}` : `Restricted: ${where}`;
  const said =
    notice.status === 'open'
      ? `${where} is open for play again.`
      : `${where} is ${notice.status === 'closed' ? 'closed to play' : 'open for restricted play only'}. ${notice.reason ?? ''}`.trim();
  const lines = [`Hello ${name},`, '', said];
  if (notice.status !== 'open') lines.push('', notice.expectedReopenOn ? `Expected to reopen: ${when(notice.expectedReopenOn)}.` : 'No reopening date is set yet.');
  if (notice.caution) lines.push('', notice.caution);
  lines.push('', `The status of every field: ${portalUrl.replace(/\/$/, '')}/status`);
  return { to, subject, text: lines.join('\n') };
}

/** What happened to a request: filed and replied go to the foreman, the rest to the partner who filed it. */
export type RequestStep = 'filed' | 'replied' | 'answered' | 'scheduled' | 'done' | 'declined';

export interface RequestNotice {
  id: number;
  step: RequestStep;
  /** The kind in words ("Lines for a game"). */
  kind: string;
  fieldName: string;
  siteName: string;
  /** The game's day (game requests). */
  gameOn: string | null;
  /** The layout in words (game requests). */
  layout: string | null;
  /** What the step says: the description, the message, the reason, the foreman's note. */
  text: string;
  /** Who took the step. */
  byName: string;
  /** For a scheduled request: the work it became, in words. */
  work?: string | null;
}

const REQUEST_SUBJECTS: Record<RequestStep, string> = {
  filed: 'New request',
  replied: 'Reply on request',
  answered: 'Answer to your request',
  scheduled: 'Scheduled: your request',
  done: 'Done: your request',
  declined: 'Declined: your request',
};

/** A step of a partner's request, to the foreman or to the partner; the link opens the request. */
export function requestMail(to: string, name: string, notice: RequestNotice, portalUrl: string): OutgoingMail {
  const where = `${notice.fieldName} at ${notice.siteName}`;
  const what = `${notice.kind}${notice.gameOn ? ` on ${when(notice.gameOn)}` : ''}${notice.layout ? ` (${notice.layout})` : ''}`;
  const lines = [`Hello ${name},`, ''];
  switch (notice.step) {
    case 'filed':
      lines.push(`${notice.byName} filed a request for ${where}: ${what}.`, '', notice.text);
      break;
    case 'replied':
      lines.push(`${notice.byName} replied on the request for ${where} (${what}):`, '', notice.text);
      break;
    case 'answered':
      lines.push(`${notice.byName} answered your request for ${where} (${what}):`, '', notice.text);
      break;
    case 'scheduled':
      lines.push(`Your request for ${where} (${what}) is scheduled.`);
      if (notice.work) lines.push('', notice.work);
      if (notice.text) lines.push('', notice.text);
      break;
    case 'done':
      lines.push(`Your request for ${where} (${what}) is done.`);
      if (notice.text) lines.push('', notice.text);
      break;
    case 'declined':
      lines.push(`Your request for ${where} (${what}) was declined.`, '', `Reason: ${notice.text}`);
      break;
  }
  lines.push('', `The request: ${portalUrl.replace(/\/$/, '')}/requests?open=${notice.id}`);
  return { to, subject: `${REQUEST_SUBJECTS[notice.step]} #${notice.id} — ${where}`, text: lines.join('\n') };
}
