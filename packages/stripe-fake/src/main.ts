import { resolve } from 'node:path';
import { createStripeFake } from './server';

// Reads its own environment: it is a separate service, not part of the API.
const port = Number(process.env.STRIPE_FAKE_PORT ?? 12111);
const host = process.env.STRIPE_FAKE_HOST ?? '127.0.0.1';
const fake = createStripeFake({
  stateFile: resolve(process.env.STRIPE_FAKE_STATE ?? resolve(import.meta.dirname, '../../../data/stripe-fake.json')),
  baseUrl: process.env.STRIPE_FAKE_PUBLIC_URL ?? `http://${host}:${port}`,
  webhookUrl: process.env.STRIPE_FAKE_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/webhooks/stripe',
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_local_benchwright',
  // the shop's name as its Stripe account would show it on the payment page
  businessName: process.env.STRIPE_FAKE_BUSINESS_NAME ?? 'Fernhill Joinery',
});
const server = fake.app.listen(port, host, () => console.log(`Stripe stand-in on http://${host}:${port}`));
const stop = () => {
  fake.stop();
  server.close(() => process.exit(0));
  server.closeAllConnections();
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
