import type { MailMessage } from '../mailer';
import { escapeHtml, layout } from './layout';

/** Tells a player their teacher left a remark on one of their takes. */
export function takeRemarkMail(opts: {
  to: string;
  player: string;
  teacher: string;
  take: string;
  body: string;
  pinned: string | null;
  link: string;
}): MailMessage {
  const first = opts.player.split(/\s+/)[0] || opts.player;
  const where = opts.pinned ? ` at ${opts.pinned}` : '';
  const text = [
    `Hi ${first},`,
    '',
    `${opts.teacher} left a remark on your take of ${opts.take}${where}:`,
    '',
    `  ${opts.body.replace(/\n/g, '\n  ')}`,
    '',
    `Read it against the notes, and answer, here: ${opts.link}`,
    '',
    'Sixfold',
  ].join('\n');
  const html = layout(`
    <p>Hi ${escapeHtml(first)},</p>
    <p>${escapeHtml(opts.teacher)} left a remark on your take of ${escapeHtml(opts.take)}${escapeHtml(where)}:</p>
    <blockquote style="margin:0 0 16px;padding:8px 14px;border-left:3px solid #b67b0c;white-space:pre-wrap">${escapeHtml(opts.body)}</blockquote>
    <p><a href="${escapeHtml(opts.link)}">Read it against the notes, and answer</a></p>
    <p>Sixfold</p>`);
  return { to: opts.to, subject: `A remark from ${opts.teacher} on your take`, text, html };
}
