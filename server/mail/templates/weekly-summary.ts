import type { MailMessage } from '../mailer';
import { escapeHtml, layout } from './layout';

export interface SummaryLine {
  player: string;
  takes: number;
  /** mean accuracy this week, 0..1, or null without takes */
  accuracy: number | null;
  met: number;
  overdue: number;
}

const pct = (a: number | null) => (a === null ? '—' : `${Math.round(a * 100)}%`);

/** The teacher's Monday note: how each player of the studio practised over the last seven days. */
export function weeklySummaryMail(opts: {
  to: string;
  teacher: string;
  studio: string;
  week: string;
  assignments: number;
  lines: SummaryLine[];
  link: string;
}): MailMessage {
  const first = opts.teacher.split(/\s+/)[0] || opts.teacher;
  const rows = opts.lines.map(
    (l) =>
      `${l.player}: ${l.takes} ${l.takes === 1 ? 'take' : 'takes'}, accuracy ${pct(l.accuracy)}, ${l.met}/${opts.assignments} assignments met${l.overdue ? `, ${l.overdue} overdue` : ''}`,
  );
  const text = [
    `Hi ${first},`,
    '',
    `Here is ${opts.studio} over the last seven days (week of ${opts.week}):`,
    '',
    ...(rows.length ? rows.map((r) => `- ${r}`) : ['No players yet: invite them from the studio page.']),
    '',
    `The studio table: ${opts.link}`,
    '',
    'Sixfold',
  ].join('\n');
  const html = layout(`
    <p>Hi ${escapeHtml(first)},</p>
    <p>Here is <strong>${escapeHtml(opts.studio)}</strong> over the last seven days (week of ${escapeHtml(opts.week)}):</p>
    ${rows.length ? `<ul>${rows.map((r) => `<li>${escapeHtml(r)}</li>`).join('')}</ul>` : '<p>No players yet: invite them from the studio page.</p>'}
    <p><a href="${escapeHtml(opts.link)}">Open the studio table</a></p>
    <p>Sixfold</p>`);
  return { to: opts.to, subject: `${opts.studio}: the week in takes`, text, html };
}
