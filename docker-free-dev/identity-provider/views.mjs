// @ts-check
// The identity provider's own pages: sign-in, sign-out and plain messages. Styles come from
// /assets/idp.css served by the fake itself; nothing is loaded from any other host.

/** @param {unknown} value */
export function escapeHtml(value) {
  return String(value ?? '').replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );
}

/** A small mark: four interlocking floor tiles. */
const MARK = `<svg class="mark" viewBox="0 0 32 32" aria-hidden="true" focusable="false">
  <rect x="2" y="2" width="13" height="13" rx="2" />
  <rect x="17" y="2" width="13" height="13" rx="2" class="alt" />
  <rect x="2" y="17" width="13" height="13" rx="2" class="alt" />
  <rect x="17" y="17" width="13" height="13" rx="2" />
</svg>`;

/**
 * The page frame shared by every page of the fake.
 * @param {{ title: string, body: string, head?: string }} page
 */
export function layout({ title, body, head = '' }) {
  return `<!doctype html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <meta name="viewport" content="width=device-width, initial-scale=1">
  <meta name="robots" content="noindex">
  <title>${escapeHtml(title)} · Latchwork</title>
  <link rel="icon" href="data:,">
  <link rel="stylesheet" href="/assets/idp.css">
  ${head}
</head>
<body>
  <main class="card">
    <header class="brand">${MARK}<span class="product">Latchwork</span></header>
    ${body}
  </main>
  <p class="footnote">Local sign-in service for development and demos.</p>
</body>
</html>`;
}

/**
 * The sign-in form. The same message is shown for an unknown e-mail and a wrong password.
 * @param {{ uid: string, email?: string, error?: string, abortUrl: string }} model
 */
export function signInPage({ uid, email = '', error, abortUrl }) {
  const invalid = error ? ' aria-invalid="true" aria-describedby="form-error"' : '';
  const alert = error
    ? `<div class="alert" role="alert" id="form-error">${escapeHtml(error)}</div>`
    : '';
  return layout({
    title: 'Sign in',
    body: `<h1>Sign in</h1>
    <p class="lead">Use the e-mail address your firm invited you with.</p>
    ${alert}
    <form method="post" action="/interaction/${escapeHtml(uid)}/login" novalidate>
      <div class="field">
        <label for="email">E-mail</label>
        <input id="email" name="email" type="email" autocomplete="username" required
          spellcheck="false" autocapitalize="none" value="${escapeHtml(email)}"${invalid}${email ? '' : ' autofocus'}>
      </div>
      <div class="field">
        <label for="password">Password</label>
        <input id="password" name="password" type="password" autocomplete="current-password"
          required${invalid}${email ? ' autofocus' : ''}>
      </div>
      <button type="submit" class="primary">Sign in</button>
    </form>
    <p class="secondary"><a href="${escapeHtml(abortUrl)}">Cancel and go back</a></p>`,
  });
}

/**
 * A page with a heading, a message and an optional link.
 * @param {{ title: string, message: string, link?: { href: string, text: string } }} model
 */
export function messagePage({ title, message, link }) {
  return layout({
    title,
    body: `<h1>${escapeHtml(title)}</h1>
    <p class="lead">${escapeHtml(message)}</p>
    ${link ? `<p><a class="button" href="${escapeHtml(link.href)}">${escapeHtml(link.text)}</a></p>` : ''}`,
  });
}

/**
 * The sign-out confirmation. `form` is oidc-provider's hidden form (it carries the anti-forgery
 * token). When our own app asked with a valid id_token_hint, the page confirms itself; without
 * scripts, or without the hint, the person presses the button.
 * @param {{ form: string, autoConfirm: boolean, nonce: string }} model
 */
export function signOutPage({ form, autoConfirm, nonce }) {
  const script = autoConfirm
    ? `<script nonce="${nonce}">
        (function () {
          var f = document.getElementById('op.logoutForm');
          var yes = document.createElement('input');
          yes.type = 'hidden'; yes.name = 'logout'; yes.value = 'yes';
          f.appendChild(yes); f.submit();
        })();
      </script>`
    : '';
  return layout({
    title: 'Sign out',
    body: `<h1>Sign out of Latchwork?</h1>
    <p class="lead">You will need your e-mail and password to sign in again.</p>
    ${form}
    <button type="submit" class="primary" form="op.logoutForm" name="logout" value="yes" autofocus>Sign out</button>
    ${script}`,
  });
}
