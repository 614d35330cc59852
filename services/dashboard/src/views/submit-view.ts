/**
 * Submit a sweep: paste or load a JSON spec (or start from an example), see every problem
 * beside the editor as you type (the same zod schemas and issue messages as the service,
 * bundled into the page), ask the service for a plan (dry run), then submit. Problems the
 * service finds (lattice checks, engine refusals) appear in the same list. Each problem names
 * its field path and line, and a button puts the cursor on it.
 */
import { parseSpecInput } from '../../../../shared-types/src/parse-spec.js';
import chain8 from '../../../../shared-types/examples/chain8-field-quench.json' with { type: 'json' };
import ladder from '../../../../shared-types/examples/xxz-ladder-2x3.json' with { type: 'json' };
import ring6 from '../../../../shared-types/examples/ring6-y-terms.json' with { type: 'json' };
import { formatNumber } from '../../../plot/format-number.js';
import { ApiError, apiJson, type ApiIssue } from '../api.js';
import { announce, h, replace } from '../dom.js';
import { jsonErrorOffset, lineColumn, locateJsonPath } from '../json-locate.js';
import type { PlanReply } from '../types.js';

/** A small spec that runs in seconds: the page's starting text. */
const STARTER = {
  label: 'open Ising chain, 4 sites: field quench',
  lattice: { kind: 'chain', length: 4, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 1, 2],
  times: { start: 0, stop: 3, count: 31 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
};

const EXAMPLES: Array<{ name: string; spec: unknown }> = [
  { name: 'Small Ising chain (4 sites)', spec: STARTER },
  { name: 'Ising chain, 8 sites, three β', spec: chain8 },
  { name: 'XXZ ladder 2×3', spec: ladder },
  { name: 'XY ring with chiral quench', spec: ring6 },
];

interface ShownIssue { path: Array<string | number>; message: string; offset: [number, number] | null; fromService: boolean }

const bytes = (n: number) => (n >= 2 ** 30 ? `${formatNumber(n / 2 ** 30, 3)} GiB` : n >= 2 ** 20 ? `${formatNumber(n / 2 ** 20, 3)} MiB` : `${formatNumber(n / 1024, 3)} KiB`);

/** The submit view; `onSubmitted` gets the new (or existing) sweep's id. */
export function submitView(onSubmitted: (id: string) => void): { el: HTMLElement; stop: () => void } {
  const editor = h('textarea', {
    id: 'spec-input', class: 'spec-editor', rows: '22', spellcheck: 'false', autocomplete: 'off',
    'aria-describedby': 'spec-help spec-issues-summary', 'aria-invalid': 'false',
  }) as HTMLTextAreaElement;
  editor.value = JSON.stringify(STARTER, null, 2);
  const file = h('input', { id: 'spec-file', type: 'file', accept: '.json,application/json' }) as HTMLInputElement;
  const example = h('select', { id: 'spec-example' },
    h('option', { value: '' }, 'choose…'), ...EXAMPLES.map((e, i) => h('option', { value: String(i) }, e.name)));
  const summary = h('p', { id: 'spec-issues-summary', class: 'issues-summary' });
  const list = h('ul', { id: 'spec-issues', class: 'issues', 'aria-label': 'Problems in the spec' });
  const fresh = h('input', { id: 'spec-fresh', type: 'checkbox' }) as HTMLInputElement;
  const planButton = h('button', { type: 'button', class: 'plan-button' }, 'Plan (dry run)');
  const submitButton = h('button', { type: 'submit', class: 'primary submit-button' }, 'Submit sweep');
  const planOut = h('div', { class: 'plan-out', 'aria-live': 'polite' });
  let issues: ShownIssue[] = [];
  let timer: ReturnType<typeof setTimeout> | null = null;

  const showIssues = () => {
    editor.setAttribute('aria-invalid', String(issues.length > 0));
    if (issues.length === 0) {
      summary.textContent = '✓ The spec passes the checks in the page.';
      summary.className = 'issues-summary ok';
      replace(list);
      return;
    }
    summary.textContent = `${issues.length} problem${issues.length === 1 ? '' : 's'} in the spec:`;
    summary.className = 'issues-summary bad';
    replace(list, ...issues.map((iss) => {
      const where = iss.offset ? lineColumn(editor.value, iss.offset[0]) : null;
      const jump = iss.offset
        ? h('button', {
          type: 'button', class: 'issue-jump', 'aria-label': `Go to line ${where!.line}: ${iss.message}`,
          onclick: () => { editor.focus(); editor.setSelectionRange(iss.offset![0], iss.offset![1]); },
        }, `line ${where!.line}`)
        : null;
      return h('li', { class: 'issue', 'data-path': iss.path.join('.') }, jump, ' ', h('span', {}, iss.message),
        iss.fromService ? h('span', { class: 'issue-source' }, ' (found by the service)') : null);
    }));
  };

  /** Local checks: JSON syntax, then the spec schemas. Returns the parsed value when valid. */
  const check = (): unknown => {
    const text = editor.value;
    let value: unknown;
    try {
      value = JSON.parse(text);
    } catch (err) {
      const message = (err as Error).message;
      const at = jsonErrorOffset(text);
      issues = [{ path: [], message: `not valid JSON: ${message}`, offset: at === null ? null : [at, Math.min(text.length, at + 1)], fromService: false }];
      showIssues();
      return undefined;
    }
    const parsed = parseSpecInput(value);
    issues = parsed.success ? [] : parsed.issues.map((i) => ({
      path: i.path, message: i.message, offset: locateJsonPath(text, i.path), fromService: false,
    }));
    showIssues();
    return parsed.success ? value : undefined;
  };

  const serviceIssues = (err: unknown) => {
    if (err instanceof ApiError && err.issues.length) {
      issues = err.issues.map((i: ApiIssue) => ({ path: i.path, message: i.message, offset: locateJsonPath(editor.value, i.path), fromService: true }));
      showIssues();
      summary.textContent = `${err.status === 422 ? 'The service cannot run this spec' : 'The service found problems'}: ${issues.length}`;
    } else {
      issues = [{ path: [], message: (err as Error).message, offset: null, fromService: true }];
      showIssues();
    }
    announce(summary.textContent ?? '');
    list.querySelector<HTMLButtonElement>('button')?.focus();
  };

  editor.addEventListener('input', () => {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => void check(), 250);
  });
  file.addEventListener('change', () => {
    const f = file.files?.[0];
    if (!f) return;
    void f.text().then((text) => {
      editor.value = text;
      check();
      announce(`Loaded ${f.name}`);
    });
  });
  example.addEventListener('change', () => {
    const e = EXAMPLES[Number(example.value)];
    if (!example.value || !e) return;
    editor.value = JSON.stringify(e.spec, null, 2);
    check();
    announce(`Loaded the example "${e.name}"`);
  });
  planButton.addEventListener('click', () => {
    const spec = check();
    if (spec === undefined) { list.querySelector<HTMLButtonElement>('button')?.focus(); return; }
    planButton.disabled = true;
    replace(planOut, h('p', {}, 'Asking the service for a plan…'));
    apiJson<PlanReply>('POST', '/v1/plan', spec).then((r) => {
      const p = r.plan;
      replace(planOut, h('h2', {}, 'Plan'), h('dl', { class: 'facts' },
        h('dt', {}, 'Engine'), h('dd', {}, p.engine),
        h('dt', {}, 'Why'), h('dd', {}, p.reason),
        h('dt', {}, 'Points'), h('dd', {}, String(r.points)),
        h('dt', {}, 'Estimated time (one core)'), h('dd', {}, `${formatNumber(p.seconds, 2)} s`),
        h('dt', {}, 'Memory per branch'), h('dd', {}, bytes(p.memoryBytes)),
        h('dt', {}, 'Accuracy'), h('dd', {}, formatNumber(p.accuracy, 2)),
        h('dt', {}, 'Branches'), h('dd', {}, String(p.branches.length))));
      announce(`Plan: ${p.engine}, about ${formatNumber(p.seconds, 2)} s`);
    }, (err: unknown) => { replace(planOut); serviceIssues(err); }).finally(() => { planButton.disabled = false; });
  });

  const form = h('form', { class: 'submit-form', novalidate: true },
    h('div', { class: 'submit-grid' },
      h('div', { class: 'editor-col' },
        h('label', { for: 'spec-input' }, 'Sweep spec (JSON)'),
        h('p', { id: 'spec-help', class: 'hint' }, 'Paste a spec, load a file or start from an example. It is checked as you type.'),
        editor,
        h('div', { class: 'editor-tools' },
          h('span', {}, h('label', { for: 'spec-file' }, 'Load a JSON file'), ' ', file),
          h('span', {}, h('label', { for: 'spec-example' }, 'Start from an example'), ' ', example))),
      h('div', { class: 'issues-col', role: 'region', 'aria-labelledby': 'checks-heading' },
        h('h2', { id: 'checks-heading' }, 'Checks'),
        h('div', { 'aria-live': 'polite' }, summary),
        list,
        h('p', {}, fresh, ' ',
          h('label', { for: 'spec-fresh' }, 'Run again even if an identical sweep exists')),
        h('div', { class: 'form-buttons' }, planButton, submitButton),
        planOut)));
  form.addEventListener('submit', (ev) => {
    ev.preventDefault();
    const spec = check();
    if (spec === undefined) { announce(summary.textContent ?? ''); list.querySelector<HTMLButtonElement>('button')?.focus(); return; }
    submitButton.disabled = true;
    apiJson<{ id: string; deduplicated: boolean }>('POST', `/v1/sweeps${fresh.checked ? '?fresh=true' : ''}`, spec).then((r) => {
      announce(r.deduplicated ? 'An identical sweep exists: showing it' : 'Sweep submitted');
      onSubmitted(r.id);
    }, serviceIssues).finally(() => { submitButton.disabled = false; });
  });
  check();
  const el = h('section', { class: 'panel', 'aria-labelledby': 'submit-heading' },
    h('h1', { id: 'submit-heading', tabindex: '-1' }, 'New sweep'), form);
  return { el, stop: () => { if (timer) clearTimeout(timer); } };
}
