import express, { type Router } from 'express';
import { escapeHtml } from '../../mail/templates/layout';
import { type FakeSession, type FakeState, newId } from './state';

/** What Pay does once the session is marked paid: send the completed event to the app. */
export type OnPaid = (sessionId: string) => Promise<unknown>;

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{margin:0;min-height:100vh;display:grid;place-items:center;background:#0f1a2f;color:#141b2b;font-family:system-ui,sans-serif}
main{background:#fff;border-radius:14px;padding:28px 32px;max-width:420px;width:calc(100% - 48px);box-shadow:0 12px 40px rgb(0 0 0/.35)}
h1{font-size:20px;margin:0 0 4px} p{margin:6px 0 0;line-height:1.5} .amount{font-size:30px;font-weight:800;margin:18px 0}
.note{font-size:13px;color:#545c6e} .row{display:flex;gap:10px;margin-top:22px}
button{font:inherit;font-weight:700;border-radius:8px;padding:10px 18px;cursor:pointer;border:1px solid #d6d1c5;background:#fff}
button.pay{background:#2f9e5e;color:#fff;border-color:#2f9e5e;flex:1}
button:focus-visible{outline:3px solid #d99a1e;outline-offset:2px}
</style></head><body><main>${body}</main></body></html>`;
}

const notFoundPage = () => page('Checkout not found', '<h1>This checkout has expired or never existed.</h1>');

/** A session that is no longer open: say so and link back to the shop. */
function closedPage(s: FakeSession): string {
  return page(
    'Checkout',
    `<h1>This checkout is already ${s.status === 'complete' ? 'paid' : 'closed'}.</h1><p><a href="${escapeHtml(s.success_url)}">Return to the shop</a></p>`,
  );
}

/** The open session: what is bought, for how much, and the two buttons. */
function openPage(s: FakeSession): string {
  const amount = `${(s.amount_total / 100).toFixed(2)} ${s.currency.toUpperCase()}`;
  return page(
    'Checkout',
    `<p class="note">Local test checkout: nothing is charged, no card is asked for.</p>
<h1>${escapeHtml(s._label)}</h1>
${s.customer_email ? `<p class="note">Receipt to ${escapeHtml(s.customer_email)}</p>` : ''}
<p class="amount" data-testid="checkout-amount">${escapeHtml(amount)}</p>
<div class="row">
<form method="post" action="/pay/${escapeHtml(s.id)}/cancel"><button type="submit">Cancel</button></form>
<form method="post" action="/pay/${escapeHtml(s.id)}/complete" style="flex:1;display:flex"><button type="submit" class="pay">Pay ${escapeHtml(amount)}</button></form>
</div>`,
  );
}

/** The page a buyer is sent to (the session's `url`), with Pay and Cancel, under /pay. */
export function checkoutPageRouter(state: FakeState, onPaid: OnPaid): Router {
  const router = express.Router();

  router.get('/:id', (req, res) => {
    const s = state.sessions.get(req.params.id);
    if (!s) return res.status(404).type('html').send(notFoundPage());
    res.type('html').send(s.status === 'open' ? openPage(s) : closedPage(s));
  });

  router.post('/:id/complete', async (req, res) => {
    const s = state.sessions.get(req.params.id);
    if (!s) return res.status(404).type('text').send('No such checkout');
    // A second Pay (a double click, the back button) changes nothing and sends nothing.
    if (s.status === 'open') {
      s.status = 'complete';
      s.payment_status = 'paid';
      s.payment_intent = newId('pi');
      await onPaid(s.id);
    }
    res.redirect(303, s.success_url);
  });

  router.post('/:id/cancel', (req, res) => {
    const s = state.sessions.get(req.params.id);
    if (!s) return res.status(404).type('text').send('No such checkout');
    // The real service leaves the session open (it expires later) and sends no completed event.
    res.redirect(303, s.cancel_url);
  });

  return router;
}
