import type { MailMessage } from '../mailer';
import { escapeHtml, layout } from './layout';

/** The invitation to join a studio, with its single-use link. */
export function studioInviteMail(opts: {
  to: string;
  teacher: string;
  studio: string;
  link: string;
  days: number;
}): MailMessage {
  const text = [
    'Hello,',
    '',
    `${opts.teacher} invites you to join ${opts.studio} on Sixfold, where you'll find the drills they set and leave remarks on your takes.`,
    '',
    'Open this link to join (you can make an account there if you have none):',
    '',
    opts.link,
    '',
    `It works once, for the next ${opts.days} days.`,
    '',
    'See you at the next take,',
    'Sixfold',
  ].join('\n');
  const html = layout(`
    <p>Hello,</p>
    <p>${escapeHtml(opts.teacher)} invites you to join <strong>${escapeHtml(opts.studio)}</strong> on Sixfold, where you'll find the drills they set and leave remarks on your takes.</p>
    <p><a href="${escapeHtml(opts.link)}" style="display:inline-block;padding:10px 18px;border-radius:8px;background:#182743;color:#ffffff;font-weight:700;text-decoration:none">Join ${escapeHtml(opts.studio)}</a></p>
    <p style="color:#545c6e">Or paste this address into your browser:<br><a href="${escapeHtml(opts.link)}">${escapeHtml(opts.link)}</a></p>
    <p>It works once, for the next ${opts.days} days. You can make an account there if you have none.</p>
    <p>See you at the next take,<br>Sixfold</p>`);
  return { to: opts.to, subject: `Join ${opts.studio} on Sixfold`, text, html };
}
