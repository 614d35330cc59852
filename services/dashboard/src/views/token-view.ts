/** Asks for the access token, checks it against the service, and keeps it for this tab. */
import { ApiError, apiJson } from '../api.js';
import { h } from '../dom.js';
import { saveToken } from '../token-store.js';

/** The token form; `onAccepted` runs once the service accepted the token. */
export function tokenView(onAccepted: () => void, reason?: string): HTMLElement {
  const input = h('input', {
    id: 'token-input', name: 'token', type: 'password', autocomplete: 'off', spellcheck: 'false', required: true,
    'aria-describedby': 'token-help token-error',
  });
  const error = h('p', { id: 'token-error', class: 'field-error', role: 'alert' }, reason ?? '');
  const submit = h('button', { type: 'submit', class: 'primary' }, 'Connect');
  const form = h('form', { class: 'token-form', novalidate: true },
    h('label', { for: 'token-input' }, 'Access token'),
    input,
    h('p', { id: 'token-help', class: 'hint' },
      'Ask the service admin for one (', h('code', {}, 'betasweep token create --name NAME'),
      '). It is kept in this tab only and sent with each request; closing the tab forgets it.'),
    error,
    submit,
  );
  form.addEventListener('submit', (ev) => {
    ev.preventDefault();
    const token = input.value.trim();
    if (!token) {
      error.textContent = 'Enter a token.';
      input.setAttribute('aria-invalid', 'true');
      input.focus();
      return;
    }
    submit.disabled = true;
    error.textContent = '';
    apiJson('GET', '/v1/sweeps?limit=1', undefined, token).then(() => {
      saveToken(token);
      onAccepted();
    }, (err: unknown) => {
      submit.disabled = false;
      input.setAttribute('aria-invalid', 'true');
      error.textContent = err instanceof ApiError && err.status === 401
        ? 'The service did not accept this token. Check it, or ask for a new one.'
        : `Could not check the token: ${(err as Error).message}`;
      input.focus();
    });
  });
  return h('section', { class: 'panel narrow-panel', 'aria-labelledby': 'token-heading' },
    h('h1', { id: 'token-heading', tabindex: '-1' }, 'Connect to the service'),
    form);
}
