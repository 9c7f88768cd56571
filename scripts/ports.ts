/**
 * The stack's ports, in one place for scripts/stack.ts, the apps' Vite configs (through the environment) and the
 * e2e specs. `STACK_PORT_OFFSET` (default 0) moves every one of them, so two stacks can run side by side on one
 * machine (a test run and a walk through the product, or two worktrees): use a multiple of 100.
 *
 *   STACK_PORT_OFFSET=100 STACK_DATA=data/walk pnpm exec tsx scripts/stack.ts --fresh
 *   STACK_PORT_OFFSET=100 pnpm exec playwright test -c e2e/playwright.config.ts
 */
const raw = process.env.STACK_PORT_OFFSET ?? '0';
const offset = Number(raw);
if (!Number.isInteger(offset) || offset < 0 || offset > 50_000)
  throw new Error(`STACK_PORT_OFFSET must be a whole number from 0 to 50000, not "${raw}"`);

export const ports = {
  api: 3000 + offset,
  portal: 5173 + offset,
  shop: 5174 + offset,
  smtp: 1025 + offset,
  mailWeb: 1080 + offset,
  stripe: 12111 + offset,
} as const;

const at = (port: number) => `http://127.0.0.1:${port}`;
export const urls = {
  api: at(ports.api),
  portal: at(ports.portal),
  shop: at(ports.shop),
  mail: at(ports.mailWeb),
  stripe: at(ports.stripe),
} as const;
