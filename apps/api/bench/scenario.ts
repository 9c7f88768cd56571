import type autocannon from 'autocannon';

/** What a scenario's setup may use: the API it runs against and a signed-in cookie for any demo user. */
export interface BenchContext {
  baseUrl: string;
  /** the session cookie of a demo user (password of the demo seed) */
  signIn(email: string): Promise<string>;
  /** GET as that cookie, parsed JSON; throws on a non-2xx answer */
  getJson<T>(path: string, cookie?: string): Promise<T>;
  /** POST JSON as that cookie; the status and parsed body, whatever the status */
  postJson<T>(path: string, body: unknown, cookie?: string): Promise<{ status: number; body: T }>;
}

/** One measured run of a scenario: its own requests, and what to do before it starts. */
export interface BenchPart {
  label: string;
  requests: autocannon.Request[];
  /** run before this part is measured (start background work, for example) */
  before?: () => Promise<void>;
}

/**
 * One benchmark scenario: a file in bench/scenarios/ whose default export is this. The runner starts the API with
 * the demo seed (and `scale` more projects when set) and rate limits off, calls `setup`, drives each part's
 * requests with autocannon for `durationSeconds` (20 by default), prints p50, p99, requests/s and non-2xx counts
 * per part with the load average, and judges each part's p99 against `target`.
 */
export interface Scenario {
  description: string;
  connections: number;
  /** requests per second over all connections; unset: as fast as the API answers */
  overallRate?: number;
  durationSeconds?: number;
  target?: { p99Ms: number };
  /** `pnpm db:seed --scale N` before the API starts */
  scale?: number;
  setup(ctx: BenchContext): Promise<
    ({ requests: autocannon.Request[]; parts?: undefined } | { parts: BenchPart[]; requests?: undefined }) & {
      headers?: Record<string, string>;
      /** parts not judged against the target (a baseline) by label */
      unjudged?: string[];
      /** after the last part: stop background work; lines to print */
      after?: () => Promise<string[]>;
    }
  >;
}

export const defineScenario = (s: Scenario) => s;
