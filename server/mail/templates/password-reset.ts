import type { MailMessage } from '../mailer';
import { escapeHtml, layout } from './layout';

/** The e-mail with a single-use link to choose a new password. */
export function passwordResetMail(opts: { to: string; name: string; link: string; minutes: number }): MailMessage {
  const first = opts.name.split(/\s+/)[0] || opts.name;
  const text = [
    `Hi ${first},`,
    '',
    'Someone asked to choose a new password for your Sixfold account. If that was you, open this link:',
    '',
    opts.link,
    '',
    `It works once, for the next ${opts.minutes} minutes. If you didn't ask, ignore this note: your password stays as it is.`,
    '',
    'See you at the next take,',
    'Sixfold',
  ].join('\n');
  const html = layout(`
    <p>Hi ${escapeHtml(first)},</p>
    <p>Someone asked to choose a new password for your Sixfold account. If that was you, use the button below.</p>
    <p><a href="${escapeHtml(opts.link)}" style="display:inline-block;padding:10px 18px;border-radius:8px;background:#182743;color:#ffffff;font-weight:700;text-decoration:none">Choose a new password</a></p>
    <p style="color:#545c6e">Or paste this address into your browser:<br><a href="${escapeHtml(opts.link)}">${escapeHtml(opts.link)}</a></p>
    <p>It works once, for the next ${opts.minutes} minutes. If you didn't ask, ignore this note: your password stays as it is.</p>
    <p>See you at the next take,<br>Sixfold</p>`);
  return { to: opts.to, subject: 'Choose a new Sixfold password', text, html };
}
