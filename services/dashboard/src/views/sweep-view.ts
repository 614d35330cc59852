/**
 * One sweep: status, progress and timings; the figures (time series per observable, one line
 * per β; thermodynamics against β), drawn live as points stream in and replaced by the final
 * result; the series cross-check over them; the engine's diagnostics; the plan. Downloads of
 * the result (JSON, CSV) go through fetch so the token stays in a header.
 */
import { CHECK_UNAVAILABLE, usableCheck, type CheckReportBody } from '../../../plot/check-report-body.js';
import { buildFigures } from '../../../plot/figure-model.js';
import { formatNumber } from '../../../plot/format-number.js';
import { ApiError, apiFetch, apiJson } from '../api.js';
import { age, announce, h, replace } from '../dom.js';
import { followEvents } from '../event-stream.js';
import { download } from '../export-files.js';
import { FigurePanel } from '../figure-panel.js';
import { LiveSweep } from '../live-sweep.js';
import { isFinished, type ResultDocument, type SweepStatusName, type SweepStatusReport } from '../types.js';
import { diagnosticsTable } from './diagnostics-table.js';
import { statusBadge } from './status-badge.js';

/** Redraw at most this often while points stream in, ms. */
const REDRAW_MS = 300;
/** Polls of a cross-check that is still being computed. */
const CHECK_POLLS = 20;

type CheckState = { kind: 'none'; note: string } | { kind: 'pending' } | { kind: 'ready'; report: CheckReportBody };

