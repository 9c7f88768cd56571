import type autocannon from 'autocannon';

/** What a scenario's setup may use: the API it runs against and a signed-in cookie for any demo user. */
export interface BenchContext {
  baseUrl: string;
  /** the session cookie of a demo user (password of the demo seed) */
  signIn(email: string): Promise<string>;
  /** GET as that cookie, parsed JSON; throws on a non-2xx answer */
  getJson<T>(path: string, cookie?: string): Promise<T>;
}

/**
 * One benchmark scenario: a file in bench/scenarios/ whose default export is this. The runner starts the API with
 * the demo seed and rate limits off, calls `setup`, drives the requests with autocannon for `durationSeconds`
 * (20 by default), prints p50, p99, requests/s and non-2xx counts, and judges the p99 against `target`.
 */
export interface Scenario {
  description: string;
  connections: number;
  /** requests per second over all connections; unset: as fast as the API answers */
  overallRate?: number;
  durationSeconds?: number;
  target?: { p99Ms: number };
  setup(ctx: BenchContext): Promise<{ requests: autocannon.Request[]; headers?: Record<string, string> }>;
}

export const defineScenario = (s: Scenario) => s;
