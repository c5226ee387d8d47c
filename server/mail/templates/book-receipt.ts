import { formatPrice } from '../../../shared/schemas/books';
import type { MailMessage } from '../mailer';
import { escapeHtml, layout } from './layout';

/** The receipt a player gets when a drill book's payment has come through. */
export function bookReceiptMail(opts: {
  to: string;
  player: string;
  book: string;
  teacher: string;
  amountMinor: number;
  currency: string;
  purchaseId: string;
  paidAt: Date;
  link: string;
}): MailMessage {
  const first = opts.player.split(/\s+/)[0] || opts.player;
  const amount = formatPrice(opts.amountMinor, opts.currency);
  const day = opts.paidAt.toISOString().slice(0, 10);
  const text = [
    `Hi ${first},`,
    '',
    `Thank you for buying "${opts.book}" by ${opts.teacher}. Every drill in it is open to you now,`,
    'in all twelve keys, and your takes count on your maps as usual.',
    '',
    `  Book:      ${opts.book}`,
    `  Paid:      ${amount}`,
    `  Date:      ${day}`,
    `  Receipt:   ${opts.purchaseId}`,
    '',
    `Open the book: ${opts.link}`,
    '',
    'Sixfold',
  ].join('\n');
  const row = (k: string, v: string) =>
    `<tr><td style="padding:2px 16px 2px 0;color:#545c6e">${escapeHtml(k)}</td><td style="padding:2px 0">${escapeHtml(v)}</td></tr>`;
  const html = layout(`
    <p>Hi ${escapeHtml(first)},</p>
    <p>Thank you for buying <strong>${escapeHtml(opts.book)}</strong> by ${escapeHtml(opts.teacher)}. Every drill in it is open to you now, in all twelve keys, and your takes count on your maps as usual.</p>
    <table style="margin:0 0 16px;border-collapse:collapse">${row('Book', opts.book)}${row('Paid', amount)}${row('Date', day)}${row('Receipt', opts.purchaseId)}</table>
    <p><a href="${escapeHtml(opts.link)}">Open the book</a></p>
    <p>Sixfold</p>`);
  return { to: opts.to, subject: `Your receipt: ${opts.book}`, text, html };
}
