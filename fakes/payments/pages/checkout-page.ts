import { TEST_CARDS } from "../card-outcomes";
import { formatMinor } from "../money";
import type { CheckoutSession, LineItem } from "../types";
import { esc, renderPage } from "./layout";

export interface CheckoutPageInput {
  session: CheckoutSession;
  lineItems: LineItem[];
  manualCapture: boolean;
  error?: string;
  entered?: { card: string; email: string; name: string };
}

export function renderCheckoutPage(input: CheckoutPageInput): string {
  const { session, lineItems } = input;
  const total = formatMinor(session.amount_total, session.currency);
  const rows = lineItems
    .map(
      (item) => `<tr><td>${esc(item.description)}</td><td class="num">${item.quantity}</td>` +
        `<td class="num">${esc(formatMinor(item.price.unit_amount, item.currency))}</td>` +
        `<td class="num">${esc(formatMinor(item.amount_total, item.currency))}</td></tr>`,
    )
    .join("");
  const error = input.error
    ? `<p class="alert stop" role="alert" id="card-error">${esc(input.error)}</p>`
    : "";
  const describedBy = input.error ? "card-help card-error" : "card-help";
  const hold = input.manualCapture
    ? `<p class="alert note">Only an authorisation is placed now. The amount is taken later, or released if the order does not go ahead.</p>`
    : "";
  const cards = TEST_CARDS.map(
    (card) => `<li><span class="mono">${esc(card.grouped)}</span> ${esc(card.effect)}</li>`,
  ).join("");
  const cancel = session.cancel_url ? `<a href="${esc(session.cancel_url)}">Cancel and go back</a>` : "";
  const entered = input.entered ?? { card: "", email: session.customer_email ?? "", name: "" };
  const body = `
<h1>Pay ${esc(total)}</h1>
${hold}
<table>
<thead><tr><th>Item</th><th class="num">Qty</th><th class="num">Each</th><th class="num">Amount</th></tr></thead>
<tbody>${rows}</tbody>
<tfoot><tr><td colspan="3">Total</td><td class="num">${esc(total)}</td></tr></tfoot>
</table>
<form method="post" action="/pay/${esc(session.id)}" novalidate>
${error}
<label for="email">E-mail</label>
<input type="email" id="email" name="email" autocomplete="off" value="${esc(entered.email)}">
<label for="name">Name on card</label>
<input type="text" id="name" name="name" autocomplete="off" value="${esc(entered.name)}">
<label for="card">Card number</label>
<input type="text" id="card" name="card" class="mono" inputmode="numeric" autocomplete="off"
  placeholder="4242 4242 4242 4242" value="${esc(entered.card)}" aria-describedby="${describedBy}" required>
<div id="card-help">
<p class="hint">Only these test numbers are accepted:</p>
<ul class="cards">${cards}</ul>
</div>
<div class="row">
<div><label for="expiry">Expiry</label><input type="text" id="expiry" name="expiry" class="mono" value="12 / 34"></div>
<div><label for="cvc">Security code</label><input type="text" id="cvc" name="cvc" class="mono" value="123"></div>
</div>
<div class="actions">
<button type="submit">Pay ${esc(total)}</button>
${cancel}
</div>
</form>`;
  return renderPage({
    title: `Local test checkout — ${total}`,
    banner: "Local test checkout — no real money",
    body,
  });
}
