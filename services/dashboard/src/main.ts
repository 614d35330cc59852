/**
 * The betasweep dashboard: a single page served by the API at `/`. Routes live in the URL
 * hash (#/ the sweeps, #/new a new sweep, #/sweeps/ID one sweep), so the browser's back and
 * forward buttons work and a link to a sweep can be shared with someone holding a token.
 */
import 'uplot/dist/uPlot.min.css';
import './styles.css';
import { h, replace } from './dom.js';
import { loadToken, saveToken } from './token-store.js';
import { listView } from './views/list-view.js';
import { submitView } from './views/submit-view.js';
import { sweepView } from './views/sweep-view.js';
import { tokenView } from './views/token-view.js';

const main = document.getElementById('main')!;
const tokenBox = document.getElementById('token-state')!;
let current: { stop: () => void } | null = null;
let showingToken = false;

const SWEEP_ROUTE = /^#\/sweeps\/(sw_[a-z2-7]{16})$/;

function renderTokenState(): void {
  if (loadToken()) {
    replace(tokenBox, h('span', { class: 'token-on' }, 'Token set for this tab'), ' ',
      h('button', { type: 'button', class: 'link-button', onclick: () => { saveToken(null); route('Token forgotten.'); } }, 'Forget token'));
  } else {
    replace(tokenBox, h('span', { class: 'token-off' }, 'Not connected'));
  }
}

function setNav(active: string): void {
  for (const a of document.querySelectorAll<HTMLAnchorElement>('nav.main-nav a')) {
    if (a.dataset.route === active) a.setAttribute('aria-current', 'page');
    else a.removeAttribute('aria-current');
  }
}

let firstView = true;

/** Shows the view of the current hash (or the token form when there is no token). */
function route(reason?: string): void {
  current?.stop();
  current = null;
  renderTokenState();
  if (!loadToken()) {
    showingToken = true;
    setNav('');
    document.title = 'Connect · betasweep';
    replace(main, tokenView(() => { showingToken = false; route(); }, reason));
    focusHeading();
    return;
  }
  showingToken = false;
  const hash = location.hash || '#/';
  const sweep = SWEEP_ROUTE.exec(hash);
  let view: { el: HTMLElement; stop: () => void };
  if (sweep) {
    setNav('');
    view = sweepView(sweep[1]);
  } else if (hash === '#/new') {
    setNav('new');
    document.title = 'New sweep · betasweep';
    view = submitView((id) => { location.hash = `#/sweeps/${id}`; });
  } else {
    setNav('list');
    document.title = 'Sweeps · betasweep';
    view = listView();
  }
  current = view;
  replace(main, view.el);
  focusHeading();
}

function focusHeading(): void {
  // On a change of view, move focus to its heading so screen readers announce the new page.
  // Not on the first load: the page starts at the top, where the skip link is the first stop.
  if (firstView) { firstView = false; return; }
  requestAnimationFrame(() => main.querySelector<HTMLElement>('h1')?.focus({ preventScroll: false }));
}

document.querySelector('.skip-link')?.addEventListener('click', (ev) => {
  // The hash holds the route: move focus without changing it.
  ev.preventDefault();
  main.focus();
});
window.addEventListener('hashchange', () => route());
window.addEventListener('bsw:unauthorized', (ev) => {
  if (showingToken) return;
  saveToken(null);
  route(`The service no longer accepts the token (${String((ev as CustomEvent).detail ?? 'rejected')}). Enter a valid one.`);
});
route();
