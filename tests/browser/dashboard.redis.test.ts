/**
 * The dashboard in a real browser (Debian's Chromium driven by playwright-core; never a
 * downloaded browser) against the real stack: the API serving the freshly built page, a
 * BullMQ worker with sandboxed branches, the private redis-server of the integration project.
 * A small sweep is submitted from the page and followed to the end; the figure must have one
 * line per β (counted by uPlot's series and by the colours on the canvas), a legend that
 * switches lines from the keyboard, axis labels, and SVG/PNG/CSV exports; `betasweep plot ID`
 * must draw the same lines. Screenshots go to test-artifacts/ (1280×800 and 390 px wide).
 *
 * Needs /usr/bin/chromium (`apt-get install chromium`). Without it the suite is skipped on a
 * development machine, and fails under CI (CI set), where .ci/run installs it.
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseHTML } from 'linkedom';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import type { SweepResult } from '../../shared-types/src/index.js';
import { buildDashboard } from '../../services/dashboard/build-dashboard.js';
import { parseHexColour, temperatureColours } from '../../services/plot/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { CLI, REPO_ROOT, makeToken, startTestApi, testRedisUrl, uniquePrefix } from '../service/support/harness.js';

const CHROMIUM = '/usr/bin/chromium';
const ARTIFACTS = join(REPO_ROOT, 'test-artifacts');
const BETAS = [0.5, 1, 2];
const TIMES = 11;
/** The figure the checks look at. */
const FIG = 'series:X:avg';
/** The sweep the page submits: 4 sites, 3 β, 11 times (seconds of work for the exact engine). */
const SPEC = {
  label: 'browser test: Ising chain quench',
  lattice: { kind: 'chain', length: 4, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: BETAS,
  times: { start: 0, stop: 2, count: TIMES },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
  engine: 'exact',
};

/**
 * Pixels of a figure's canvas within `tolerance` (per channel) of each colour, among pixels
 * whose opacity is in `alpha` (the canvas is transparent; lines are opaque, fills are not).
 */
async function colourCounts(page: Page, figure: string, colours: string[], tolerance = 24, alpha: [number, number] = [200, 255]): Promise<number[]> {
  return page.evaluate(({ figure, rgb, tolerance, alpha }) => {
    const canvas = document.querySelector<HTMLCanvasElement>(`[data-figure="${figure}"] canvas`);
    if (!canvas) return rgb.map(() => -1);
    const ctx = canvas.getContext('2d')!;
    const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
    const counts = rgb.map(() => 0);
    for (let i = 0; i < data.length; i += 4) {
      if (data[i + 3] < alpha[0] || data[i + 3] > alpha[1]) continue;
      rgb.forEach((c, k) => {
        if (Math.abs(data[i] - c[0]) <= tolerance && Math.abs(data[i + 1] - c[1]) <= tolerance && Math.abs(data[i + 2] - c[2]) <= tolerance) counts[k]++;
      });
    }
    return counts;
  }, { figure, rgb: colours.map(parseHexColour), tolerance, alpha });
}

/** expect.poll with room for a loaded machine (vitest's default gives up after 1 s). */
const poll = <T>(fn: () => T | Promise<T>) => expect.poll(fn, { timeout: 20_000, interval: 100 });

function runCli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [CLI, ...args], { cwd: REPO_ROOT, env: { PATH: process.env.PATH, HOME: process.env.HOME }, timeout: 120_000 },
      (err, stdout, stderr) => resolve({ code: err ? (typeof err.code === 'number' ? err.code : 1) : 0, stdout, stderr }));
  });
}

/** The `d` of every β line of one figure in an SVG document, and its legend and axis texts. */
function svgFacts(svg: string, figure: string) {
  const { document } = parseHTML(`<!doctype html><html><body>${svg}</body></html>`);
  const fig = document.querySelector(`svg[data-figure="${figure}"]`);
  if (!fig) return null;
  return {
    lines: [...fig.querySelectorAll('g.bsw-beta-lines path')].map((p) => ({ d: p.getAttribute('d'), label: p.getAttribute('aria-label') })),
    legend: [...fig.querySelectorAll('g.bsw-legend-entry')].map((g) => g.textContent),
    xLabel: fig.querySelector('g[aria-label="x-axis label"]')?.textContent ?? '',
    yLabel: fig.querySelector('g[aria-label="y-axis label"]')?.textContent ?? '',
  };
}

