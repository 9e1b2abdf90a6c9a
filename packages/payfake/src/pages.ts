const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
export const esc = (text: string): string => text.replace(/[&<>"']/g, (c) => escapes[c]!);

export function formatMoney(amount: number, currency: string): string {
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(amount / 100);
}

/** The fake's own hosted pages: plain HTML forms, large enough to use on a phone. */
export function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en-GB"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(title)}</title>
<style>
body{font-family:system-ui,sans-serif;margin:0;background:#eef1f5;color:#1d2430}
main{max-width:26rem;margin:0 auto;padding:1.5rem 1rem}
.banner{background:#5b3d99;color:#fff;font-size:.85rem;padding:.5rem 1rem;text-align:center}
h1{font-size:1.35rem}label{display:block;font-weight:600;margin:.9rem 0 .3rem}
input{box-sizing:border-box;width:100%;min-height:48px;font-size:1.05rem;padding:.5rem;border:2px solid #8a94a6;border-radius:6px}
button,.button{display:block;width:100%;min-height:48px;margin-top:1.2rem;font-size:1.05rem;border:0;border-radius:6px;background:#1b5fc1;color:#fff;text-align:center;line-height:48px;text-decoration:none}
.secondary{background:#fff;color:#1b5fc1;border:2px solid #1b5fc1}
.error{background:#fde8e8;border:2px solid #b42318;color:#7a1610;padding:.6rem;border-radius:6px}
.total{font-size:1.6rem;font-weight:700}.hint{font-size:.85rem;color:#4a5568}
table{width:100%;border-collapse:collapse}td{padding:.3rem 0}td.amount{text-align:right}
</style></head>
<body><div class="banner">Local payment stand-in: no real money moves</div><main>${body}</main></body></html>`;
}

export function cardFields(): string {
  return `<label for="card_number">Card number</label>
<input id="card_number" name="card_number" inputmode="numeric" autocomplete="cc-number" required>
<label for="expiry">Expiry (MM / YY)</label>
<input id="expiry" name="expiry" inputmode="numeric" autocomplete="cc-exp" value="12 / 34" required>
<label for="cvc">Security code</label>
<input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" value="123" required>
<p class="hint">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.</p>`;
}

export function errorBox(message: string | null): string {
  return message === null ? '' : `<p class="error" role="alert">${esc(message)}</p>`;
}

export function messagePage(title: string, message: string): string {
  return page(title, `<h1>${esc(title)}</h1><p>${esc(message)}</p>`);
}
