/**
 * The Stripe stand-in's own pages: the hosted payment page of a Checkout Session (a plain form whose
 * card number field is named `card`) and the Connect onboarding page an account link opens.
 * Plain HTML, no script, labelled fields, readable on a phone.
 */
import type { StripeObject } from './stripe-store';

const escape = (value: unknown) =>
	(typeof value === 'string' ? value : value === null || value === undefined ? '' : JSON.stringify(value)).replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string
	);

const zeroDecimal = new Set([
	'bif',
	'clp',
	'djf',
	'gnf',
	'jpy',
	'kmf',
	'krw',
	'mga',
	'pyg',
	'rwf',
	'ugx',
	'vnd',
	'vuv',
	'xaf',
	'xof',
	'xpf'
]);
const threeDecimal = new Set(['bhd', 'jod', 'kwd', 'omr', 'tnd']);

/** Minor units shown in major units, with the currency code (Stripe's own exponent table). */
export function formatMoney(amount: number, currency: string): string {
	const exponent = zeroDecimal.has(currency) ? 0 : threeDecimal.has(currency) ? 3 : 2;
	const sign = amount < 0 ? '-' : '';
	const abs = Math.abs(amount);
	const major = Math.floor(abs / 10 ** exponent);
	const minor = String(abs % 10 ** exponent).padStart(exponent, '0');
	return `${sign}${major.toLocaleString('en-GB')}${exponent ? `.${minor}` : ''} ${currency.toUpperCase()}`;
}

function layout(title: string, body: string): string {
	return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)}</title>
<style>
body{font-family:system-ui,sans-serif;background:#f5f5f4;color:#1c1917;margin:0;padding:1rem}
main{max-width:28rem;margin:2rem auto;background:#fff;border:1px solid #d6d3d1;border-radius:.75rem;padding:1.5rem}
h1{font-size:1.25rem;margin:0 0 .25rem}
p.note{color:#57534e;font-size:.875rem}
label{display:block;font-weight:600;margin:1rem 0 .25rem}
input{width:100%;box-sizing:border-box;font-size:1rem;padding:.6rem;border:1px solid #78716c;border-radius:.375rem}
input:focus,button:focus,a:focus{outline:3px solid #2563eb;outline-offset:2px}
button{margin-top:1.25rem;width:100%;font-size:1rem;padding:.7rem;border:0;border-radius:.375rem;background:#1e3a8a;color:#fff;cursor:pointer}
button.secondary{background:#e7e5e4;color:#1c1917}
.error{background:#fef2f2;border:1px solid #b91c1c;color:#7f1d1d;padding:.75rem;border-radius:.375rem;margin-top:1rem}
table{width:100%;border-collapse:collapse;margin-top:1rem}
td{padding:.35rem 0;border-bottom:1px solid #e7e5e4}td.amount{text-align:right}
tr.total td{font-weight:700;border-bottom:0}
a{color:#1e3a8a}
.test{font-size:.75rem;text-transform:uppercase;letter-spacing:.05em;color:#9a3412;background:#ffedd5;display:inline-block;padding:.1rem .4rem;border-radius:.25rem}
</style>
</head>
<body><main>${body}</main></body>
</html>`;
}

export function checkoutPage(
	session: StripeObject,
	items: StripeObject[],
	options: { error?: string; card?: string; email?: string | null; customerEmail?: string | null } = {}
): string {
	const currency = session.currency as string;
	const rows = items
		.map(
			(i) =>
				`<tr><td>${escape(i.description)}${(i.quantity as number) > 1 ? ` × ${escape(i.quantity)}` : ''}</td><td class="amount">${escape(formatMoney(i.amount_total as number, currency))}</td></tr>`
		)
		.join('');
	const summary = `<span class="test">Test mode</span>
<h1>Pay for your order</h1>
<table aria-label="Order summary"><tbody>${rows}<tr class="total"><td>Total</td><td class="amount">${escape(formatMoney(session.amount_total as number, currency))}</td></tr></tbody></table>`;
	const cancel = session.cancel_url ? `<p><a href="${escape(session.cancel_url)}">Cancel and go back</a></p>` : '';
	if (session.status === 'complete')
		return layout(
			'Payment complete',
			`${summary}<p role="status">This order has been paid. You can close this page.</p>`
		);
	if (session.status === 'expired')
		return layout(
			'Checkout expired',
			`${summary}<p role="status">This checkout has expired. Start again from the shop.</p>${cancel}`
		);
	const email = options.customerEmail
		? `<p class="note">Receipt to ${escape(options.customerEmail)}</p>`
		: `<label for="email">Email</label><input id="email" name="email" type="email" autocomplete="email" required value="${escape(options.email ?? '')}">`;
	const error = options.error ? `<div class="error" role="alert" id="card-error">${escape(options.error)}</div>` : '';
	return layout(
		'Pay',
		`${summary}
<form method="post">
${email}
<label for="card">Card number</label>
<input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required value="${escape(options.card ?? '')}"${options.error ? ' aria-invalid="true" aria-describedby="card-error"' : ''}>
<label for="expiry">Expiry (MM / YY)</label>
<input id="expiry" name="expiry" autocomplete="cc-exp" placeholder="12 / 34">
<label for="cvc">Security code</label>
<input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123">
${error}
<button type="submit">Pay ${escape(formatMoney(session.amount_total as number, currency))}</button>
</form>
<p class="note">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined; 4000 0000 0000 9995 has insufficient funds.</p>
${cancel}`
	);
}

export function onboardingPage(account: StripeObject): string {
	const profile = account.business_profile as { name: string | null };
	return layout(
		'Set up payouts',
		`<span class="test">Test mode</span>
<h1>Set up payouts</h1>
<p class="note">Account ${escape(account.id)}${account.email ? ` for ${escape(account.email)}` : ''}. In test mode no real details are needed: a test bank account is added.</p>
<form method="post">
<label for="name">Business name</label>
<input id="name" name="name" autocomplete="organization" value="${escape(profile?.name ?? '')}">
<button type="submit" name="action" value="complete">Agree and finish</button>
<button type="submit" name="action" value="later" class="secondary">Save and finish later</button>
</form>`
	);
}

export function messagePage(title: string, message: string, status = 'status'): string {
	return layout(title, `<h1>${escape(title)}</h1><p role="${status}">${escape(message)}</p>`);
}
