/**
 * Prometheus text exposition of the API's own counters (requests, latency) plus gauges read
 * from Redis at scrape time (queue depth, branches running, points written).
 */

/** Upper bounds of the request-latency histogram, seconds. */
const LATENCY_BUCKETS = [0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5];

interface Histogram {
  counts: number[];
  sum: number;
  count: number;
}

/** Escapes a Prometheus label value. */
const esc = (s: string) => s.replace(/\\/g, '\\\\').replace(/"/g, '\\"').replace(/\n/g, '\\n');

export class Metrics {
  private readonly requests = new Map<string, number>();
  private readonly latency = new Map<string, Histogram>();
  private readonly started = Date.now();

  /** Records one finished request. */
  observe(method: string, route: string, status: number, seconds: number): void {
    const key = `method="${esc(method)}",route="${esc(route)}",status="${status}"`;
    this.requests.set(key, (this.requests.get(key) ?? 0) + 1);
    const hkey = `method="${esc(method)}",route="${esc(route)}"`;
    let h = this.latency.get(hkey);
    if (!h) {
      h = { counts: LATENCY_BUCKETS.map(() => 0), sum: 0, count: 0 };
      this.latency.set(hkey, h);
    }
    for (let i = 0; i < LATENCY_BUCKETS.length; i++) if (seconds <= LATENCY_BUCKETS[i]) h.counts[i]++;
    h.sum += seconds;
    h.count++;
  }

  /** The exposition text, with the given gauges appended. */
  render(gauges: Array<{ name: string; help: string; type: 'gauge' | 'counter'; value: number; labels?: Record<string, string> }>): string {
    const out: string[] = [];
    out.push('# HELP betasweep_http_requests_total HTTP requests by method, route and status.');
    out.push('# TYPE betasweep_http_requests_total counter');
    for (const [k, v] of this.requests) out.push(`betasweep_http_requests_total{${k}} ${v}`);
    out.push('# HELP betasweep_http_request_duration_seconds HTTP request latency.');
    out.push('# TYPE betasweep_http_request_duration_seconds histogram');
    for (const [k, h] of this.latency) {
      LATENCY_BUCKETS.forEach((le, i) => out.push(`betasweep_http_request_duration_seconds_bucket{${k},le="${le}"} ${h.counts[i]}`));
      out.push(`betasweep_http_request_duration_seconds_bucket{${k},le="+Inf"} ${h.count}`);
      out.push(`betasweep_http_request_duration_seconds_sum{${k}} ${h.sum}`);
      out.push(`betasweep_http_request_duration_seconds_count{${k}} ${h.count}`);
    }
    out.push('# HELP betasweep_uptime_seconds Seconds since this API process started.');
    out.push('# TYPE betasweep_uptime_seconds gauge');
    out.push(`betasweep_uptime_seconds ${(Date.now() - this.started) / 1000}`);
    const seen = new Set<string>();
    for (const g of gauges) {
      if (!seen.has(g.name)) {
        out.push(`# HELP ${g.name} ${g.help}`);
        out.push(`# TYPE ${g.name} ${g.type}`);
        seen.add(g.name);
      }
      const labels = g.labels ? `{${Object.entries(g.labels).map(([k, v]) => `${k}="${esc(v)}"`).join(',')}}` : '';
      out.push(`${g.name}${labels} ${g.value}`);
    }
    return out.join('\n') + '\n';
  }
}
