// @ts-check
// The fake's hosted pay page: what a customer sees after the product sends them to a Checkout
// Session's `url`. Our own design; styles from /assets/pay.css; no scripts, no other hosts.
import { formatMoney } from './objects.mjs';

/** @param {unknown} value */
function esc(value) {
  return String(value ?? '').replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );
}

/** @param {string} title @param {string} body */
function layout(title, body) {
  return `<!doctype html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <meta name="viewport" content="width=device-width, initial-scale=1">
  <meta name="robots" content="noindex">
  <title>${esc(title)}</title>
  <link rel="icon" href="data:,">
  <link rel="stylesheet" href="/assets/pay.css">
</head>
<body>
  <div class="banner" role="note">Test payment page on this machine — no real money moves.</div>
  <main class="sheet">
${body}
  </main>
</body>
</html>`;
}

/**
 * @param {Record<string, any>} session public view of the session
 * @param {Record<string, any>[]} lines
 * @param {{ error?: string, cardNumber?: string, email?: string }} [form]
 */
export function payPage(session, lines, form = {}) {
  const total = formatMoney(session['amount_total'], session['currency']);
  const rows = lines
    .map(
      (line) => `        <tr>
          <th scope="row">${esc(line['description'])}</th>
          <td class="num">${esc(line['quantity'])} × ${esc(formatMoney(line['price']['unit_amount'], line['currency']))}</td>
          <td class="num">${esc(formatMoney(line['amount_total'], line['currency']))}</td>
        </tr>`,
    )
    .join('\n');
  const summary = `    <h1>Pay ${esc(total)}</h1>
    <table class="lines">
      <caption class="visually-hidden">What you are paying for</caption>
      <thead><tr><th scope="col">Item</th><th scope="col" class="num">Qty × price</th><th scope="col" class="num">Amount</th></tr></thead>
      <tbody>
${rows}
      </tbody>
      <tfoot><tr><th scope="row" colspan="2">Total</th><td class="num total">${esc(total)}</td></tr></tfoot>
    </table>`;

  if (session['status'] === 'complete') {
    const next = session['success_url']
      ? `<p><a class="button" href="${esc(successUrl(session))}">Continue</a></p>`
      : '';
    return layout(
      'Paid',
      `${summary}\n    <p class="done" role="status">Paid. Thank you.</p>\n    ${next}`,
    );
  }
  if (session['status'] !== 'open') {
    const back = session['cancel_url']
      ? `<p><a class="button" href="${esc(session['cancel_url'])}">Go back</a></p>`
      : '';
    return layout(
      'Payment page expired',
      `${summary}\n    <p class="alert" role="alert">This payment page has expired. Ask for a new payment link.</p>\n    ${back}`,
    );
  }

  const error = form.error
    ? `    <div class="alert" role="alert" id="pay-error">${esc(form.error)}</div>\n`
    : '';
  const described = form.error
    ? ' aria-invalid="true" aria-describedby="pay-error card-hint"'
    : ' aria-describedby="card-hint"';
  const email = form.email ?? session['customer_email'] ?? '';
  const cancel = session['cancel_url']
    ? `    <p class="secondary"><a href="${esc(session['cancel_url'])}">Cancel and go back</a></p>`
    : '';
  return layout(
    `Pay ${total}`,
    `${summary}
${error}    <form method="post" action="/pay/${esc(session['id'])}" class="pay-form" novalidate>
      <div class="field">
        <label for="email">E-mail for the receipt</label>
        <input id="email" name="email" type="email" autocomplete="email" value="${esc(email)}">
      </div>
      <div class="field">
        <label for="card_number">Card number</label>
        <input id="card_number" name="card_number" inputmode="numeric" autocomplete="off"
          placeholder="4242 4242 4242 4242" value="${esc(form.cardNumber ?? '')}" required${described}>
        <p class="hint" id="card-hint">Test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.</p>
      </div>
      <button type="submit" class="button">Pay ${esc(total)}</button>
    </form>
${cancel}`,
  );
}

/**
 * The success URL with the processor's `{CHECKOUT_SESSION_ID}` template filled in.
 * @param {Record<string, any>} session
 */
export function successUrl(session) {
  return String(session['success_url']).replaceAll('{CHECKOUT_SESSION_ID}', session['id']);
}

/** @param {string} title @param {string} message */
export function plainPage(title, message) {
  return layout(title, `    <h1>${esc(title)}</h1>\n    <p>${esc(message)}</p>`);
}