const NO_BROWSER = !existsSync(CHROMIUM) && !process.env.CI;
if (NO_BROWSER) console.warn(`dashboard browser test skipped: ${CHROMIUM} is missing (apt-get install chromium)`);

describe.skipIf(NO_BROWSER)('dashboard in Chromium', () => {
  const prefix = uniquePrefix('dash');
  const profile = mkdtempSync(join(tmpdir(), 'bsw-chromium-'));
  const downloads = mkdtempSync(join(tmpdir(), 'bsw-dl-'));
  let api: Api;
  let worker: BranchWorkerHandle;
  let context: BrowserContext;
  let page: Page;
  let server: string;
  let token: string;
  let sweepId = '';
  let pageSvg = '';
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    // Always build: the test must exercise the current sources, not a stale dist/.
    await buildDashboard();
    api = await startTestApi({ prefix });
    server = await api.app.listen({ host: '127.0.0.1', port: 0 });
    token = await makeToken(testRedisUrl(), prefix, 'browser');
    context = await chromium.launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
        '--disable-component-update', '--disable-sync'],
      viewport: { width: 1280, height: 800 },
      acceptDownloads: true,
      downloadsPath: downloads,
    });
    page = context.pages()[0] ?? await context.newPage();
    page.on('pageerror', (err) => pageErrors.push(err.message));
    // Failed requests are expected here (a wrong token on purpose; a cross-check route that may
    // not exist yet) and are handled by the page; anything else logged as an error is not.
    page.on('console', (msg) => { if (msg.type() === 'error' && !msg.text().startsWith('Failed to load resource')) pageErrors.push(msg.text()); });
  }, 180_000);

  afterAll(async () => {
    await context?.close();
    await worker?.close(1000);
    await api?.close();
    rmSync(profile, { recursive: true, force: true });
    rmSync(downloads, { recursive: true, force: true });
  });

  describe('when a physicist opens the page', () => {
    it('should serve the page with its own assets and a content-security policy, and ask for a token', async () => {
      const res = await page.goto(`${server}/`);
      expect(res?.status()).toBe(200);
      expect(res?.headers()['content-security-policy']).toContain("default-src 'self'");
      await poll(() => page.locator('#token-input').count()).toBe(1);
      // Keyboard: the first Tab reaches the skip link.
      await page.keyboard.press('Tab');
      expect(await page.evaluate(() => document.activeElement?.className)).toBe('skip-link');
    });

    it('should refuse a wrong token beside the field, then accept the right one', async () => {
      await page.fill('#token-input', 'bsw_wrong_token');
      await page.press('#token-input', 'Enter');
      await poll(() => page.locator('#token-error').innerText()).toMatch(/did not accept/);
      expect(await page.getAttribute('#token-input', 'aria-invalid')).toBe('true');
      await page.fill('#token-input', token);
      await page.press('#token-input', 'Enter');
      await poll(() => page.locator('#list-heading').count()).toBe(1);
      expect(await page.evaluate(() => sessionStorage.getItem('betasweep.token'))).toBe(token);
    });
  });

  describe('when a spec is submitted from the page', () => {
    it('should show schema problems beside the editor before anything is sent', async () => {
      await page.click('nav.main-nav a[data-route="new"]');
      await page.waitForSelector('#spec-input');
      // Loaded from a file, as a physicist would upload one.
      await page.setInputFiles('#spec-file', { name: 'bad-spec.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify({ ...SPEC, betas: [0.5, -1] }, null, 2)) });
      await poll(() => page.inputValue('#spec-input')).toContain('-1');
      const issue = page.locator('#spec-issues li.issue').first();
      await poll(() => issue.innerText()).toMatch(/betas\[1\]/);
      expect(await page.getAttribute('#spec-input', 'aria-invalid')).toBe('true');
      // The issue's button selects the offending value in the editor.
      await issue.locator('button.issue-jump').click();
      const selected = await page.evaluate(() => {
        const t = document.querySelector<HTMLTextAreaElement>('#spec-input')!;
        return t.value.slice(t.selectionStart, t.selectionEnd);
      });
      expect(selected).toBe('-1');
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-submit-issues-1280x800.png') });
    });

    it('should submit a valid spec, follow the sweep live and show it complete', async () => {
      await page.fill('#spec-input', JSON.stringify(SPEC, null, 2));
      await poll(() => page.getAttribute('#spec-input', 'aria-invalid')).toBe('false');
      await page.click('button.plan-button');
      await poll(() => page.locator('.plan-out').innerText()).toMatch(/Engine\s+exact[\s\S]*Points\s+33/);
      await page.check('#spec-fresh');
      await page.click('button.submit-button');
      await page.waitForURL(/#\/sweeps\/sw_[a-z2-7]{16}$/);
      sweepId = /sw_[a-z2-7]{16}/.exec(page.url())![0];
      // No worker yet: the sweep waits in the queue and the page is already following it.
      await poll(() => page.locator('.badge-box .badge').getAttribute('data-status')).toBe('queued');
      await poll(() => page.locator('.live-line').innerText()).toMatch(/Live/);
      await page.waitForSelector(`figure[data-figure="${FIG}"] .chart[data-points="0"]`);
      // Record every state of the figure (points drawn, and whether from the stream or the result).
      await page.evaluate((fig) => {
        const chart = document.querySelector(`figure[data-figure="${fig}"] .chart`)!;
        const article = document.querySelector('article.sweep')!;
        const seen: string[] = [];
        (window as unknown as { figureStates: string[] }).figureStates = seen;
        new MutationObserver(() => seen.push(`${article.getAttribute('data-source')}:${chart.getAttribute('data-points')}`))
          .observe(chart, { attributes: true, attributeFilter: ['data-points'] });
      }, FIG);
      worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix, concurrency: 1 });
      await expect.poll(() => page.locator('.badge-box .badge').getAttribute('data-status'), { timeout: 150_000, interval: 500 }).toBe('succeeded');
      await expect.poll(() => page.locator('.live-line').innerText(), { timeout: 30_000 }).toMatch(/Finished/);
      expect(await page.locator('#sweep-progress-text').innerText()).toBe(`${BETAS.length * TIMES} of ${BETAS.length * TIMES} points`);
      expect(await page.locator('.facts .engine').innerText()).toBe('exact');
      // The figure was drawn from the event stream first, then from the final result.
      const states = await page.evaluate(() => (window as unknown as { figureStates: string[] }).figureStates);
      const streamed = states.filter((st) => st.startsWith('live:')).map((st) => Number(st.slice(5)));
      expect(Math.max(0, ...streamed)).toBeGreaterThan(0);
      expect(states.at(-1)).toBe(`result:${BETAS.length * TIMES}`);
    });
  });

  describe('when the finished sweep is shown', () => {
    it('should draw one line per β in the temperature colours, with a legend and axis labels', async () => {
      const fig = page.locator(`figure[data-figure="${FIG}"]`);
      await poll(() => fig.locator('.chart').getAttribute('data-points')).toBe(String(BETAS.length * TIMES));
      expect(await fig.locator('.chart').getAttribute('data-lines')).toBe(String(BETAS.length));
      expect(await fig.locator('.legend-entry').allInnerTexts()).toEqual(['β = 0.5 (T = 2)', 'β = 1 (T = 1)', 'β = 2 (T = 0.5)']);
      expect(await fig.locator('.axis-label-x').innerText()).toContain('time t');
      expect(await fig.locator('.axis-label-y').innerText()).toContain('⟨X⟩');
      // Screen readers: the figure is named by its caption, the chart describes its lines.
      const capId = await fig.getAttribute('aria-labelledby');
      expect(await page.locator(`[id="${capId}"]`).innerText()).toContain('⟨X⟩');
      expect(await fig.locator('.chart').getAttribute('aria-label')).toMatch(/3 lines, one per β \(0\.5, 1, 2\)/);
      // Each β's colour is really on the canvas, and nothing of a colour no β has.
      const colours = temperatureColours(BETAS);
      const counts = await colourCounts(page, FIG, colours);
      for (const c of counts) expect(c).toBeGreaterThan(40);
      // Thermodynamics: one marker per β, each in its colour.
      const thermo = page.locator('figure[data-figure="thermo:energy"] .legend-entry');
      expect(await thermo.count()).toBe(BETAS.length);
      for (const c of await colourCounts(page, 'thermo:energy', colours)) expect(c).toBeGreaterThan(10);
    });

    it('should switch a β line off and on from the keyboard', async () => {
      const fig = page.locator(`figure[data-figure="${FIG}"]`);
      const first = fig.locator('.legend-entry').first();
      const hot = temperatureColours(BETAS)[0];
      await first.focus();
      await page.keyboard.press('Enter');
      expect(await first.getAttribute('aria-pressed')).toBe('false');
      expect(await fig.locator('.chart').getAttribute('data-lines')).toBe(String(BETAS.length - 1));
      await poll(async () => (await colourCounts(page, FIG, [hot]))[0]).toBeLessThan(5);
      await page.keyboard.press('Space');
      expect(await first.getAttribute('aria-pressed')).toBe('true');
      await poll(async () => (await colourCounts(page, FIG, [hot]))[0]).toBeGreaterThan(40);
    });

    it('should export the figure as SVG with one path per β, a legend and axis labels', async () => {
      // Export once the cross-check has settled (drawn, or reported missing), as `plot ID` will see it.
      await expect.poll(() => page.locator('#check-part').innerText(), { timeout: 90_000 }).not.toMatch(/Asking|being computed/);
      const [dl] = await Promise.all([page.waitForEvent('download'), page.locator(`figure[data-figure="${FIG}"] button.export-svg`).click()]);
      expect(dl.suggestedFilename()).toBe(`${sweepId}-series-X-avg.svg`);
      pageSvg = readFileSync((await dl.path())!, 'utf8');
      const facts = svgFacts(pageSvg, FIG)!;
      expect(facts.lines.map((l) => l.label)).toEqual(['β = 0.5 (T = 2)', 'β = 1 (T = 1)', 'β = 2 (T = 0.5)']);
      for (const l of facts.lines) expect(l.d).toMatch(/^M[\d.]+,[\d.]+(L[\d.]+,[\d.]+){10}$/);
      expect(facts.legend).toEqual(['β = 0.5 (T = 2)', 'β = 1 (T = 1)', 'β = 2 (T = 0.5)']);
      expect(facts.xLabel).toContain('time t');
      expect(facts.yLabel).toContain('⟨X⟩');
    });

    it('should export the figure as PNG and its data as CSV', async () => {
      const fig = page.locator(`figure[data-figure="${FIG}"]`);
      const [png] = await Promise.all([page.waitForEvent('download'), fig.locator('button.export-png').click()]);
      const bytes = readFileSync((await png.path())!);
      expect(bytes.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
      // IHDR width: twice the 760-px figure.
      expect(bytes.readUInt32BE(16)).toBe(1520);
      expect(bytes.length).toBeGreaterThan(20_000);
      const [csv] = await Promise.all([page.waitForEvent('download'), fig.locator('button.export-csv').click()]);
      const lines = readFileSync((await csv.path())!, 'utf8').trim().split('\n');
      expect(lines[0]).toMatch(/^beta,time,"?⟨X⟩, site average"?,error/);
      expect(lines).toHaveLength(1 + BETAS.length * TIMES);
      expect(lines.filter((l) => l.startsWith('2,')).length).toBe(TIMES);
    });

    it('should show the series cross-check, or say it is not available', async () => {
      const res = await fetch(`${server}/v1/sweeps/${sweepId}/check`, { headers: { authorization: `Bearer ${token}` } });
      const body = await res.text();
      const routeMissing = res.status === 404 && body.includes('BSW_ERR_ROUTE_NOT_FOUND');
      const checkPart = page.locator('#check-part');
      if (routeMissing) {
        await expect.poll(() => checkPart.innerText(), { timeout: 30_000 }).toContain('cross-check not available');
        expect(await page.locator(`figure[data-figure="${FIG}"] .fig-note`).innerText()).toContain('cross-check not available');
      } else {
        await expect.poll(() => checkPart.innerText(), { timeout: 90_000 }).toMatch(/Agree|cross-check not available/);
        expect(await page.locator(`figure[data-figure="${FIG}"] .fig-note`).innerText()).toMatch(/series check|cross-check not available/);
      }
      await page.locator('#check-part').screenshot({ path: join(ARTIFACTS, 'dashboard-check-panel-from-service.png') });
      await page.locator(`figure[data-figure="${FIG}"]`).screenshot({ path: join(ARTIFACTS, 'dashboard-figure-check-from-service.png') });
    });

    it('should list the engine diagnostics per β', async () => {
      const rows = page.locator('#diag-part table.diagnostics tbody tr');
      await poll(() => rows.count()).toBe(BETAS.length);
      expect(await rows.first().locator('th').innerText()).toBe('β = 0.5 (T = 2)');
    });

    it('should overlay a cross-check report: dashed series values, trust window, disagreements and a summary', async () => {
      // The report is served by the browser here (a hand-made report of the service's shape),
      // so the overlay is tested whether or not this service has the cross-check route yet.
      const result = await (await fetch(`${server}/v1/sweeps/${sweepId}/result`, { headers: { authorization: `Bearer ${token}` } })).json() as SweepResult;
      const x = result.series.find((s) => s.label === 'X:avg')!;
      const entries: unknown[] = [];
      for (let b = 0; b < BETAS.length; b++) {
        for (let t = 0; t < TIMES; t++) {
          const inside = b === 0 && t <= 4;
          const v = x.values[b][t];
          entries.push({
            betaIndex: b, beta: BETAS[b], timeIndex: t, time: result.times[t], quantity: 'X:avg', engineValue: v, engineError: 1e-10,
            seriesValue: inside ? v + (t === 2 ? 0.05 : 0) : 0, seriesError: inside ? 1e-5 : null,
            verdict: !inside ? 'outside-window' : t === 2 ? 'disagree' : 'agree',
          });
        }
        entries.push({ betaIndex: b, beta: BETAS[b], timeIndex: null, time: null, quantity: 'thermo:energy', engineValue: result.thermo[b].energy,
          seriesValue: result.thermo[b].energy, seriesError: b === 0 ? 1e-6 : null, verdict: b === 0 ? 'agree' : 'outside-window' });
      }
      const report = { format: 'betasweep.check/1', entries, summary: { agree: 5, disagree: 1, outsideWindow: 30 }, flagged: true,
        series: { kind: 'finite', method: 'whole-cluster', thermoOrder: 10, quenchOrder: 6 } };
      await page.route('**/v1/sweeps/*/check', (route) => route.fulfill({ status: 200, contentType: 'application/json', body: JSON.stringify(report) }));
      await page.reload();
      const fig = page.locator(`figure[data-figure="${FIG}"]`);
      await expect.poll(() => fig.locator('.fig-note').innerText(), { timeout: 30_000 }).toBe('series check trusted for t in [0, 0.8]: 4 agree, 1 disagree, 28 outside the window');
      expect(await fig.locator('.legend-extra').allInnerTexts()).toEqual(['series check', 'trust window', 'disagrees with series']);
      expect(await page.locator('#check-part').innerText()).toMatch(/1 value disagree[\s\S]*Agree\s+5[\s\S]*Disagree\s+1/);
      // On the canvas: the shaded window (rgba(143, 163, 184, 0.18)), and the red disagreement cross.
      const [window] = await colourCounts(page, FIG, ['#8fa3b8'], 3, [40, 52]);
      const [cross] = await colourCounts(page, FIG, ['#c0182b']);
      expect(window).toBeGreaterThan(1000);
      expect(cross).toBeGreaterThan(10);
      const [none] = await colourCounts(page, 'series:ZZ:nearest', ['#8fa3b8'], 3, [40, 52]);
      expect(none).toBe(0);
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-sweep-check-overlay-1280x800.png') });
      await page.unroute('**/v1/sweeps/*/check');
    });

    it('should fit 1280×800 and a 390-px-wide screen without sideways scrolling', async () => {
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-sweep-1280x800.png') });
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-sweep-1280-full.png'), fullPage: true });
      await page.setViewportSize({ width: 390, height: 844 });
      const chart = page.locator(`figure[data-figure="${FIG}"] canvas`);
      await poll(async () => (await chart.boundingBox())?.width ?? 9999).toBeLessThanOrEqual(390);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-sweep-narrow-390x844.png') });
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-sweep-narrow-390-full.png'), fullPage: true });
      await page.setViewportSize({ width: 1280, height: 800 });
      expect(pageErrors).toEqual([]);
    });
  });

  describe('when the physicist goes back to the list', () => {
    it('should list the sweep with its status, progress, engine and age', async () => {
      await page.locator('.crumbs a').focus();
      await page.keyboard.press('Enter');
      const row = page.locator(`tr[data-sweep="${sweepId}"]`);
      await poll(() => row.count()).toBe(1);
      expect(await row.locator('a.sweep-link').innerText()).toBe(SPEC.label);
      expect(await row.locator('.badge').getAttribute('data-status')).toBe('succeeded');
      expect(await row.locator('progress').getAttribute('value')).toBe('100');
      expect(await row.locator('.progress-text').innerText()).toBe(`${BETAS.length * TIMES}/${BETAS.length * TIMES}`);
      expect(await row.locator('td').nth(2).innerText()).toBe('exact');
      expect(await row.locator('time').innerText()).toMatch(/^\d+ (s|min) ago$/);
      // The view change moved focus to the new heading (announced by screen readers).
      expect(await page.evaluate(() => document.activeElement?.id)).toBe('list-heading');
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-list-1280x800.png') });
      await page.setViewportSize({ width: 390, height: 844 });
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await page.screenshot({ path: join(ARTIFACTS, 'dashboard-list-narrow-390x844.png') });
      await page.setViewportSize({ width: 1280, height: 800 });
    });
  });

  describe('when `betasweep plot ID` draws the same sweep', () => {
    it('should write an SVG with the same β lines, legend and axis labels as the page', async () => {
      const out = join(downloads, 'cli.svg');
      const check = await fetch(`${server}/v1/sweeps/${sweepId}/check`, { headers: { authorization: `Bearer ${token}` } });
      const routeMissing = check.status === 404 && (await check.text()).includes('BSW_ERR_ROUTE_NOT_FOUND');
      // Same overlay state as the page's export (the page gives up waiting for a check after a minute).
      const noCheck = !pageSvg.includes('bsw-check-lines') && !routeMissing;
      const r = await runCli(['plot', sweepId, '--out', out, '--server', server, '--token', token, ...(noCheck ? ['--no-check'] : [])]);
      expect(r.stderr).toContain('wrote');
      expect(r.code).toBe(0);
      if (routeMissing) expect(r.stderr).toContain('cross-check not available: the server has no cross-check route');
      const cli = svgFacts(readFileSync(out, 'utf8'), FIG)!;
      const fromPage = svgFacts(pageSvg, FIG)!;
      expect(cli.lines).toHaveLength(BETAS.length);
      expect(cli.lines).toEqual(fromPage.lines);
      expect(cli.legend).toEqual(fromPage.legend);
      expect(cli.xLabel).toBe(fromPage.xLabel);
      expect(cli.yLabel).toBe(fromPage.yLabel);
    });
  });
});
