import Stripe from 'stripe';
import type { Env } from '../env';

/** The Stripe SDK pointed at STRIPE_API_BASE (the local stand-in, or https://api.stripe.com). */
export function createStripe(env: Env): Stripe {
  const base = new URL(env.STRIPE_API_BASE);
  return new Stripe(env.STRIPE_SECRET_KEY, {
    host: base.hostname,
    port: Number(base.port || (base.protocol === 'https:' ? 443 : 80)),
    protocol: base.protocol === 'https:' ? 'https' : 'http',
    maxNetworkRetries: 2,
    timeout: 10_000,
  });
}