/** The sweep view; returns its element and a stop function (closes the stream). */
export function sweepView(id: string): { el: HTMLElement; stop: () => void } {
  const abort = new AbortController();
  const panels = new Map<string, FigurePanel>();
  let live: LiveSweep | null = null;
  let status: SweepStatusReport | null = null;
  let check: CheckState = { kind: 'pending' };
  let redrawTimer: ReturnType<typeof setTimeout> | null = null;
  let statusTimer: ReturnType<typeof setTimeout> | null = null;

  const heading = h('h1', { id: 'sweep-heading', tabindex: '-1' }, 'Sweep');
  const badgeBox = h('span', { class: 'badge-box' });
  const facts = h('dl', { class: 'facts facts-inline' });
  const progress = h('progress', { id: 'sweep-progress', max: '1', value: '0' }) as HTMLProgressElement;
  const progressText = h('span', { id: 'sweep-progress-text', class: 'progress-text' });
  const liveLine = h('p', { class: 'live-line', role: 'status' });
  const errorBox = h('div', { class: 'sweep-error' });
  const cancelButton = h('button', { type: 'button', class: 'danger cancel-button', hidden: true }, 'Cancel sweep');
  const jsonButton = h('button', { type: 'button', class: 'download-json', disabled: true }, 'Result (JSON)');
  const csvButton = h('button', { type: 'button', class: 'download-csv', disabled: true }, 'Result (CSV)');
  const seriesGrid = h('div', { class: 'fig-grid fig-grid-series' });
  const thermoGrid = h('div', { class: 'fig-grid fig-grid-thermo' }, h('p', { class: 'empty' }, 'Waiting for the first β…'));
  const checkBox = h('div', { class: 'check-box', 'aria-live': 'polite' }, h('p', {}, 'Asking for the series cross-check…'));
  const diagBox = h('div', { class: 'diag-box' });
  const planBox = h('div', { class: 'plan-box' });

  const section = (idAttr: string, title: string, ...children: Node[]) =>
    h('section', { class: 'panel sub-panel', id: idAttr, 'aria-labelledby': `${idAttr}-h` }, h('h2', { id: `${idAttr}-h` }, title), ...children);

  const el = h('article', { class: 'sweep', 'aria-labelledby': 'sweep-heading', 'data-sweep': id },
    h('div', { class: 'panel sweep-head' },
      h('p', { class: 'crumbs' }, h('a', { href: '#/' }, '← Your sweeps')),
      h('div', { class: 'title-row' }, heading, badgeBox),
      facts,
      h('div', { class: 'progress-row' }, h('label', { for: 'sweep-progress' }, 'Progress'), progress, progressText),
      liveLine,
      errorBox,
      h('div', { class: 'toolbar' }, jsonButton, csvButton, cancelButton),
      h('nav', { class: 'jump', 'aria-label': 'Parts of this sweep' },
        h('a', { href: '#' + 'series-part', 'data-jump': 'series-part' }, 'Time series'), ' · ',
        h('a', { href: '#' + 'thermo-part', 'data-jump': 'thermo-part' }, 'Thermodynamics'), ' · ',
        h('a', { href: '#' + 'check-part', 'data-jump': 'check-part' }, 'Series cross-check'), ' · ',
        h('a', { href: '#' + 'diag-part', 'data-jump': 'diag-part' }, 'Diagnostics'), ' · ',
        h('a', { href: '#' + 'plan-part', 'data-jump': 'plan-part' }, 'Plan'))),
    section('series-part', 'Time series after the quench', seriesGrid),
    section('thermo-part', 'Thermodynamics against β', thermoGrid),
    section('check-part', 'Series cross-check', checkBox),
    section('diag-part', 'Engine diagnostics', diagBox),
    section('plan-part', 'Plan', planBox),
  );
  // In-page links must not change the route (the hash holds it): move focus instead.
  el.addEventListener('click', (ev) => {
    const a = (ev.target as Element).closest<HTMLAnchorElement>('a[data-jump]');
    if (!a) return;
    ev.preventDefault();
    const target = document.getElementById(a.dataset.jump!)?.querySelector<HTMLElement>('h2');
    if (target) { target.tabIndex = -1; target.focus(); target.scrollIntoView({ block: 'start' }); }
  });

  const checkNote = () => (check.kind === 'pending' ? 'series cross-check: being computed…' : check.kind === 'none' ? check.note : '');

  const drawFigures = () => {
    redrawTimer = null;
    if (!live) return;
    const figures = buildFigures(live.data, {
      check: check.kind === 'ready' && live.final ? check.report : null,
      checkUnavailableNote: live.final ? checkNote() : 'series cross-check: after the sweep has finished',
    });
    const seen = new Set<string>();
    for (const fig of figures) {
      seen.add(fig.id);
      const panel = panels.get(fig.id);
      if (panel) { panel.update(fig); continue; }
      const created = new FigurePanel(fig, id);
      panels.set(fig.id, created);
      const grid = fig.kind === 'series' ? seriesGrid : thermoGrid;
      if (fig.kind === 'thermo' && grid.querySelector('.empty')) grid.replaceChildren();
      grid.append(created.el);
    }
    for (const [key, panel] of panels) if (!seen.has(key)) { panel.destroy(); panel.el.remove(); panels.delete(key); }
    if (status) replace(diagBox, diagnosticsTable(live.diagnostics, live.data.betas, status.plan.accuracy));
    // Where the figures come from now: the event stream, or the final result document.
    el.dataset.source = live.final ? 'result' : 'live';
    showProgress();
  };
  /** Draws what the stream delivered now rather than after the redraw delay. */
  const flushDraw = () => { if (redrawTimer) { clearTimeout(redrawTimer); drawFigures(); } };
  const scheduleDraw = () => { if (!redrawTimer) redrawTimer = setTimeout(drawFigures, REDRAW_MS); };

  const showProgress = () => {
    if (!status) return;
    const total = status.pointsTotal || 1;
    const done = Math.max(status.pointsDone, live?.points ?? 0, status.status === 'succeeded' ? total : 0);
    progress.value = Math.min(1, done / total);
    progress.setAttribute('aria-valuetext', `${Math.round((100 * done) / total)} % (${done} of ${status.pointsTotal} points)`);
    progressText.textContent = `${done} of ${status.pointsTotal} points`;
  };

  const showStatus = (s: SweepStatusReport) => {
    const before = status?.status;
    status = s;
    heading.textContent = s.label || s.id;
    document.title = `${s.label || s.id} · betasweep`;
    replace(badgeBox, statusBadge(s.status));
    const t = s.timings;
    replace(facts,
      h('dt', {}, 'Id'), h('dd', {}, h('code', {}, s.id)),
      h('dt', {}, 'Engine'), h('dd', { class: 'engine' }, s.engine),
      h('dt', {}, 'Submitted'), h('dd', {}, h('time', { datetime: t.createdAt, title: new Date(t.createdAt).toLocaleString() }, age(t.createdAt))),
      h('dt', {}, 'Run time'), h('dd', {}, t.runSeconds === null ? 'not started' : `${formatNumber(t.runSeconds, 3)} s`),
      h('dt', {}, 'Grid'), h('dd', {}, `${s.betas.length} β × ${s.times.length} times, ${s.series.length} series`));
    cancelButton.hidden = isFinished(s.status);
    jsonButton.disabled = csvButton.disabled = s.status !== 'succeeded';
    replace(errorBox, s.error ? h('p', { class: 'field-error', role: 'alert' }, `The sweep ${s.status}: ${s.error}`) : null);
    replace(planBox, h('dl', { class: 'facts' },
      h('dt', {}, 'Engine'), h('dd', {}, s.plan.engine),
      h('dt', {}, 'Why'), h('dd', {}, s.plan.reason),
      h('dt', {}, 'Accuracy'), h('dd', {}, formatNumber(s.plan.accuracy, 2)),
      h('dt', {}, 'Estimated time (one core)'), h('dd', {}, `${formatNumber(s.plan.seconds, 2)} s`),
      h('dt', {}, 'Branches'), h('dd', {}, String(s.plan.branches.length)),
      h('dt', {}, 'Sites'), h('dd', {}, String(s.plan.sites))));
    if (before && before !== s.status) announce(`Sweep ${s.status}`);
    showProgress();
  };

  const refreshStatus = async () => {
    statusTimer = null;
    try {
      showStatus(await apiJson<SweepStatusReport>('GET', `/v1/sweeps/${id}`));
    } catch { /* the stream goes on; the next event retries */ }
  };
  const scheduleStatus = () => { if (!statusTimer) statusTimer = setTimeout(() => void refreshStatus(), 1000); };

  const showCheck = () => {
    if (check.kind === 'pending') { replace(checkBox, h('p', {}, 'The series cross-check is being computed…')); return; }
    if (check.kind === 'none') { replace(checkBox, h('p', { class: 'check-unavailable' }, check.note)); return; }
    const r = check.report;
    const s = r.series;
    replace(checkBox,
      r.flagged
        ? h('p', { class: 'warn', role: 'note' }, `⚠ ${r.summary.disagree} value${r.summary.disagree === 1 ? ' disagrees' : 's disagree'} with the series inside its trust window (crosses on the figures).`)
        : h('p', { class: 'ok' }, '✓ No disagreement inside the series’ trust window.'),
      h('dl', { class: 'facts' },
        h('dt', {}, 'Agree'), h('dd', {}, String(r.summary.agree)),
        h('dt', {}, 'Disagree'), h('dd', {}, String(r.summary.disagree)),
        h('dt', {}, 'Outside the window'), h('dd', {}, String(r.summary.outsideWindow)),
        s ? h('dt', {}, 'Series') : null,
        s ? h('dd', {}, [s.kind, s.method, s.thermoOrder !== undefined ? `order ${s.thermoOrder} in β` : '', s.quenchOrder !== undefined ? `order ${s.quenchOrder} in (t, β)` : ''].filter(Boolean).join(', ')) : null),
      h('p', { class: 'hint' }, 'On each figure the dashed lines are the series values, drawn only where the series can judge; the shaded band is the window where it can.'));
  };

  const loadCheck = async () => {
    for (let poll = 0; poll < CHECK_POLLS && !abort.signal.aborted; poll++) {
      let res: Response;
      try {
        res = await apiFetch(`/v1/sweeps/${id}/check`, { signal: abort.signal });
      } catch (err) {
        const e = err as ApiError;
        if (abort.signal.aborted) return;
        if (e.status === 404 && e.code === 'BSW_ERR_ROUTE_NOT_FOUND') check = { kind: 'none', note: `${CHECK_UNAVAILABLE}: this service has no cross-check route` };
        else if (e.status === 409 && /expired/.test(e.message)) check = { kind: 'none', note: `${CHECK_UNAVAILABLE}: the report has expired` };
        else if (e.status === 409 || e.status === 503) { await new Promise((r) => setTimeout(r, 3000)); continue; }
        else check = { kind: 'none', note: `${CHECK_UNAVAILABLE}: ${e.message}` };
        break;
      }
      if (res.status === 202) { await new Promise((r) => setTimeout(r, 3000)); continue; }
      const usable = usableCheck(await res.json().catch(() => null), 'the service');
      check = usable.check ? { kind: 'ready', report: usable.check } : { kind: 'none', note: usable.note };
      break;
    }
    if (check.kind === 'pending') check = { kind: 'none', note: `${CHECK_UNAVAILABLE}: still being computed; reload later` };
    showCheck();
    drawFigures();
  };

  const loadResult = async () => {
    const result = await apiJson<ResultDocument>('GET', `/v1/sweeps/${id}/result`);
    live?.useResult(result);
    drawFigures();
    liveLine.textContent = 'Finished: showing the final result.';
    void loadCheck();
  };

  const start = async () => {
    let s: SweepStatusReport;
    try {
      s = await apiJson<SweepStatusReport>('GET', `/v1/sweeps/${id}`);
    } catch (err) {
      replace(el, h('div', { class: 'panel' }, h('h1', { tabindex: '-1' }, 'Sweep not available'),
        h('p', { class: 'field-error', role: 'alert' }, (err as Error).message), h('p', {}, h('a', { href: '#/' }, '← Your sweeps'))));
      return;
    }
    live = new LiveSweep(s);
    showStatus(s);
    drawFigures();
    if (isFinished(s.status)) {
      if (s.status === 'succeeded') await loadResult();
      else { liveLine.textContent = `The sweep ${s.status}: showing the points it stored.`; await followEvents(id, onEvent, { signal: abort.signal }).catch(() => undefined); drawFigures(); check = { kind: 'none', note: `${CHECK_UNAVAILABLE}: the sweep did not succeed` }; showCheck(); }
      return;
    }
    liveLine.textContent = 'Live: receiving points as they are computed.';
    try {
      await followEvents(id, onEvent, { signal: abort.signal });
    } catch (err) {
      liveLine.textContent = `The live stream stopped (${(err as Error).message}); reload to resume.`;
    }
    if (abort.signal.aborted) return;
    flushDraw();
    await refreshStatus();
    const final = status as SweepStatusReport | null;
    if (final?.status === 'succeeded' && !live.final) await loadResult();
    else if (final && isFinished(final.status) && final.status !== 'succeeded') {
      drawFigures();
      check = { kind: 'none', note: `${CHECK_UNAVAILABLE}: the sweep did not succeed` };
      showCheck();
    }
  };

  const onEvent = (ev: { type: string; data: string }) => {
    if (!live) return;
    if (ev.type === 'status') {
      flushDraw();
      let data: { status?: SweepStatusName } = {};
      try { data = JSON.parse(ev.data) as typeof data; } catch { /* ignore */ }
      if (status && data.status) showStatus({ ...status, status: data.status });
      void refreshStatus();
      return;
    }
    if (ev.type === 'branch') { scheduleStatus(); return; }
    if (live.apply(ev.type, ev.data) || ev.type === 'diagnostics') scheduleDraw();
  };

  cancelButton.addEventListener('click', () => {
    cancelButton.disabled = true;
    apiJson('POST', `/v1/sweeps/${id}/cancel`).then(() => { announce('Cancel requested'); void refreshStatus(); },
      (err: unknown) => announce(`Could not cancel: ${(err as Error).message}`)).finally(() => { cancelButton.disabled = false; });
  });
  const saveFrom = (path: string, name: string, type: string) => {
    apiFetch(path).then(async (res) => download(new Blob([await res.text()], { type }), name),
      (err: unknown) => announce(`Could not download: ${(err as Error).message}`));
  };
  jsonButton.addEventListener('click', () => saveFrom(`/v1/sweeps/${id}/result`, `${id}.json`, 'application/json'));
  csvButton.addEventListener('click', () => saveFrom(`/v1/sweeps/${id}/result.csv`, `${id}.csv`, 'text/csv'));

  void start();
  return {
    el,
    stop: () => {
      abort.abort();
      if (redrawTimer) clearTimeout(redrawTimer);
      if (statusTimer) clearTimeout(statusTimer);
      for (const p of panels.values()) p.destroy();
    },
  };
}
