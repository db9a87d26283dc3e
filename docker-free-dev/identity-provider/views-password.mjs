// @ts-check
// The page where an invited person sets a password, and the page for a link that no longer
// works. Same frame and stylesheet as the sign-in page.
import { PASSWORD_RULES } from './password.mjs';
import { escapeHtml, layout, messagePage } from './views.mjs';

export const TICKET_GONE =
  'This link has expired or has already been used. Ask the person who invited you to send a new one.';

/**
 * @typedef {{ field: 'password' | 'repeat', message: string }} FieldError
 */

/**
 * One password input with its label, the rules hint and, when given, its inline error.
 * @param {{ id: string, label: string, hint?: string, error?: string }} input
 */
function passwordField({ id, label, hint, error }) {
  const described = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ');
  return `<div class="field">
        <label for="${id}">${escapeHtml(label)}</label>
        ${hint ? `<p class="hint" id="${id}-hint">${escapeHtml(hint)}</p>` : ''}
        <input id="${id}" name="${id}" type="password" autocomplete="new-password" required
          minlength="${PASSWORD_RULES.minLength}" maxlength="${PASSWORD_RULES.maxLength}"${
            described ? ` aria-describedby="${described}"` : ''
          }${error ? ' aria-invalid="true" autofocus' : ''}>
        ${error ? `<p class="field-error" id="${id}-error">${escapeHtml(error)}</p>` : ''}
      </div>`;
}

/**
 * The set-password form for the ticket's e-mail address. The e-mail is shown and also sent
 * as a read-only username field so that password managers save the pair.
 * @param {{ action: string, email: string, name?: string, error?: FieldError }} model
 */
export function setPasswordPage({ action, email, name, error }) {
  const alert = error
    ? `<div class="alert" role="alert">Your password was not saved. ${escapeHtml(error.message)}</div>`
    : '';
  const rules = `At least ${PASSWORD_RULES.minLength} characters (at most ${PASSWORD_RULES.maxLength}). A few unrelated words make a long password that is easy to remember.`;
  return layout({
    title: 'Set your password',
    body: `<h1>Set your password</h1>
    <p class="lead">${name ? `Welcome, ${escapeHtml(name)}. ` : ''}Choose the password you will sign in to Latchwork with.</p>
    ${alert}
    <form method="post" action="${escapeHtml(action)}" novalidate>
      <div class="field">
        <label for="email">E-mail</label>
        <input id="email" name="email" type="email" autocomplete="username" readonly
          value="${escapeHtml(email)}">
      </div>
      ${passwordField({
        id: 'password',
        label: 'New password',
        hint: rules,
        error: error?.field === 'password' ? error.message : undefined,
      })}
      ${passwordField({
        id: 'repeat',
        label: 'Repeat the new password',
        error: error?.field === 'repeat' ? error.message : undefined,
      })}
      <button type="submit" class="primary">Save password</button>
    </form>`,
  });
}

/** The page for an unknown, used or expired link (served with 410 Gone). */
export function ticketGonePage() {
  return messagePage({ title: 'This link no longer works', message: TICKET_GONE });
}
